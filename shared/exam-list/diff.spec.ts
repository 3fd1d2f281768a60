import { diffExamLists, type ExamListKeyed } from './diff';

const KNEE: ExamListKeyed = {
  accession: 'A1',
  room: 'MR 1',
  start: '2027-03-15T08:00:00-05:00',
  durationMinutes: 30,
  procedure: 'MR knee',
  coil: 'knee',
  precaution: 'none',
  mobility: 'ambulatory',
  contrast: false,
  notes: null,
};

describe('diffExamLists', () => {
  it('returns added, changed, removed and the unchanged count, keyed by accession', () => {
    const current = [KNEE, { ...KNEE, accession: 'A2' }, { ...KNEE, accession: 'A3' }];
    const incoming = [{ ...KNEE, accession: 'A4' }, { ...KNEE, accession: 'A3', room: 'MR 2' }, KNEE];
    expect(diffExamLists(current, incoming)).toEqual({
      added: ['A4'],
      changed: [{ accession: 'A3', fields: ['room'], values: [{ column: 'room', from: 'MR 1', to: 'MR 2' }] }],
      removed: ['A2'],
      unchanged: 1,
    });
  });

  it('names every changed field by its file column, in column order', () => {
    const changed: ExamListKeyed = {
      ...KNEE,
      room: 'MR 2',
      start: '2027-03-15T08:05:00-05:00',
      durationMinutes: 45,
      procedure: 'MR knee, left',
      coil: 'flex',
      precaution: 'contact',
      mobility: 'stretcher',
      contrast: true,
      notes: 'Gown and gloves',
    };
    const [diff] = diffExamLists([KNEE], [changed]).changed;
    expect(diff!.fields).toEqual(['room', 'start', 'duration_min', 'procedure', 'coil', 'precaution', 'mobility', 'contrast', 'notes']);
    // Each as the day has it and as the file has it, in the same order, as text.
    expect(diff!.values.map((v) => v.column)).toEqual(diff!.fields);
    expect(diff!.values.find((v) => v.column === 'duration_min')).toEqual({ column: 'duration_min', from: '30', to: String(changed.durationMinutes) });
    expect(diff!.values.find((v) => v.column === 'contrast')).toEqual({ column: 'contrast', from: 'no', to: 'yes' });
    expect(diff!.values.find((v) => v.column === 'notes')).toEqual({ column: 'notes', from: '', to: 'Gown and gloves' });
    expect(diff!.values.find((v) => v.column === 'start')).toEqual({ column: 'start', from: KNEE.start, to: changed.start });
  });

  it('compares starts as instants, whatever offset they are written with', () => {
    expect(diffExamLists([KNEE], [{ ...KNEE, start: '2027-03-15T13:00:00Z' }]).unchanged).toBe(1);
    expect(diffExamLists([KNEE], [{ ...KNEE, start: '2027-03-15T08:00:00-06:00' }]).changed).toEqual([
      { accession: 'A1', fields: ['start'], values: [{ column: 'start', from: KNEE.start, to: '2027-03-15T08:00:00-06:00' }] },
    ]);
  });

  it('treats a missing coil or note stored as null or as an empty string alike', () => {
    expect(diffExamLists([{ ...KNEE, coil: null, notes: '' }], [{ ...KNEE, coil: '', notes: null }]).unchanged).toBe(1);
  });

  describe('edge cases', () => {
    it('returns everything as added on a first import and as removed for an empty file', () => {
      expect(diffExamLists([], [KNEE])).toEqual({ added: ['A1'], changed: [], removed: [], unchanged: 0 });
      expect(diffExamLists([KNEE], [])).toEqual({ added: [], changed: [], removed: ['A1'], unchanged: 0 });
    });

    it('shows an unparseable stored start as changed rather than hiding it', () => {
      expect(diffExamLists([{ ...KNEE, start: 'not a time' }], [KNEE]).changed).toEqual([
        { accession: 'A1', fields: ['start'], values: [{ column: 'start', from: 'not a time', to: KNEE.start }] },
      ]);
    });
  });
});
