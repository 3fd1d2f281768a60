import { Injector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, type Observable } from 'rxjs';

import { serverState } from './server-state';

/** A fetch whose answers the test sends by hand, one Subject per request made. */
function manualFetch() {
  const requests: { key: string; answer: Subject<string> }[] = [];
  const fetch = (key: string): Observable<string> => {
    const answer = new Subject<string>();
    requests.push({ key, answer });
    return answer;
  };
  return { fetch, requests };
}

function makeState(fetch: (key: string) => Observable<string>) {
  return runInInjectionContext(TestBed.inject(Injector), () => serverState(fetch, 'Could not be shown.'));
}

describe('serverState', () => {
  it('shows a key by fetching it, and a newer fetch of it cancels the older one', () => {
    const { fetch, requests } = manualFetch();
    const state = makeState(fetch);
    state.show('mon');
    expect(state.status()).toBe('loading');
    state.reload();
    expect(requests.map((r) => r.key)).toEqual(['mon', 'mon']);
    requests[0].answer.next('old');
    expect(state.value()).toBeNull();
    requests[1].answer.next('new');
    expect(state.value()).toBe('new');
    expect(state.status()).toBe('loaded');
  });

  it('never lets a fetch read before an action land on top of the action’s answer', () => {
    const { fetch, requests } = manualFetch();
    const state = makeState(fetch);
    state.show('mon');
    requests[0].answer.next('before');
    state.reload(); // a change event: the fetch leaves before the user's action reaches the server
    state.set('after the tick');
    requests[1].answer.next('before the tick'); // the older read answers last
    expect(state.value()).toBe('after the tick');
    expect(requests).toHaveLength(3); // fetched again, after the action
    requests[2].answer.next('fresh');
    expect(state.value()).toBe('fresh');
  });

  it('takes an action’s answer without fetching when nothing is on its way', () => {
    const { fetch, requests } = manualFetch();
    const state = makeState(fetch);
    state.show('mon');
    requests[0].answer.next('loaded');
    state.set('answered');
    expect(state.value()).toBe('answered');
    expect(state.revision()).toBe(2);
    expect(requests).toHaveLength(1);
  });

  it('keeps the value on screen when a refresh fails, and says what failed', () => {
    const { fetch, requests } = manualFetch();
    const state = makeState(fetch);
    state.show('mon');
    requests[0].answer.next('loaded');
    state.reload();
    requests[1].answer.error({ status: 503, code: 'unavailable', message: 'Down for a moment.' });
    expect(state.value()).toBe('loaded');
    expect(state.status()).toBe('loaded');
    expect(state.error()?.status).toBe(503);
  });
});
