import type { Protocol, ProtocolStep, TurnoverExam, TurnoverRules } from './model';
import { CT_PROTOCOL, DEFAULT_PRODUCTS, DEFAULT_TURNOVER_RULES, GENERIC_PROTOCOL, MR_PROTOCOL } from './demo-protocols';
import { planTurnover } from './plan-turnover';
import { buildOpeningStepSet, buildStepSet, coilChanges } from './step-set';
import { exam, MR_ROOM } from './testing/fixtures';

const mr = (leaving = exam(), arriving = exam()) => buildStepSet({ leaving, arriving, room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS });
const step = (set: ReturnType<typeof mr>, key: string) => set.steps.find((s) => s.key === key);

describe('buildStepSet', () => {
  it('returns the MR protocol steps with waits of contact + dry time (standard product, 2 min)', () => {
    const set = mr();
    expect(set.steps.map((s) => s.key)).toEqual([
      'clear', 'bore', 'table', 'coils', 'cushions', 'comfort', 'touch', 'linen', 'coilset', 'cushionset', 'covers', 'hygiene',
    ]);
    expect(step(set, 'bore')).toMatchObject({ handsOnMinutes: 4, waitMinutes: 6, productKey: 'standard' });
    expect(step(set, 'touch')).toMatchObject({ handsOnMinutes: 1, waitMinutes: 2 });
    expect(step(set, 'linen')).toMatchObject({ waitMinutes: 0, productKey: null, needs: [{ key: 'table', dry: true }] });
    expect(set.steps.reduce((sum, s) => sum + s.handsOnMinutes, 0)).toBe(20);
    expect(set).toMatchObject({ staff: 1, airHoldMinutes: 0 });
  });

  it("returns hygiene needing every other step's hands-on", () => {
    const needs = step(mr(), 'hygiene')!.needs;
    expect(needs).toHaveLength(11);
    expect(needs.every((n) => !n.dry)).toBe(true);
  });

  it("returns extra clear time for the leaving patient's mobility (+2 wheelchair, +4 stretcher)", () => {
    expect(step(mr(exam({ mobility: 'wheelchair' })), 'clear')!.handsOnMinutes).toBe(5);
    expect(step(mr(exam({ mobility: 'stretcher' })), 'clear')!.handsOnMinutes).toBe(7);
  });

  it('returns coilset +2 when the coil changes', () => {
    expect(step(mr(exam({ coil: 'head' }), exam({ coil: 'knee' })), 'coilset')!.handsOnMinutes).toBe(3);
  });

  it('returns the injector step only when the arriving exam has contrast', () => {
    expect(step(mr(), 'injector')).toBeUndefined();
    expect(step(mr(exam(), exam({ contrast: true })), 'injector')).toMatchObject({ handsOnMinutes: 3 });
    expect(step(mr(exam(), exam({ contrast: true })), 'hygiene')!.needs.map((n) => n.key)).toContain('injector');
  });

  it('returns don before clear, clear +1 and hygiene 2 for contact precautions', () => {
    const set = mr(exam({ precaution: 'contact' }));
    expect(set.steps[0]).toMatchObject({ key: 'don', handsOnMinutes: 1, waitMinutes: 0 });
    expect(step(set, 'clear')).toMatchObject({ handsOnMinutes: 4, needs: [{ key: 'don', dry: false }] });
    expect(step(set, 'hygiene')!.handsOnMinutes).toBe(2);
    expect(step(set, 'bore')!.productKey).toBe('standard');
  });

  it('returns the sporicidal product (4 min) on every disinfecting step and hygiene 3 for enteric', () => {
    const set = mr(exam({ precaution: 'enteric' }));
    const disinfecting = set.steps.filter((s) => s.productKey !== null);
    expect(disinfecting.map((s) => s.key)).toEqual(['bore', 'table', 'coils', 'cushions', 'comfort', 'touch']);
    expect(disinfecting.every((s) => s.productKey === 'sporicidal')).toBe(true);
    expect(step(set, 'bore')!.waitMinutes).toBe(8);
    expect(step(set, 'hygiene')!.handsOnMinutes).toBe(3);
    expect(step(set, 'clear')!.handsOnMinutes).toBe(4);
  });

  it('returns don and hygiene 2 but no extra clear time for droplet precautions', () => {
    const set = mr(exam({ precaution: 'droplet' }));
    expect(step(set, 'don')!.label).toMatch(/mask/i);
    expect(step(set, 'clear')!.handsOnMinutes).toBe(3);
    expect(step(set, 'hygiene')!.handsOnMinutes).toBe(2);
    expect(set.airHoldMinutes).toBe(0);
  });

  it("returns an air hold from the room's air changes for airborne precautions", () => {
    const set = mr(exam({ precaution: 'airborne' }));
    expect(step(set, 'don')!.label).toMatch(/respirator/i);
    expect(set.airHoldMinutes).toBe(70);
  });

  it('returns the CT and generic protocols shaped the same way', () => {
    const ct = buildStepSet({ leaving: exam(), arriving: exam({ contrast: true }), room: MR_ROOM, protocol: CT_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(ct.steps.map((s) => s.key)).toEqual(['clear', 'gantry', 'table', 'touch', 'linen', 'injector', 'hygiene']);
    const generic = buildStepSet({ leaving: exam({ mobility: 'stretcher' }), arriving: exam(), room: MR_ROOM, protocol: GENERIC_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(generic.steps.map((s) => s.key)).toEqual(['clear', 'table', 'touch', 'linen', 'hygiene']);
    expect(generic.steps[0].handsOnMinutes).toBe(7);
  });

  describe('edge cases', () => {
    it('returns no coil change rule on a protocol without a coilset step (CT)', () => {
      const ct = buildStepSet({ leaving: exam({ coil: 'head' }), arriving: exam({ coil: 'knee' }), room: MR_ROOM, protocol: CT_PROTOCOL, products: DEFAULT_PRODUCTS });
      expect(ct.steps.reduce((sum, s) => sum + s.handsOnMinutes, 0)).toBe(10);
    });

    it('returns the staff given instead of the room default', () => {
      expect(buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS, staff: 3 }).staff).toBe(3);
    });

    it("returns a site's own product contact times", () => {
      const products = [{ key: 'standard', name: 'Quick wipe', contactMinutes: 1 }];
      const set = buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products });
      expect(step(set, 'bore')!.waitMinutes).toBe(5);
    });
  });

  describe("a site's protocol data", () => {
    const rules = DEFAULT_TURNOVER_RULES;
    const base = (steps: ProtocolStep[], extra: Partial<Protocol> = {}): Protocol => ({ modality: 'CT', steps, openingSteps: [], rules, ...extra });
    const wipe = (key: string, handsOnMinutes: number, extra: Partial<ProtocolStep> = {}): ProtocolStep =>
      ({ key, label: key, handsOnMinutes, dryMinutes: 1, disinfects: true, needs: [], ...extra });

    it('re-wets a surface when the product dries before its contact time (worked example)', () => {
      // derived: the surface must stay wet for the whole label contact time — common practice, no source.
      // Invented product: 3 min label contact, one application stays wet 1.25 min → ⌈3 ÷ 1.25⌉ = 3 applications,
      // so a 2-min wipe takes 3 × 2 = 6 min hands-on, then waits 3 (contact) + 1 (dry) = 4.
      const products = [{ key: 'quick', name: 'Quick-dry wipe', contactMinutes: 3, staysWetMinutes: 1.25 }];
      const protocol = base([wipe('table', 2, { productKey: 'quick' })]);
      const set = buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products });
      expect(set.steps[0]).toMatchObject({ key: 'table', handsOnMinutes: 6, waitMinutes: 4, productKey: 'quick', applications: 3 });
      expect(planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products }).requiredMinutes).toBe(10);
      // one that stays wet long enough is applied once and says nothing
      const slow = [{ ...products[0]!, staysWetMinutes: 5 }];
      expect(buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products: slow }).steps[0]).not.toHaveProperty('applications');
    });

    it("uses each step's own product, the protocol's default otherwise, and the precaution's over both", () => {
      const products = [
        { key: '1', name: 'A', contactMinutes: 2 },
        { key: '2', name: 'B', contactMinutes: 5 },
        { key: '3', name: 'Spore', contactMinutes: 10 },
      ];
      const own: TurnoverRules = { ...rules, defaultProductKey: '1', precaution: { ...rules.precaution, enteric: { ...rules.precaution.enteric, productKey: '3' } } };
      const protocol = base([wipe('table', 1, { productKey: '2' }), wipe('touch', 1)], { rules: own });
      const plain = buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products });
      expect(plain.steps.map((s) => [s.key, s.productKey, s.waitMinutes])).toEqual([['table', '2', 6], ['touch', '1', 3]]);
      const enteric = buildStepSet({ leaving: exam({ precaution: 'enteric' }), arriving: exam(), room: MR_ROOM, protocol, products });
      expect(enteric.steps.filter((s) => s.key !== 'don').map((s) => s.productKey)).toEqual(['3', '3']);
    });

    it("takes precaution, mobility and coil rules from the protocol itself, so modalities differ", () => {
      const gentle: TurnoverRules = { ...rules, mobility: { ...rules.mobility, stretcher: [{ step: 'clear', addMinutes: 10 }] } };
      const protocol = base([{ key: 'clear', label: 'Clear', handsOnMinutes: 3, dryMinutes: 0, disinfects: false, needs: [] }], { rules: gentle });
      const set = buildStepSet({ leaving: exam({ mobility: 'stretcher' }), arriving: exam(), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS });
      expect(set.steps[0]!.handsOnMinutes).toBe(13);
      const withoutRules = { ...protocol, rules: undefined };
      expect(() => buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: withoutRules, products: DEFAULT_PRODUCTS })).toThrow('no precaution');
    });

    it('keeps a conditional step only when its conditions hold (coil change, mobility, precaution, contrast)', () => {
      const s = (key: string, onlyWhen: ProtocolStep['onlyWhen']): ProtocolStep => ({ key, label: key, handsOnMinutes: 1, dryMinutes: 0, disinfects: false, needs: [], onlyWhen });
      const protocol = base([
        s('always', undefined),
        s('coil', { coilChange: true }),
        s('stretcher', { mobility: ['stretcher'] }),
        s('isolation', { precaution: ['contact', 'enteric'] }),
        s('dye', { contrast: true }),
      ]);
      const keys = (leaving: Partial<TurnoverExam>, arriving: Partial<TurnoverExam> = {}) =>
        buildStepSet({ leaving: exam(leaving), arriving: exam(arriving), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS }).steps.map((x) => x.key).filter((k) => k !== 'don');
      expect(keys({})).toEqual(['always']);
      expect(keys({ coil: 'head', mobility: 'stretcher', precaution: 'contact' }, { coil: 'knee', contrast: true })).toEqual(['always', 'coil', 'stretcher', 'isolation', 'dye']);
      expect(keys({ precaution: 'droplet', mobility: 'wheelchair' })).toEqual(['always']);
    });

    it('throws on a disinfecting step with no product anywhere', () => {
      const protocol = base([wipe('table', 2)], { rules: { ...rules, defaultProductKey: null } });
      expect(() => buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS })).toThrow('has no product');
    });
  });

  describe('invalid input', () => {
    it('throws on an unknown precaution or mobility', () => {
      expect(() => mr(exam({ precaution: 'plague' as never }))).toThrow('unknown precaution "plague"');
      expect(() => mr(exam({ mobility: 'jetpack' as never }))).toThrow('unknown mobility "jetpack"');
    });

    it('throws when the product a rule asks for is not set up', () => {
      const products = [{ key: 'standard', name: 'Wipe', contactMinutes: 2 }];
      expect(() =>
        buildStepSet({ leaving: exam({ precaution: 'enteric' }), arriving: exam(), room: MR_ROOM, protocol: MR_PROTOCOL, products }),
      ).toThrow('unknown product "sporicidal"');
    });

    it('throws on a need for a step the protocol does not have', () => {
      const protocol: Protocol = { ...GENERIC_PROTOCOL, steps: [{ ...GENERIC_PROTOCOL.steps[0], needs: [{ key: 'nope', dry: false }] }] };
      expect(() => buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS })).toThrow('needs unknown step "nope"');
    });

    it('throws on a step key used twice and on negative minutes', () => {
      const twice: Protocol = { ...GENERIC_PROTOCOL, steps: [GENERIC_PROTOCOL.steps[0], GENERIC_PROTOCOL.steps[0]] };
      expect(() => buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: twice, products: DEFAULT_PRODUCTS })).toThrow('twice');
      const negative: Protocol = { ...GENERIC_PROTOCOL, steps: [{ ...GENERIC_PROTOCOL.steps[1], needs: [], dryMinutes: -1 }] };
      expect(() => buildStepSet({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol: negative, products: DEFAULT_PRODUCTS })).toThrow(RangeError);
    });

    it('throws a RangeError for an airborne gap in a room without a valid air-change rate', () => {
      const room = { ...MR_ROOM, airChangesPerHour: 0 };
      expect(() => buildStepSet({ leaving: exam({ precaution: 'airborne' }), arriving: exam(), room, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS })).toThrow(RangeError);
    });
  });
});

describe('buildOpeningStepSet', () => {
  it('returns the opening steps: workstation wipe-down (5 min) and room make-up', () => {
    const set = buildOpeningStepSet({ room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS });
    expect(set.steps.map((s) => [s.key, s.handsOnMinutes, s.waitMinutes])).toEqual([
      ['workstation', 5, 2],
      ['roomcheck', 2, 0],
    ]);
    expect(set.airHoldMinutes).toBe(0);
  });

  it('returns injector prep when the first exam has contrast', () => {
    const set = buildOpeningStepSet({ room: MR_ROOM, protocol: MR_PROTOCOL, products: DEFAULT_PRODUCTS, arriving: exam({ contrast: true }) });
    expect(set.steps.map((s) => s.key)).toContain('injector');
  });
});

describe('coilChanges', () => {
  it('returns true only when both coils are known and differ, ignoring case and spaces', () => {
    expect(coilChanges({ coil: 'head' }, { coil: 'knee' })).toBe(true);
    expect(coilChanges({ coil: 'Head ' }, { coil: 'HEAD' })).toBe(false);
    expect(coilChanges({ coil: null }, { coil: 'knee' })).toBe(false);
    expect(coilChanges({ coil: 'knee' }, {})).toBe(false);
    expect(coilChanges({ coil: '' }, { coil: 'knee' })).toBe(false);
  });
});
