import { CellProblem, examRowChecks } from './cell-checks';

const OPTIONS = { date: '2027-03-15', timezone: 'America/Chicago', roomNames: ['MR 1', 'CT 1'] };
const problem = (result: unknown) => (result instanceof CellProblem ? result.message : undefined);

describe('examRowChecks', () => {
  const checks = examRowChecks(OPTIONS);

  it('returns typed values, with the documented defaults for empty optional cells', () => {
    expect(checks.room('mr  1')).toBe('MR 1');
    expect(checks.start('8:30')).toEqual({ start: '2027-03-15T08:30:00-05:00', warning: undefined });
    expect(checks.duration_min('45')).toBe(45);
    expect([checks.coil(''), checks.notes(''), checks.precaution(''), checks.mobility(''), checks.contrast('')]).toEqual([null, null, 'none', 'ambulatory', false]);
    expect([checks.precaution('AIRBORNE'), checks.mobility('Stretcher'), checks.contrast('Y')]).toEqual(['airborne', 'stretcher', true]);
  });

  it('returns a problem worded for the user for each bad cell', () => {
    expect(problem(checks.accession(''))).toBe('accession is required.');
    expect(problem(checks.room('MR 9'))).toBe('Room "MR 9" is not set up. Known rooms: CT 1, MR 1.');
    expect(problem(checks.duration_min('4'))).toBe('duration_min must be whole minutes from 5 to 480; got "4".');
    expect(problem(checks.contrast('maybe'))).toBe('contrast must be yes or no; got "maybe".');
    expect(problem(checks.start('02:30'))).toBeUndefined();
  });

  it('counts a long text in code points, so 64 emoji fit an accession and 65 do not', () => {
    expect(checks.accession('😀'.repeat(64))).toBe('😀'.repeat(64));
    expect(problem(checks.accession('😀'.repeat(65)))).toBe('accession is 65 characters long; the limit is 64.');
  });

  it('returns the same answer for a repeated cell as for its first occurrence (answers are remembered)', () => {
    expect(checks.room('ct 1')).toBe(checks.room('ct 1'));
    expect(problem(checks.start('25:00'))).toBe(problem(checks.start('25:00')));
    expect(problem(checks.start('25:00'))).toContain('not a time of day');
  });
});
