import { DEFAULT_HL7_MAPPING, hl7MappingSchema, ourValue } from './hl7-mapping';

describe('ourValue', () => {
  it('returns a sent value that is already ours, case aside', () => {
    expect(ourValue('precaution', 'AIRBORNE', [])).toBe('airborne');
    expect(ourValue('mobility', ' Stretcher ', [])).toBe('stretcher');
    expect(ourValue('coil', 'Knee 16ch', [])).toBe('Knee 16ch');
  });

  it("returns the site's translation of a sent value before anything else", () => {
    const values = [{ sent: 'iso-air', value: 'airborne' }, { sent: 'NONE', value: 'contact' }];
    expect(ourValue('precaution', 'ISO-AIR', values)).toBe('airborne');
    expect(ourValue('precaution', 'none', values)).toBe('contact');
  });

  it("reads contrast as the import does: yes/no and the file's other spellings (exam-list columns)", () => {
    expect(['Y', 'true', '1', 'yes'].map((v) => ourValue('contrast', v, []))).toEqual(['yes', 'yes', 'yes', 'yes']);
    expect(['N', 'false', '0', 'NO'].map((v) => ourValue('contrast', v, []))).toEqual(['no', 'no', 'no', 'no']);
  });

  describe('invalid input', () => {
    it('returns null for a value neither ours nor translated', () => {
      expect(ourValue('precaution', 'quarantine', [])).toBeNull();
      expect(ourValue('mobility', 'bed', [{ sent: 'WC', value: 'wheelchair' }])).toBeNull();
      expect(ourValue('contrast', 'maybe', [])).toBeNull();
    });

    it('returns null for an empty coil or one over the import limit of 64 characters', () => {
      expect(ourValue('coil', '  ', [])).toBeNull();
      expect(ourValue('coil', 'x'.repeat(65), [])).toBeNull();
      expect(ourValue('coil', 'x'.repeat(64), [])).toBe('x'.repeat(64));
    });
  });
});

describe('hl7MappingSchema', () => {
  it('takes the defaults as they are', () => {
    expect(hl7MappingSchema.parse(DEFAULT_HL7_MAPPING)).toEqual(DEFAULT_HL7_MAPPING);
  });

  it('trims codes, lower-cases our values, forgets the code of a source that is not read, and reads an empty coil as none', () => {
    const parsed = hl7MappingSchema.parse({
      ...DEFAULT_HL7_MAPPING,
      precaution: { source: 'nte', code: ' Isolation: ', values: [{ sent: ' ISO-D ', value: 'Droplet' }] },
      coil: { source: 'none', code: 'TW-COIL', values: [] },
      procedures: [{ code: ' MRKNEE ', coil: '', contrast: false }],
    });
    expect(parsed.precaution).toEqual({ source: 'nte', code: 'Isolation:', values: [{ sent: 'ISO-D', value: 'droplet' }] });
    expect(parsed.coil.code).toBe('');
    expect(parsed.procedures).toEqual([{ code: 'MRKNEE', coil: null, contrast: false }]);
  });

  describe('invalid input', () => {
    it('names every problem at its path', () => {
      const result = hl7MappingSchema.safeParse({
        ...DEFAULT_HL7_MAPPING,
        precaution: { source: 'obx', code: '', values: [{ sent: 'A', value: 'airborne' }, { sent: 'a', value: 'contact' }] },
        coil: { source: 'obx', code: 'TW-COIL', values: [{ sent: 'K', value: '' }] },
        procedures: [{ code: 'X', coil: null, contrast: null }],
      });
      expect(result.success).toBe(false);
      const paths = result.error!.issues.map((i) => i.path.join('.')).sort();
      expect(paths).toEqual(['coil.values.0.value', 'precaution.code', 'precaution.values.1.sent', 'procedures.0.coil']);
    });

    it('refuses more procedure codes than the limit', () => {
      const procedures = Array.from({ length: 501 }, (_, i) => ({ code: `P${i}`, coil: 'head', contrast: null }));
      expect(hl7MappingSchema.safeParse({ ...DEFAULT_HL7_MAPPING, procedures }).success).toBe(false);
    });
  });
});
