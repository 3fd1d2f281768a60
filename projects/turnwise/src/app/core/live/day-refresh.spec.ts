import { Subject } from 'rxjs';

import type { DayStreamMessage, DayStreamStatus } from './day-events';
import { dayRefreshes } from './day-refresh';

function watch() {
  const stream = new Subject<DayStreamMessage>();
  const statuses: DayStreamStatus[] = [];
  let refreshes = 0;
  dayRefreshes(stream, { onStatus: (status) => statuses.push(status) }).subscribe(() => refreshes++);
  return { stream, statuses, refreshes: () => refreshes };
}

const change: DayStreamMessage = {
  type: 'change',
  event: { date: '2027-03-15', kind: 'board', reason: 'arrived', by: 'robin', at: '2027-03-15T09:00:00-05:00' },
};

describe('dayRefreshes', () => {
  it('asks for a first fetch at once and another on each change event', () => {
    const { stream, refreshes } = watch();
    expect(refreshes()).toBe(1);
    stream.next(change);
    stream.next({ type: 'change', event: null });
    expect(refreshes()).toBe(3);
  });

  it('does not refetch when the stream first opens, only when it comes back after a drop', () => {
    const { stream, statuses, refreshes } = watch();
    stream.next({ type: 'status', status: 'connecting' });
    stream.next({ type: 'status', status: 'live' });
    expect(refreshes()).toBe(1);
    stream.next({ type: 'status', status: 'reconnecting' });
    stream.next({ type: 'status', status: 'connecting' });
    stream.next({ type: 'status', status: 'live' });
    expect(refreshes()).toBe(2);
    expect(statuses).toEqual(['connecting', 'live', 'reconnecting', 'connecting', 'live']);
  });
});

describe('dayRefreshes with a period', () => {
  afterEach(() => jest.useRealTimers());

  it('also asks every period, for changes the clock alone brings', () => {
    jest.useFakeTimers();
    let refreshes = 0;
    const subscription = dayRefreshes(new Subject<DayStreamMessage>(), { everyMs: 30_000, onStatus: () => undefined }).subscribe(() => refreshes++);
    jest.advanceTimersByTime(29_999);
    expect(refreshes).toBe(1);
    jest.advanceTimersByTime(1);
    expect(refreshes).toBe(2);
    subscription.unsubscribe();
  });
});
