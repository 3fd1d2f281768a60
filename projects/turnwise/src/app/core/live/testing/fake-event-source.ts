import type { Provider } from '@angular/core';

import type { DayEvent } from '@shared/api/changes';
import { EVENT_SOURCE } from '../day-events';

/** Stands in for the browser's EventSource, which jsdom lacks; the test opens it and sends events. */
export class FakeEventSource {
  readyState = 0;
  onopen: (() => void) | null = null;
  onerror: (() => void) | null = null;
  closed = false;
  private readonly listeners = new Map<string, ((message: { data: string }) => void)[]>();

  constructor(readonly url: string) {}

  addEventListener(name: string, listener: (message: { data: string }) => void): void {
    this.listeners.set(name, [...(this.listeners.get(name) ?? []), listener]);
  }

  close(): void {
    this.closed = true;
    this.readyState = 2;
  }

  /** The server accepted the connection. */
  open(): void {
    this.readyState = 1;
    this.onopen?.();
  }

  /** The server published a change of the day. */
  change(event: Partial<DayEvent> = {}): void {
    const data = JSON.stringify({ date: '', kind: 'board', reason: 'test', by: null, at: '', ...event });
    for (const listener of this.listeners.get('change') ?? []) listener({ data });
  }
}

/** Provides EVENT_SOURCE with fakes; `sources` lists every one opened, newest last. */
export function fakeEventSources(): { sources: FakeEventSource[]; provider: Provider } {
  const sources: FakeEventSource[] = [];
  const open = (url: string) => {
    const source = new FakeEventSource(url);
    sources.push(source);
    return source as unknown as EventSource;
  };
  return { sources, provider: { provide: EVENT_SOURCE, useValue: open } };
}
