import { EventEmitter } from 'node:events';
import type { DayEvent } from '../../shared/api/changes';

/**
 * In-process fan-out of "this day changed" to every open event stream. One per app; a
 * multi-process deployment would put a shared channel behind the same two methods.
 */
export class DayEvents {
  private readonly emitter = new EventEmitter();

  constructor() {
    this.emitter.setMaxListeners(0);
  }

  /** `date: '*'` reaches every day's streams (e.g. a room's staffing changed). */
  publish(event: DayEvent): void {
    this.emitter.emit(`day:${event.date}`, event);
  }

  subscribe(date: string, listener: (event: DayEvent) => void): () => void {
    this.emitter.on(`day:${date}`, listener);
    this.emitter.on('day:*', listener);
    return () => {
      this.emitter.off(`day:${date}`, listener);
      this.emitter.off('day:*', listener);
    };
  }
}
