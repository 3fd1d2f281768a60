import net from 'node:net';

// MLLP, HL7 MLLP transport specification Release 1: start block 0x0B, end block 0x1C 0x0D.
// Written out here rather than taken from the server, so the tests check the server's framing.
const VT = 0x0b;
const FS = 0x1c;
const CR = 0x0d;

export const frame = (message: string) => Buffer.concat([Buffer.from([VT]), Buffer.from(message, 'utf8'), Buffer.from([FS, CR])]);

/** A plain TCP connection to an MLLP listener: writes bytes, reads framed answers in order. */
export class MllpClient {
  private buffered = Buffer.alloc(0);
  private readonly answers: string[] = [];
  private readonly waiting: ((answer: string) => void)[] = [];
  readonly closed: Promise<void>;

  private constructor(private readonly socket: net.Socket) {
    socket.on('data', (chunk: Buffer) => {
      this.buffered = Buffer.concat([this.buffered, chunk]);
      for (;;) {
        const end = this.buffered.indexOf(Buffer.from([FS, CR]));
        if (end < 0) break;
        if (this.buffered[0] !== VT) throw new Error('an answer must begin with the start block 0x0B');
        const text = this.buffered.subarray(1, end).toString('utf8');
        this.buffered = this.buffered.subarray(end + 2);
        const taker = this.waiting.shift();
        if (taker) taker(text);
        else this.answers.push(text);
      }
    });
    socket.on('error', () => {});
    this.closed = new Promise((resolve) => socket.once('close', () => resolve()));
  }

  static connect(port: number, host = '127.0.0.1'): Promise<MllpClient> {
    return new Promise((resolve, reject) => {
      const socket = net.connect(port, host, () => resolve(new MllpClient(socket)));
      socket.once('error', reject);
    });
  }

  /** The next framed answer. */
  next(): Promise<string> {
    const ready = this.answers.shift();
    return ready !== undefined ? Promise.resolve(ready) : new Promise((resolve) => this.waiting.push(resolve));
  }

  write(bytes: Buffer | string): Promise<void> {
    return new Promise((resolve, reject) => this.socket.write(bytes, (err) => (err ? reject(err) : resolve())));
  }

  /** Sends one message framed and waits for its ACK. */
  async send(message: string): Promise<string> {
    const answer = this.next();
    await this.write(frame(message));
    return answer;
  }

  get destroyed(): boolean {
    return this.socket.destroyed;
  }

  close(): Promise<void> {
    this.socket.destroy();
    return this.closed;
  }
}
