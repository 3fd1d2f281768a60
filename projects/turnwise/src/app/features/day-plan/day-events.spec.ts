import { TestBed } from '@angular/core/testing';

import { DayEvents, EVENT_SOURCE, StreamNotice } from './day-events';
import { FakeEventSource } from './testing/day-plan-harness';

describe('DayEvents', () => {
  function setup() {
    const opened: FakeEventSource[] = [];
    TestBed.configureTestingModule({
      providers: [{ provide: EVENT_SOURCE, useValue: (url: string) => (opened.push(new FakeEventSource(url)), opened[opened.length - 1]) }],
    });
    const notices: StreamNotice[] = [];
    const subscription = TestBed.inject(DayEvents).changes('2027-03-15').subscribe((notice) => notices.push(notice));
    return { opened, notices, subscription };
  }

  afterEach(() => jest.useRealTimers());

  it('returns each change event of the day, and says when the stream opens', () => {
    const { opened, notices } = setup();
    expect(opened[0].url).toBe('/api/days/2027-03-15/events');
    opened[0].onopen!();
    opened[0].emit({ date: '2027-03-15', kind: 'plan', reason: 'drag', by: 'Sam', at: '2027-03-15T13:00:00Z' });
    expect(notices).toEqual(['opened', { date: '2027-03-15', kind: 'plan', reason: 'drag', by: 'Sam', at: '2027-03-15T13:00:00Z' }]);
  });

  it('reopens a stream the browser gave up on, waiting longer after each failure', () => {
    jest.useFakeTimers();
    const { opened, notices } = setup();
    opened[0].readyState = 2;
    opened[0].onerror!();
    expect(notices).toEqual(['dropped']);
    expect(opened[0].closed).toBe(true);
    jest.advanceTimersByTime(999);
    expect(opened).toHaveLength(1);
    jest.advanceTimersByTime(1);
    expect(opened).toHaveLength(2);
    opened[1].readyState = 2;
    opened[1].onerror!();
    jest.advanceTimersByTime(1999);
    expect(opened).toHaveLength(2);
    jest.advanceTimersByTime(1);
    expect(opened).toHaveLength(3);
  });

  it('leaves reconnecting to the browser while it is still trying, and closes the stream on unsubscribe', () => {
    const { opened, notices, subscription } = setup();
    opened[0].readyState = 0;
    opened[0].onerror!();
    expect(notices).toEqual(['dropped']);
    expect(opened[0].closed).toBe(false);
    subscription.unsubscribe();
    expect(opened[0].closed).toBe(true);
  });
});
