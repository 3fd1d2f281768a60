import type { Board, BoardArrival, BoardRoom, BoardSlot } from '@shared/api/board';

// An invented day at an invented site (UTC−5): only what the board tests need.
const DAY = '2027-03-15';
export const at = (hhmm: string) => `${DAY}T${hhmm.length === 5 ? hhmm + ':00' : hhmm}-05:00`;

export function exampleSlot(examId: number, start: string, end: string, overrides: Partial<BoardSlot> = {}): BoardSlot {
  return {
    examId,
    accession: `ACC-${1000 + examId}`,
    procedure: 'MR knee without contrast',
    start: at(start),
    end: at(end),
    precaution: 'none',
    arrivedAt: null,
    ...overrides,
  };
}

export function exampleBoardRoom(roomId: number, overrides: Partial<BoardRoom> = {}): BoardRoom {
  return {
    roomId,
    name: `MR ${roomId}`,
    modality: 'MR',
    state: 'ready',
    readyAt: null,
    current: null,
    next: null,
    runningLateMinutes: 0,
    turnoverId: null,
    tasks: [],
    ...overrides,
    expectedReadyAt: overrides.expectedReadyAt ?? overrides.readyAt ?? null,
  };
}

export function exampleBoard(rooms: BoardRoom[], now = '09:00', arrivals: BoardArrival[] = []): Board {
  return { date: DAY, timezone: 'America/Chicago', now: at(now), rooms, arrivals };
}
