import net, { type AddressInfo, type Socket } from 'node:net';
import { MllpFrames, mllpFrame } from './mllp-frames';

export interface MllpListenerOptions {
  port: number;
  host: string;
  /** Answers one message (its text) with the acknowledgement to send back; must not reject. */
  handle(message: string): Promise<string>;
  logError(err: unknown): void;
  /** A connection silent this long is closed (a sender that hangs holds nothing for long). */
  idleMs?: number;
  maxConnections?: number;
  maxFrameBytes?: number;
}

export interface MllpListener {
  /** Where it listens once bound; null when it could not bind (the error is logged). */
  address(): Promise<AddressInfo | null>;
  close(): Promise<void>;
}

/**
 * A TCP listener for MLLP-framed HL7 messages. Each connection has its own framer and answers
 * its messages one at a time, in order (the sender waits for each ACK, as MLLP's original mode
 * has it); the socket is paused while a message is handled, so a sender that does not wait
 * is held back by TCP rather than by memory. Garbage is dropped, an over-long frame closes its
 * connection, and nothing a connection sends reaches another.
 */
export function startMllpListener(options: MllpListenerOptions): MllpListener {
  const sockets = new Set<Socket>();
  const server = net.createServer((socket) => serve(socket, options, sockets));
  server.maxConnections = options.maxConnections ?? 64;
  const bound = new Promise<AddressInfo | null>((resolve) => {
    server.once('listening', () => resolve(server.address() as AddressInfo));
    server.once('error', (err) => {
      options.logError(new Error(`The HL7 listener could not start on ${options.host}:${options.port}: ${err.message}`));
      resolve(null);
    });
  });
  server.listen(options.port, options.host);
  return {
    address: () => bound,
    async close() {
      const address = await bound;
      for (const socket of sockets) socket.destroy();
      if (address) await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

function serve(socket: Socket, options: MllpListenerOptions, sockets: Set<Socket>): void {
  sockets.add(socket);
  const frames = new MllpFrames(options.maxFrameBytes);
  const waiting: Buffer[] = [];
  let busy = false;
  socket.setNoDelay(true);
  socket.setTimeout(options.idleMs ?? 5 * 60_000, () => socket.destroy());
  socket.on('error', () => socket.destroy());
  socket.on('close', () => sockets.delete(socket));

  const next = async (): Promise<void> => {
    if (busy) return;
    busy = true;
    socket.pause();
    while (waiting.length > 0 && !socket.destroyed) {
      const ack = await options.handle(waiting.shift()!.toString('utf8'));
      if (!socket.destroyed) socket.write(mllpFrame(ack));
    }
    busy = false;
    if (!socket.destroyed) socket.resume();
  };

  socket.on('data', (chunk: Buffer) => {
    const read = frames.push(chunk);
    waiting.push(...read.frames);
    if (read.overflow) {
      // no end block within the limit: not a message this listener can read
      socket.destroy();
      return;
    }
    next().catch((err: unknown) => {
      options.logError(err);
      socket.destroy();
    });
  });
}
