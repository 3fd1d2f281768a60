import type { Knex } from 'knex';
import { Client, type ClientConfig } from 'pg';

/** Work one server process does for all of them (the HL7 listener): started, and stopped again. */
export interface LeaderWork {
  /** Starts the work; answers its stop, or null when it could not start (then it is tried again later). */
  start(): Promise<(() => Promise<void>) | null>;
}

export interface Leadership {
  /** Resolves once this process's latest bid has settled: it leads, or another does. */
  settled(): Promise<void>;
  /** Whether this process leads (its work is running) now. */
  leading(): boolean;
  /** Stops the work and gives up the lead (another process takes over on its next bid). */
  close(): Promise<void>;
}

export interface LeadershipOptions {
  /** How often a follower bids for the lead and the leader checks its connection; 5 s by default. */
  retryMs?: number;
  logError(err: unknown): void;
}

export const LEADER_RETRY_MS = 5000;

/**
 * Runs `work` in one server process at a time, for as long as that process lives. On PostgreSQL
 * the leader holds the session-level advisory lock `key` on a connection of its own (outside the
 * pool); the others try to take it every `retryMs` and start the work once they have it, which
 * happens when the leader closes or dies (PostgreSQL frees the lock with its session). A leader
 * whose connection fails stops its work at once, since the lock may be gone with it. SQLite is
 * served by one process, so there the work simply starts, once.
 */
export function leadAcrossProcesses(db: Knex, key: number, work: LeaderWork, options: LeadershipOptions): Leadership {
  return db.client.config.client === 'pg' ? new PostgresLeadership(db, key, work, options) : leadAlone(work, options.logError);
}

function leadAlone(work: LeaderWork, logError: (err: unknown) => void): Leadership {
  let stop: (() => Promise<void>) | null = null;
  const started = work.start().then(
    (s) => void (stop = s),
    (err: unknown) => logError(err),
  );
  return {
    settled: () => started,
    leading: () => stop !== null,
    close: async () => {
      await started;
      await stop?.();
      stop = null;
    },
  };
}

class PostgresLeadership implements Leadership {
  private client: Client | null = null;
  private stop: (() => Promise<void>) | null = null;
  private closed = false;
  private timer: NodeJS.Timeout | null = null;
  /** The bid or check under way: one at a time, so the connection has one query at a time. */
  private turn: Promise<void>;
  private readonly retryMs: number;

  constructor(
    private readonly db: Knex,
    private readonly key: number,
    private readonly work: LeaderWork,
    private readonly options: LeadershipOptions,
  ) {
    this.retryMs = options.retryMs ?? LEADER_RETRY_MS;
    this.turn = this.next();
  }

  settled(): Promise<void> {
    return this.turn;
  }

  leading(): boolean {
    return this.stop !== null;
  }

  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    await this.turn;
    await this.lose();
  }

  private async next(): Promise<void> {
    this.timer = null;
    try {
      if (this.stop) await this.client!.query('select 1');
      else await this.bid();
    } catch (err) {
      if (!this.closed) this.options.logError(err);
      await this.lose();
    }
    if (!this.closed) this.timer = setTimeout(() => void (this.turn = this.next()), this.retryMs);
  }

  private async bid(): Promise<void> {
    const client = this.client ?? (await this.connect());
    const { rows } = await client.query<{ locked: boolean }>('select pg_try_advisory_lock($1) as locked', [this.key]);
    // closed meanwhile: close() ends the connection, which frees the lock
    if (!rows[0]?.locked || this.closed) return;
    const stop = await this.work.start().catch((err: unknown) => {
      this.options.logError(err);
      return null;
    });
    if (!stop) {
      await client.query('select pg_advisory_unlock($1)', [this.key]);
    } else if (client !== this.client || this.closed) {
      // the connection dropped (or the app closed) while the work started: the lock may be gone
      await stop().catch((err: unknown) => this.options.logError(err));
    } else {
      this.stop = stop;
    }
  }

  private async connect(): Promise<Client> {
    // bounded, so a database that stops answering costs a turn (and the lead), never a hung close
    const client = new Client({ ...(this.db.client.connectionSettings as ClientConfig), keepAlive: true, connectionTimeoutMillis: 10_000, query_timeout: 10_000 });
    client.on('error', (err) => {
      if (!this.closed) this.options.logError(err);
      this.dropped(client);
    });
    client.on('end', () => this.dropped(client));
    try {
      await client.connect();
    } catch (err) {
      await client.end().catch(() => {});
      throw err;
    }
    this.client = client;
    return client;
  }

  /** The connection, and with it the lock, is gone: a leader stops its work now, not at its next check. */
  private dropped(client: Client): void {
    if (client === this.client) void this.lose();
  }

  private async lose(): Promise<void> {
    const stop = this.stop;
    const client = this.client;
    this.stop = null;
    this.client = null;
    await stop?.().catch((err: unknown) => this.options.logError(err));
    await client?.end().catch(() => {});
  }
}
