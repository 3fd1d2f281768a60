import { CT_PROTOCOL, DEFAULT_PRODUCTS, DEFAULT_PROTOCOLS, GENERIC_PROTOCOL, MR_PROTOCOL } from './demo-protocols';
import { applicationsOf, protocolFor } from './protocols';
import { planTurnover } from './plan-turnover';
import { exam, MR_ROOM } from './testing/fixtures';

describe('protocolFor', () => {
  it('returns the MR and CT protocols by DICOM modality code, in any case', () => {
    expect(protocolFor('MR', DEFAULT_PROTOCOLS)).toBe(MR_PROTOCOL);
    expect(protocolFor('ct', DEFAULT_PROTOCOLS)).toBe(CT_PROTOCOL);
  });

  it("returns the site's `*` fallback for any other modality", () => {
    expect(protocolFor('US', DEFAULT_PROTOCOLS)).toBe(GENERIC_PROTOCOL);
    const own = { ...GENERIC_PROTOCOL, modality: '*' };
    expect(protocolFor('XA', { ...DEFAULT_PROTOCOLS, '*': own })).toBe(own);
  });

  it('returns null (never an invented default) when the site has neither the modality nor a `*` fallback', () => {
    expect(protocolFor('NM', { MR: MR_PROTOCOL })).toBeNull();
    expect(protocolFor('CT', {})).toBeNull();
    expect(protocolFor('CT', undefined)).toBeNull();
  });
});

describe('applicationsOf (re-wet rule)', () => {
  // derived: the surface must stay wet for the whole label contact time — common practice, no source
  it('returns ⌈contact ÷ stays-wet⌉ when one application dries first', () => {
    expect(applicationsOf({ contactMinutes: 3, staysWetMinutes: 1.25 })).toBe(3); // 3 ÷ 1.25 = 2.4 → 3
    expect(applicationsOf({ contactMinutes: 3, staysWetMinutes: 1.5 })).toBe(2); // exactly 2, not 3
    expect(applicationsOf({ contactMinutes: 10, staysWetMinutes: 2 })).toBe(5);
  });

  it('returns 1 when the product stays wet long enough or its stays-wet time is not known', () => {
    expect(applicationsOf({ contactMinutes: 2, staysWetMinutes: 2 })).toBe(1);
    expect(applicationsOf({ contactMinutes: 2, staysWetMinutes: 5 })).toBe(1);
    expect(applicationsOf({ contactMinutes: 2, staysWetMinutes: null })).toBe(1);
    expect(applicationsOf({ contactMinutes: 2 })).toBe(1);
  });
});

describe('default protocols (demo defaults, invented)', () => {
  it('returns products with a contact time of at least 1 minute (CDC/HICPAC 2008 disinfection guideline, Table 1: low-level disinfection ≥ 1 min)', () => {
    for (const product of DEFAULT_PRODUCTS) expect(product.contactMinutes).toBeGreaterThanOrEqual(1);
  });

  it.each([MR_PROTOCOL, CT_PROTOCOL, GENERIC_PROTOCOL])('returns an opening of 5–10 minutes for one person ($modality)', (protocol) => {
    const plain = planTurnover({ leaving: null, arriving: exam(), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS }).requiredMinutes;
    const contrast = planTurnover({ leaving: null, arriving: exam({ contrast: true }), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS }).requiredMinutes;
    for (const minutes of [plain, contrast]) {
      expect(minutes).toBeGreaterThanOrEqual(5);
      expect(minutes).toBeLessThanOrEqual(10);
    }
  });

  it('returns a routine clean of 5–10 minutes for one person on CT and generic rooms (common practice, no source)', () => {
    for (const protocol of [CT_PROTOCOL, GENERIC_PROTOCOL]) {
      const minutes = planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol, products: DEFAULT_PRODUCTS }).requiredMinutes;
      expect(minutes).toBeGreaterThanOrEqual(5);
      expect(minutes).toBeLessThanOrEqual(10);
    }
  });
});
