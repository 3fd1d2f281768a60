import { countdown, isAhead, serverSkew } from './countdown';

const at = (time: string) => `2027-03-15T${time}-05:00`;

describe('countdown', () => {
  it('returns minutes and seconds left', () => {
    expect(countdown(at('10:42:00'), Date.parse(at('10:38:40')))).toBe('3:20');
  });

  it('returns hours once an hour or more is left, as for a long air hold', () => {
    expect(countdown(at('11:40:00'), Date.parse(at('10:30:00')))).toBe('1:10:00');
  });

  it('rounds a part second up so 0:00 only shows when the time has come', () => {
    expect(countdown(at('10:42:00'), Date.parse(at('10:41:59')) + 500)).toBe('0:01');
    expect(countdown(at('10:42:00'), Date.parse(at('10:42:00')))).toBe('0:00');
  });

  it('returns 0:00 for a time passed, never a negative count', () => {
    expect(countdown(at('10:42:00'), Date.parse(at('10:50:00')))).toBe('0:00');
  });
});

describe('isAhead', () => {
  it('is true only for a time still to come', () => {
    expect(isAhead(at('10:42:00'), Date.parse(at('10:41:00')))).toBe(true);
    expect(isAhead(at('10:42:00'), Date.parse(at('10:42:00')))).toBe(false);
    expect(isAhead(null, 0)).toBe(false);
  });
});

describe('serverSkew', () => {
  it("returns how far the server's clock is ahead of the browser's", () => {
    expect(serverSkew(at('10:00:05'), Date.parse(at('10:00:00')))).toBe(5000);
    expect(serverSkew(at('09:59:00'), Date.parse(at('10:00:00')))).toBe(-60000);
  });

  it('returns 0 for a server time it cannot read', () => {
    expect(serverSkew('soon', Date.parse(at('10:00:00')))).toBe(0);
  });
});
