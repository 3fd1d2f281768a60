/**
 * MLLP framing (HL7 MLLP transport specification, Release 1): a message is sent as the start
 * block 0x0B, the message, and the end block 0x1C 0x0D. Bytes outside a frame are dropped.
 *
 * Written here rather than taken from an HL7 package because the framers of node-hl7-server
 * 2.5.0 and simple-hl7 3.3.0 keep no bound on an unterminated frame, and node-hl7-server 2.5.0
 * also hands every earlier message of a connection to the handler again with each new one.
 */
export const START_BLOCK = 0x0b;
export const END_BLOCK = 0x1c;
export const CARRIAGE_RETURN = 0x0d;

/** A frame's content may not pass this many bytes (an unterminated frame is dropped with its connection). */
export const MAX_FRAME_BYTES = 1024 * 1024;

export type FrameResult = { frames: Buffer[]; overflow: boolean };

/**
 * Reads one connection's bytes into whole frames. A start block inside a frame starts it again
 * (the sender gave up on the first); memory held is at most {@link MAX_FRAME_BYTES} plus a chunk.
 *
 * @example
 * const reader = new MllpFrames();
 * reader.push(Buffer.from('\x0bMSH|…\x1c\r')); // { frames: [<MSH|…>], overflow: false }
 */
export class MllpFrames {
  private parts: Buffer[] = [];
  private size = 0;
  private inside = false;
  /** The previous chunk ended in 0x1C inside a frame: a 0x0D next ends the frame. */
  private endPending = false;

  constructor(private readonly maxBytes = MAX_FRAME_BYTES) {}

  push(chunk: Buffer): FrameResult {
    const frames: Buffer[] = [];
    let pos = 0;
    if (this.endPending) {
      this.endPending = false;
      if (chunk.length > 0 && chunk[0] === CARRIAGE_RETURN) {
        frames.push(this.take(0, chunk, 0));
        pos = 1;
      } else this.keep(Buffer.from([END_BLOCK]));
    }
    while (pos < chunk.length) {
      if (!this.inside) {
        const start = chunk.indexOf(START_BLOCK, pos);
        if (start < 0) break;
        this.inside = true;
        pos = start + 1;
        continue;
      }
      const end = chunk.indexOf(END_BLOCK, pos);
      const restart = chunk.indexOf(START_BLOCK, pos);
      if (restart >= 0 && (end < 0 || restart < end)) {
        this.reset();
        this.inside = true;
        pos = restart + 1;
        continue;
      }
      if (end < 0) {
        this.keep(chunk.subarray(pos));
        break;
      }
      if (end === chunk.length - 1) {
        this.keep(chunk.subarray(pos, end));
        this.endPending = true;
        break;
      }
      if (chunk[end + 1] === CARRIAGE_RETURN) {
        frames.push(this.take(pos, chunk, end));
        pos = end + 2;
      } else {
        // a lone 0x1C is content
        this.keep(chunk.subarray(pos, end + 1));
        pos = end + 1;
      }
      if (this.size > this.maxBytes) break;
    }
    return { frames, overflow: this.size > this.maxBytes };
  }

  private keep(bytes: Buffer): void {
    if (bytes.length === 0) return;
    this.parts.push(Buffer.from(bytes));
    this.size += bytes.length;
  }

  private take(from: number, chunk: Buffer, to: number): Buffer {
    const frame = Buffer.concat([...this.parts, chunk.subarray(from, to)]);
    this.reset();
    return frame;
  }

  private reset(): void {
    this.parts = [];
    this.size = 0;
    this.inside = false;
    this.endPending = false;
  }
}

/** Wraps a message in MLLP's start and end blocks. */
export function mllpFrame(message: string): Buffer {
  return Buffer.concat([Buffer.from([START_BLOCK]), Buffer.from(message, 'utf8'), Buffer.from([END_BLOCK, CARRIAGE_RETURN])]);
}
