import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { Client, type ClientConfig } from 'pg';
import type { DayEvent } from '../../shared/api/changes';
import { DayEvents } from './day-events';

const CHANNEL = 'turnwise_day_events';
const RECONNECT_MS = 1000;

/**
 * The day-event bus across server processes on one PostgreSQL database. A change is told to this
 * process's streams at once, as on SQLite, and sent with NOTIFY; each process LISTENs on its own
 * connection (outside the pool) and passes on what other processes sent. A lost listening
 * connection is made again; events sent while it was down are not replayed, and screens refetch
 * after their own reconnection anyway.
 */
export class PostgresDayEvents extends DayEvents {
  private readonly origin = randomUUID();
  private listener: Client | null = null;
  private closed = false;
  private retry: NodeJS.Timeout | null = null;
  /** Resolves once this process listens, so a test can wait before publishing elsewhere. */
  readonly listening: Promise<void>;

  constructor(
    private readonly db: Knex,
    private readonly logError: (err: unknown) => void,
  ) {
    super();
    this.listening = this.listen();
  }

  override publish(event: DayEvent): void {
    super.publish(event);
    this.db
      .raw('select pg_notify(?, ?)', [CHANNEL, JSON.stringify({ origin: this.origin, event })])
      .catch((err: unknown) => this.logError(err));
  }

  async close(): Promise<void> {
    this.closed = true;
    if (this.retry) clearTimeout(this.retry);
    const listener = this.listener;
    this.listener = null;
    await listener?.end().catch(() => {});
  }

  private async listen(): Promise<void> {
    const client = new Client(this.db.client.connectionSettings as ClientConfig);
    client.on('notification', (message) => {
      if (message.channel !== CHANNEL || !message.payload) return;
      const { origin, event } = JSON.parse(message.payload) as { origin: string; event: DayEvent };
      if (origin !== this.origin) super.publish(event);
    });
    client.on('error', (err) => {
      this.logError(err);
      this.again(client);
    });
    client.on('end', () => this.again(client));
    try {
      await client.connect();
      await client.query(`LISTEN ${CHANNEL}`);
      if (this.closed) await client.end();
      else this.listener = client;
    } catch (err) {
      this.logError(err);
      this.again(client);
    }
  }

  private again(client: Client): void {
    if (this.closed || this.retry || (this.listener && this.listener !== client)) return;
    this.listener = null;
    this.retry = setTimeout(() => {
      this.retry = null;
      void this.listen();
    }, RECONNECT_MS);
  }
}

/** The bus for this database: across processes on PostgreSQL, in-process on SQLite. */
export function dayEventsFor(db: Knex, logError: (err: unknown) => void): DayEvents & { close?(): Promise<void> } {
  return db.client.config.client === 'pg' ? new PostgresDayEvents(db, logError) : new DayEvents();
}
