import type { Board } from '../../shared/api/board';
import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, local, row } from './turnover-day';

/** The front desk's view across rooms: who is due within the hour, and rooms open with nothing left. */
describe('Rooms now: arrivals and rooms with no exam left', () => {
  let h: Harness;
  let frontdesk: Client;

  beforeAll(async () => {
    h = await startHarness();
    frontdesk = await signedIn(h.app, 'frontdesk');
    await importDay(await signedIn(h.app, 'scheduler'), [
      EXAM_LIST_HEADER,
      row('A-1', 'MR 1', '08:00', 30),
      row('A-2', 'MR 1', '09:10', 30),
      row('A-3', 'MR 2', '08:40', 30),
      row('A-4', 'MR 2', '10:30', 30),
      row('A-5', 'CT 1', '08:50', 15),
    ]);
  });
  afterAll(() => h.close());

  const board = async (): Promise<Board> => (await frontdesk.get(`/api/days/${DAY}/board`)).body;

  it('lists every room\'s exams not yet begun within the coming hour, by start', async () => {
    at(h, '08:15'); // A-1 is in MR 1 now; start by 09:15; A-4 is later
    const { arrivals } = await board();
    expect(arrivals.map((a) => [a.accession, a.roomName, a.start])).toEqual([
      ['A-3', 'MR 2', local('08:40')],
      ['A-5', 'CT 1', local('08:50')],
      ['A-2', 'MR 1', local('09:10')],
    ]);
    expect(arrivals.every((a) => a.arrivedAt === null)).toBe(true);
  });

  it('shows an arrival marked from the list, and keeps a late patient listed until the exam begins', async () => {
    at(h, '08:20');
    expect((await frontdesk.post(`/api/exams/${await examId(h, 'A-5')}/arrived`, {})).status).toBe(200);
    expect((await board()).arrivals.find((a) => a.accession === 'A-5')).toMatchObject({ arrivedAt: local('08:20'), roomName: 'CT 1' });
  });

  it('is empty on another day', async () => {
    at(h, '08:15');
    const other = (await frontdesk.get('/api/days/2027-03-11/board')).body as Board;
    expect(other.arrivals).toEqual([]);
  });

  it('shows a room within opening hours with no exam at all as ready, not closed', async () => {
    at(h, '08:15');
    const rooms = (await board()).rooms;
    const empty = rooms.filter((r) => !['MR 1', 'MR 2', 'CT 1'].includes(r.name));
    expect(empty.length).toBeGreaterThan(0); // the demo centre has three MR rooms and one CT room (product brief)
    for (const room of empty) expect(room).toMatchObject({ state: 'ready', next: null });
  });
});
