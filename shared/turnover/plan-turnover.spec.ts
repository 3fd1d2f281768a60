import { MR_PROTOCOL, DEFAULT_PRODUCTS } from './demo-protocols';
import { planTurnover } from './plan-turnover';
import { createTurnoverSolver } from './solver';
import { exam, MR_ROOM } from './testing/fixtures';

describe('planTurnover', () => {
  it('returns required = the schedule when there is no air hold', () => {
    expect(planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS })).toMatchObject({
      requiredMinutes: 20, scheduleMinutes: 20, airHoldMinutes: 0, staff: 1,
    });
  });

  it('returns 70 minutes after an airborne patient in a 6-ACH room (CDC 2003, Appendix B, Table B.1: 69, rounded up)', () => {
    const plan = planTurnover({ leaving: exam({ precaution: 'airborne' }), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(plan).toMatchObject({ requiredMinutes: 70, airHoldMinutes: 70, scheduleMinutes: 22 });
  });

  it('returns the schedule when it outlasts the air hold (a 50-ACH room holds 9 minutes)', () => {
    const room = { ...MR_ROOM, airChangesPerHour: 50 };
    const plan = planTurnover({ leaving: exam({ precaution: 'airborne' }), arriving: exam(), room, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(plan).toMatchObject({ requiredMinutes: 22, airHoldMinutes: 9 });
  });

  it("returns the opening steps when there is no leaving exam (the day's first gap)", () => {
    const plan = planTurnover({ leaving: null, arriving: exam({ contrast: true }), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(plan.steps.map((s) => s.key)).toEqual(['workstation', 'roomcheck', 'injector']);
    expect(plan.requiredMinutes).toBe(10);
  });

  it('returns the same answer from a caller-owned solver, which then holds it', () => {
    const solver = createTurnoverSolver();
    const plan = planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS, staff: 2, solver });
    expect(plan.requiredMinutes).toBe(14);
    expect(solver.cacheSize).toBe(1);
  });

  it('throws a RangeError for staff below 1', () => {
    expect(() => planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS, staff: 0 })).toThrow(RangeError);
  });
});
