import { DayEvents } from '../services/day-events';
import { publishDayEvent } from './announce';
import { idParam, parseDay } from './params';

describe('parseDay', () => {
  it('returns a real calendar day as given', () => {
    expect(parseDay('2027-03-14')).toBe('2027-03-14');
    expect(parseDay('2028-02-29')).toBe('2028-02-29'); // leap year
  });

  it('refuses with 422 validation_failed what is not one', () => {
    for (const bad of ['2027-02-30', '2027-13-01', '2027-3-14', '14/03/2027', '', undefined, 20270314, '2027-03-14T00:00']) {
      expect(() => parseDay(bad)).toThrow(expect.objectContaining({ status: 422, code: 'validation_failed' }));
    }
  });
});

describe('idParam', () => {
  it('returns a positive whole number', () => {
    expect(idParam('42', 'an exam')).toBe(42);
  });

  it('refuses anything else, naming what it should have been', () => {
    for (const bad of ['0', '-1', '1.5', 'abc', '', undefined]) {
      expect(() => idParam(bad, 'an exam')).toThrow(expect.objectContaining({ status: 422, code: 'validation_failed' }));
    }
    expect(() => idParam('x', 'a room')).toThrow('"x" is not a room id.');
  });
});

describe('publishDayEvent', () => {
  it('publishes one event per kind, stamped with the clock and the display name', () => {
    const events = new DayEvents();
    const seen: unknown[] = [];
    events.subscribe('2027-03-14', (event) => seen.push(event));
    const clock = { now: () => new Date('2027-03-14T15:00:00Z') };
    publishDayEvent({ clock, events }, '2027-03-14', ['board', 'log'], 'step done', { displayName: 'Mika Lindahl', username: 'tech' });
    publishDayEvent({ clock, events }, '2027-03-14', 'plan', 'import', { displayName: '', username: 'scheduler' });
    expect(seen).toEqual([
      { date: '2027-03-14', kind: 'board', reason: 'step done', by: 'Mika Lindahl', at: '2027-03-14T15:00:00.000Z' },
      { date: '2027-03-14', kind: 'log', reason: 'step done', by: 'Mika Lindahl', at: '2027-03-14T15:00:00.000Z' },
      { date: '2027-03-14', kind: 'plan', reason: 'import', by: 'scheduler', at: '2027-03-14T15:00:00.000Z' },
    ]);
  });
});
