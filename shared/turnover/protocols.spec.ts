import { CT_PROTOCOL, DEFAULT_PRODUCTS, DEFAULT_PROTOCOLS, GENERIC_PROTOCOL, MR_PROTOCOL, protocolFor } from './protocols';
import { planTurnover } from './plan-turnover';
import { exam, MR_ROOM } from './testing/fixtures';

describe('protocolFor', () => {
  it('returns the MR and CT protocols by DICOM modality code, in any case', () => {
    expect(protocolFor('MR')).toBe(MR_PROTOCOL);
    expect(protocolFor('ct')).toBe(CT_PROTOCOL);
  });

  it('returns the generic protocol for any other modality', () => {
    expect(protocolFor('US')).toBe(GENERIC_PROTOCOL);
    expect(protocolFor('NM', { MR: MR_PROTOCOL })).toBe(GENERIC_PROTOCOL);
  });

  it("returns a site's own fallback", () => {
    const own = { ...GENERIC_PROTOCOL, modality: '*' };
    expect(protocolFor('XA', { ...DEFAULT_PROTOCOLS, '*': own })).toBe(own);
  });
});

describe('default protocols (demo defaults, invented)', () => {
  it('returns products with a contact time of at least 1 minute (CDC/HICPAC 2008 disinfection guideline, Table 1: low-level disinfection ≥ 1 min)', () => {
    for (const product of DEFAULT_PRODUCTS) expect(product.contactMinutes).toBeGreaterThanOrEqual(1);
  });

  it.each([MR_PROTOCOL, CT_PROTOCOL, GENERIC_PROTOCOL])('returns an opening of 5–10 minutes for one person ($modality)', (protocol) => {
    const plain = planTurnover({ leaving: null, arriving: exam(), room: MR_ROOM, protocol }).requiredMinutes;
    const contrast = planTurnover({ leaving: null, arriving: exam({ contrast: true }), room: MR_ROOM, protocol }).requiredMinutes;
    for (const minutes of [plain, contrast]) {
      expect(minutes).toBeGreaterThanOrEqual(5);
      expect(minutes).toBeLessThanOrEqual(10);
    }
  });

  it('returns a routine clean of 5–10 minutes for one person on CT and generic rooms (common practice, no source)', () => {
    for (const protocol of [CT_PROTOCOL, GENERIC_PROTOCOL]) {
      const minutes = planTurnover({ leaving: exam(), arriving: exam(), room: MR_ROOM, protocol }).requiredMinutes;
      expect(minutes).toBeGreaterThanOrEqual(5);
      expect(minutes).toBeLessThanOrEqual(10);
    }
  });
});
