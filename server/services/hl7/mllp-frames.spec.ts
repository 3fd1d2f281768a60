import { MllpFrames, mllpFrame } from './mllp-frames';

/**
 * Framing per the HL7 MLLP transport specification, Release 1 (from memory): a block is the
 * start block 0x0B, the HL7 content, then the end block 0x1C followed by a carriage return 0x0D;
 * the content itself never holds 0x0B or 0x1C. Bytes between blocks are not part of any message.
 */
const SB = 0x0b;
const EB = 0x1c;
const CR = 0x0d;
const text = (frames: Buffer[]) => frames.map((f) => f.toString('utf8'));
const bytes = (...parts: (string | number)[]) => Buffer.concat(parts.map((p) => (typeof p === 'number' ? Buffer.from([p]) : Buffer.from(p, 'utf8'))));

describe('MllpFrames', () => {
  it('returns the content between the start block 0x0B and the end block 0x1C 0x0D (MLLP R1 block format)', () => {
    expect(text(new MllpFrames().push(bytes(SB, 'MSH|A', EB, CR)).frames)).toEqual(['MSH|A']);
  });

  it('returns every frame of a chunk, in order (MLLP R1: blocks follow one another on one connection)', () => {
    const chunk = Buffer.concat([mllpFrame('MSH|1'), mllpFrame('MSH|2'), mllpFrame('MSH|3')]);
    expect(text(new MllpFrames().push(chunk).frames)).toEqual(['MSH|1', 'MSH|2', 'MSH|3']);
  });

  it('joins a frame split over several chunks', () => {
    const reader = new MllpFrames();
    expect(reader.push(bytes(SB, 'MSH|par')).frames).toEqual([]);
    expect(reader.push(bytes('t one|')).frames).toEqual([]);
    expect(text(reader.push(bytes('end', EB, CR, SB, 'MSH|next')).frames)).toEqual(['MSH|part one|end']);
    expect(text(reader.push(bytes(EB, CR)).frames)).toEqual(['MSH|next']);
  });

  it('ends a frame whose end block 0x1C and carriage return 0x0D arrive in different chunks (MLLP R1: the end block is the pair)', () => {
    const reader = new MllpFrames();
    expect(reader.push(bytes(SB, 'MSH|split', EB)).frames).toEqual([]);
    expect(text(reader.push(bytes(CR)).frames)).toEqual(['MSH|split']);
  });

  it('keeps a 0x1C at a chunk end as content when no 0x0D follows it', () => {
    const reader = new MllpFrames();
    reader.push(bytes(SB, 'MSH|a', EB));
    expect(text(reader.push(bytes('b', EB, CR)).frames)).toEqual([`MSH|a${String.fromCharCode(EB)}b`]);
  });

  it('drops bytes outside a frame (MLLP R1: only a start block opens a message)', () => {
    expect(text(new MllpFrames().push(bytes('noise\r\n', SB, 'MSH|ok', EB, CR, 'trailing')).frames)).toEqual(['MSH|ok']);
  });

  it('starts again at a second start block inside a frame (the sender gave up on the first)', () => {
    expect(text(new MllpFrames().push(bytes(SB, 'MSH|abandoned', SB, 'MSH|kept', EB, CR)).frames)).toEqual(['MSH|kept']);
  });

  it('keeps UTF-8 characters split between chunks whole', () => {
    const message = Buffer.from('NTE|1||Müller', 'utf8');
    const reader = new MllpFrames();
    const at = message.indexOf(0xc3) + 1; // between the two bytes of ü
    reader.push(Buffer.concat([Buffer.from([SB]), message.subarray(0, at)]));
    expect(text(reader.push(Buffer.concat([message.subarray(at), Buffer.from([EB, CR])])).frames)).toEqual(['NTE|1||Müller']);
  });

  describe('the bound', () => {
    it('reports overflow once an unterminated frame passes the bound, and holds no frame', () => {
      const reader = new MllpFrames(16);
      expect(reader.push(bytes(SB, 'MSH|0123456789')).overflow).toBe(false);
      const over = reader.push(bytes('abcdefgh'));
      expect(over).toEqual({ frames: [], overflow: true });
    });

    it('takes a frame of exactly the bound', () => {
      const content = 'M'.repeat(16);
      expect(new MllpFrames(16).push(mllpFrame(content))).toEqual({ frames: [Buffer.from(content)], overflow: false });
    });

    it('does not count bytes outside frames against the bound', () => {
      const reader = new MllpFrames(16);
      expect(reader.push(Buffer.alloc(1000, 0x41)).overflow).toBe(false);
      expect(text(reader.push(mllpFrame('MSH|small')).frames)).toEqual(['MSH|small']);
    });
  });
});

describe('mllpFrame', () => {
  it('wraps a message in 0x0B … 0x1C 0x0D (MLLP R1 block format)', () => {
    const framed = mllpFrame('MSH|x');
    expect([framed[0], framed[framed.length - 2], framed[framed.length - 1]]).toEqual([SB, EB, CR]);
    expect(framed.subarray(1, -2).toString('utf8')).toBe('MSH|x');
  });
});
