import { TestBed } from '@angular/core/testing';

import { DayEvents, DayStreamMessage } from './day-events';
import { fakeEventSources } from './testing/fake-event-source';

function listen() {
  const events = fakeEventSources();
  TestBed.configureTestingModule({ providers: [events.provider] });
  const messages: DayStreamMessage[] = [];
  const subscription = TestBed.inject(DayEvents).stream('2027-03-15').subscribe((message) => messages.push(message));
  return { sources: events.sources, messages, subscription };
}

describe('DayEvents', () => {
  afterEach(() => jest.useRealTimers());

  it("opens the day's stream and passes on its status and change events", () => {
    const { sources, messages } = listen();
    expect(sources[0].url).toBe('/api/days/2027-03-15/events');
    sources[0].open();
    sources[0].change({ kind: 'board', reason: 'arrived', by: 'robin' });
    expect(messages).toEqual([
      { type: 'status', status: 'connecting' },
      { type: 'status', status: 'live' },
      { type: 'change', event: expect.objectContaining({ kind: 'board', reason: 'arrived', by: 'robin' }) },
    ]);
  });

  it('opens a new stream after a pause when the browser gives up on the old one', () => {
    jest.useFakeTimers();
    const { sources, messages } = listen();
    sources[0].readyState = 2;
    sources[0].onerror!();
    expect(messages.at(-1)).toEqual({ type: 'status', status: 'reconnecting' });
    expect(sources[0].closed).toBe(true);
    jest.advanceTimersByTime(1000);
    expect(sources).toHaveLength(2);
  });

  it('leaves a dropped stream to the browser while it is still retrying by itself', () => {
    jest.useFakeTimers();
    const { sources } = listen();
    sources[0].onerror!();
    jest.advanceTimersByTime(60_000);
    expect(sources).toHaveLength(1);
  });

  it('closes the stream when the screen stops listening', () => {
    const { sources, subscription } = listen();
    subscription.unsubscribe();
    expect(sources[0].closed).toBe(true);
  });
});
