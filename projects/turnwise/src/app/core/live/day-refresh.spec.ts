import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, of } from 'rxjs';

import { serverState } from '../state/server-state';
import type { DayStreamMessage, DayStreamStatus } from './day-events';
import { dayRefreshes, liveDay } from './day-refresh';
import { fakeEventSources } from './testing/fake-event-source';

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

describe('liveDay', () => {
  it('shows each key once, fetches it again on its day\'s changes, and follows the key to another day', async () => {
    const events = fakeEventSources();
    TestBed.configureTestingModule({ providers: [events.provider] });
    const fetched: string[] = [];
    const key = signal<string | null>(null);
    const { state, status } = TestBed.runInInjectionContext(() => {
      const state = serverState((date: string) => {
        fetched.push(date);
        return of(`board of ${date}`);
      }, 'failed');
      return { state, status: liveDay(state, key, { day: (date) => date }) };
    });
    const settle = () => TestBed.tick();

    settle();
    expect(events.sources).toHaveLength(0); // no key, no stream
    key.set('2027-03-15');
    settle();
    expect(fetched).toEqual(['2027-03-15']);
    expect(state.value()).toBe('board of 2027-03-15');
    events.sources[0].open();
    expect(status()).toBe('live');
    events.sources[0].change();
    expect(fetched).toEqual(['2027-03-15', '2027-03-15']);

    key.set('2027-03-16');
    settle();
    expect(events.sources[0].closed).toBe(true);
    expect(events.sources[1].url).toBe('/api/days/2027-03-16/events');
    expect(state.key()).toBe('2027-03-16');
    expect(fetched).toEqual(['2027-03-15', '2027-03-15', '2027-03-16']);
  });
});
