import { airHoldMinutes } from './air-hold';

/**
 * CDC, Guidelines for Environmental Infection Control in Health-Care Facilities (2003),
 * Appendix B, Table B.1 — minutes for 99 % and 99.9 % removal of airborne contaminants at a
 * given air-change rate (room vacated, perfectly mixed air). The table rounds to the nearest
 * minute; Turnwise rounds up, so ours is ≥ the exact formula and within 1 minute of the table.
 */
const CDC_TABLE_B1: { ach: number; p99: number; p999: number }[] = [
  { ach: 2, p99: 138, p999: 207 },
  { ach: 4, p99: 69, p999: 104 },
  { ach: 6, p99: 46, p999: 69 },
  { ach: 8, p99: 35, p999: 52 },
  { ach: 10, p99: 28, p999: 41 },
  { ach: 12, p99: 23, p999: 35 },
  { ach: 15, p99: 18, p999: 28 },
  { ach: 20, p99: 14, p999: 21 },
  { ach: 50, p99: 6, p999: 8 },
];

describe('airHoldMinutes', () => {
  it('returns 70 minutes for a 6-ACH room at the default 99.9 % removal (CDC Table B.1: 69, rounded up)', () => {
    expect(airHoldMinutes(6)).toBe(70);
  });

  describe('published values: CDC 2003 environmental guideline, Appendix B, Table B.1', () => {
    it.each(CDC_TABLE_B1)('returns at least the exact time and within 1 minute of the table at $ach ACH', ({ ach, p99, p999 }) => {
      for (const [removal, table] of [
        [0.99, p99],
        [0.999, p999],
      ]) {
        const exact = (60 * Math.log(1 / (1 - removal))) / ach;
        const ours = airHoldMinutes(ach, removal);
        expect(ours).toBeGreaterThanOrEqual(exact);
        expect(Math.abs(ours - table)).toBeLessThanOrEqual(1);
        expect(Number.isInteger(ours)).toBe(true);
      }
    });
  });

  describe('edge cases', () => {
    it('returns a whole number even when the exact time is not', () => {
      expect(airHoldMinutes(7)).toBe(Math.ceil((60 * Math.log(1000)) / 7));
    });

    it('returns a shorter hold for more air changes', () => {
      expect(airHoldMinutes(12)).toBeLessThan(airHoldMinutes(6));
    });

    it('returns a fractional-ACH hold (a measured 9.5 ACH)', () => {
      expect(airHoldMinutes(9.5)).toBe(44);
    });
  });

  describe('invalid input', () => {
    it.each([0, -6, NaN, Infinity])('throws a RangeError for %p air changes per hour', (ach) => {
      expect(() => airHoldMinutes(ach)).toThrow(RangeError);
    });

    it.each([0, 1, -0.5, 1.5, NaN])('throws a RangeError for removal %p', (removal) => {
      expect(() => airHoldMinutes(6, removal)).toThrow(RangeError);
    });
  });
});
