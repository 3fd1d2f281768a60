import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';

const TOUCH_EVERY_MS = 5 * 60 * 1000;
const MAX_TRACKED = 10_000;

/**
 * The Knex session store, writing a session's rolling expiry at most once every five minutes.
 * express-session touches the session on every request; stored as is, every read of the plan
 * would also be a database write, and writes are what a busy SQLite file queues on. The stored
 * expiry is at most five minutes behind the cookie's, on sessions that last twelve hours.
 */
export class SessionStore extends ConnectSessionKnexStore {
  private readonly touched = new Map<string, number>();

  override async touch(sid: string, session: SessionData, callback?: () => void): Promise<void> {
    const now = Date.now();
    const last = this.touched.get(sid);
    if (last !== undefined && now - last < TOUCH_EVERY_MS) {
      callback?.();
      return;
    }
    // Bounded: forgetting a session only costs it one early write.
    if (this.touched.size >= MAX_TRACKED) this.touched.clear();
    this.touched.set(sid, now);
    await super.touch(sid, session, callback);
  }

  /**
   * Stops the periodic removal of expired sessions, before the database is closed. Also waits for
   * the library's start-up check of the table: on a database that takes time to connect
   * (PostgreSQL) it may still be waiting for a connection, and closing the pool under it would
   * reject it with nobody listening.
   */
  async close(): Promise<void> {
    clearTimeout(this.nextDbCleanup);
    // A cleanup already under way finishes; the library schedules the next only while the interval is set.
    this.options.cleanupInterval = 0;
    await this.ready.catch(() => {});
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): Promise<number> {
    this.touched.delete(sid);
    return super.destroy(sid, callback);
  }
}
