import type { SolverStep } from './model';
import { MR_PROTOCOL, DEFAULT_PRODUCTS } from './demo-protocols';
import { createTurnoverSolver, solveTurnover } from './solver';
import { buildStepSet } from './step-set';
import { scheduleProblems } from './testing/check-schedule';
import { exam, MR_ROOM } from './testing/fixtures';
import { longestWaitFirstMakespan } from './testing/greedy';

const mrSteps = (leaving = exam(), arriving = exam()) =>
  buildStepSet({ leaving, arriving, room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS }).steps;
const s = (key: string, handsOnMinutes: number, waitMinutes: number, needs: SolverStep['needs'] = []): SolverStep => ({
  key,
  label: key,
  handsOnMinutes,
  waitMinutes,
  needs,
});

describe('solveTurnover', () => {
  describe("published check values (the product brief's default MR protocol; products standard 2, sporicidal 4)", () => {
    it('returns 20 minutes for one person, nothing special (the hands-on sum: no waiting shows)', () => {
      expect(solveTurnover({ steps: mrSteps(), staff: 1 }).requiredMinutes).toBe(20);
    });

    it('returns 22 minutes with a coil change', () => {
      expect(solveTurnover({ steps: mrSteps(exam({ coil: 'head' }), exam({ coil: 'knee' })), staff: 1 }).requiredMinutes).toBe(22);
    });

    it('returns 24 minutes after an enteric patient, where "longest wait first" gives 25', () => {
      const steps = mrSteps(exam({ precaution: 'enteric' }));
      expect(longestWaitFirstMakespan(steps, 1)).toBe(25);
      const schedule = solveTurnover({ steps, staff: 1 });
      expect(schedule.requiredMinutes).toBe(24);
      expect(scheduleProblems(steps, 1, schedule)).toEqual([]);
      // Every 24-minute order wipes the bore late (12–16; nothing waits on it but the end) and the
      // counters last (16–17), so both dry by 24 while the set-up steps run.
      expect(schedule.steps.find((x) => x.key === 'bore')).toMatchObject({ start: 12, dryAt: 24 });
      expect(schedule.steps.find((x) => x.key === 'touch')).toMatchObject({ start: 16, dryAt: 21 });
    });

    it('returns 14 minutes for two people, nothing special', () => {
      const schedule = solveTurnover({ steps: mrSteps(), staff: 2 });
      expect(schedule.requiredMinutes).toBe(14);
      expect(new Set(schedule.steps.map((x) => x.person))).toEqual(new Set([0, 1]));
      expect(scheduleProblems(mrSteps(), 2, schedule)).toEqual([]);
    });
  });

  it('returns each step with start, end, dry-at and person, in start order', () => {
    const schedule = solveTurnover({ steps: mrSteps(), staff: 1 });
    expect(schedule.steps[0]).toEqual({ key: 'clear', label: 'Patient out; coil, pads and linen off', start: 0, end: 3, dryAt: 3, person: 0 });
    expect(schedule.steps.find((x) => x.key === 'bore')).toMatchObject({ end: 7, dryAt: 13 });
    expect(scheduleProblems(mrSteps(), 1, schedule)).toEqual([]);
  });

  it('returns the protocol order when it is already optimal (ties keep the protocol order)', () => {
    const schedule = solveTurnover({ steps: mrSteps(), staff: 1 });
    expect(schedule.steps.map((x) => x.key)).toEqual(mrSteps().map((x) => x.key));
  });

  it('returns a wait-aware order: the step others wait on dries first', () => {
    const steps = [s('slow', 1, 10), s('table', 1, 5), s('linen', 1, 0, [{ key: 'table', dry: true }])];
    const schedule = solveTurnover({ steps, staff: 1 });
    expect(schedule.requiredMinutes).toBe(11);
    expect(schedule.steps.map((x) => x.key)).toEqual(['slow', 'table', 'linen']);
  });

  it('returns the same answer every time (deterministic) and from a fresh solver', () => {
    const steps = mrSteps(exam({ precaution: 'enteric', mobility: 'stretcher' }), exam({ coil: 'knee', contrast: true }));
    const first = solveTurnover({ steps, staff: 3 });
    expect(solveTurnover({ steps, staff: 3 })).toEqual(first);
    expect(createTurnoverSolver().solve({ steps, staff: 3 })).toEqual(first);
  });

  it('returns fewer minutes with more people, never more', () => {
    const steps = mrSteps(exam({ precaution: 'contact' }), exam({ contrast: true }));
    const minutes = [1, 2, 3, 4].map((staff) => solveTurnover({ steps, staff }).requiredMinutes);
    for (let k = 1; k < minutes.length; k++) expect(minutes[k]).toBeLessThanOrEqual(minutes[k - 1]);
    expect(minutes[0]).toBeGreaterThan(minutes[3]);
  });

  describe('memoization', () => {
    it('returns a remembered answer for a gap with the same numbers, under its own keys and labels', () => {
      const solver = createTurnoverSolver();
      solver.solve({ steps: [s('a', 2, 3), s('b', 1, 0, [{ key: 'a', dry: true }])], staff: 1 });
      const renamed = solver.solve({ steps: [s('x', 2, 3), s('y', 1, 0, [{ key: 'x', dry: true }])], staff: 1 });
      expect(solver.cacheSize).toBe(1);
      expect(renamed.steps.map((x) => x.key)).toEqual(['x', 'y']);
      expect(renamed.requiredMinutes).toBe(6);
    });

    it('returns correct answers after the cache drops old entries', () => {
      const solver = createTurnoverSolver({ maxCacheEntries: 2 });
      for (let wait = 0; wait < 5; wait++) {
        expect(solver.solve({ steps: [s('a', 1, wait)], staff: 1 }).requiredMinutes).toBe(1 + wait);
      }
      expect(solver.cacheSize).toBe(2);
    });
  });

  describe('edge cases', () => {
    it('returns 0 minutes and no steps for an empty turnover', () => {
      expect(solveTurnover({ steps: [], staff: 2 })).toEqual({ requiredMinutes: 0, steps: [] });
    });

    it('returns a lone step ending at its dry-at', () => {
      expect(solveTurnover({ steps: [s('wipe', 3, 4)], staff: 1 })).toEqual({
        requiredMinutes: 7,
        steps: [{ key: 'wipe', label: 'wipe', start: 0, end: 3, dryAt: 7, person: 0 }],
      });
    });

    it('returns steps of zero hands-on minutes (e.g. a pure wait)', () => {
      const schedule = solveTurnover({ steps: [s('spray', 0, 5), s('wipe', 1, 0, [{ key: 'spray', dry: true }])], staff: 1 });
      expect(schedule.requiredMinutes).toBe(6);
    });

    it('returns more people than steps as if there were one per step', () => {
      const steps = [s('a', 2, 0), s('b', 3, 0)];
      expect(solveTurnover({ steps, staff: 4 }).requiredMinutes).toBe(3);
    });

    it('returns fractional minutes when a product has a fractional contact time', () => {
      expect(solveTurnover({ steps: [s('a', 1, 0.5), s('b', 1, 0, [{ key: 'a', dry: true }])], staff: 1 }).requiredMinutes).toBe(2.5);
    });

    it('returns interchangeable steps in protocol order', () => {
      const steps = [s('clear', 1, 0), s('left', 2, 1, [{ key: 'clear', dry: false }]), s('right', 2, 1, [{ key: 'clear', dry: false }])];
      expect(solveTurnover({ steps, staff: 1 }).steps.map((x) => x.key)).toEqual(['clear', 'left', 'right']);
    });

    it('returns the largest MR turnover (enteric, stretcher, coil change, contrast) for four people', () => {
      const steps = mrSteps(exam({ precaution: 'enteric', mobility: 'stretcher' }), exam({ coil: 'knee', contrast: true }));
      const schedule = solveTurnover({ steps, staff: 4 });
      expect(scheduleProblems(steps, 4, schedule)).toEqual([]);
      expect(schedule.requiredMinutes).toBe(23);
    });
  });

  describe('invalid input', () => {
    it('throws a clear Error on cyclic needs', () => {
      const steps = [s('a', 1, 0, [{ key: 'c', dry: false }]), s('b', 1, 0, [{ key: 'a', dry: false }]), s('c', 1, 0, [{ key: 'b', dry: true }])];
      expect(() => solveTurnover({ steps, staff: 1 })).toThrow(/cyclic needs: (a → b → c → a|b → c → a → b|c → a → b → c)/);
    });

    it('throws on a step that needs itself', () => {
      expect(() => solveTurnover({ steps: [s('a', 1, 0, [{ key: 'a', dry: false }])], staff: 1 })).toThrow('cyclic needs: a → a');
    });

    it.each([0, -1, 1.5, NaN])('throws a RangeError for staff %p', (staff) => {
      expect(() => solveTurnover({ steps: [s('a', 1, 0)], staff })).toThrow(RangeError);
    });

    it('throws an Error naming an unknown need', () => {
      expect(() => solveTurnover({ steps: [s('a', 1, 0, [{ key: 'ghost', dry: true }])], staff: 1 })).toThrow('step "a" needs unknown step "ghost"');
    });

    it('throws on a duplicate step key', () => {
      expect(() => solveTurnover({ steps: [s('a', 1, 0), s('a', 2, 0)], staff: 1 })).toThrow('step "a" appears twice');
    });

    it('throws a RangeError on negative or non-numeric minutes', () => {
      expect(() => solveTurnover({ steps: [s('a', -1, 0)], staff: 1 })).toThrow(RangeError);
      expect(() => solveTurnover({ steps: [s('a', 1, NaN)], staff: 1 })).toThrow(RangeError);
    });

    it('throws a RangeError beyond 30 steps', () => {
      const steps = Array.from({ length: 31 }, (_, i) => s(`s${i}`, 1, 0));
      expect(() => solveTurnover({ steps, staff: 1 })).toThrow(RangeError);
    });
  });
});
