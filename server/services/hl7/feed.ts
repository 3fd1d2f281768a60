import type { Knex } from 'knex';
import type { Clock } from '../../clock';
import { HL7_LISTENER_LOCK } from '../../db';
import type { DayEvents } from '../day-events';
import { leadAcrossProcesses } from '../leadership';
import { receiveHl7 } from './hl7-inbound';
import { startMllpListener, type MllpListener } from './mllp-listener';
import { siuMapping, type SiuMapping } from './siu-mapping';

/** Where the booking feed listens (HL7_PORT, HL7_HOST) and how it reads messages. */
export interface Hl7FeedOptions {
  port: number;
  host: string;
  /** A site's mapping over the defaults of `siu-mapping.ts`. */
  mapping?: Partial<SiuMapping>;
  /** A connection silent this long is closed; 5 minutes by default. */
  idleMs?: number;
  /** On PostgreSQL, how often a process that does not listen tries to take over; 5 s by default. */
  leaderRetryMs?: number;
}

/** The booking feed's listener, in this process or (on PostgreSQL) another. */
export interface Hl7Feed extends MllpListener {
  /**
   * Where the feed listens for the servers as a whole: this process's listener, or, while another
   * process leads, the configured host and port (every process is started with the same);
   * null when it listens nowhere this process knows of (it could not bind).
   */
  served(): Promise<{ host: string; port: number } | null>;
}

/**
 * Starts the MLLP listener of the HL7 booking feed; `closeApp` closes it. With several server
 * processes on PostgreSQL one of them listens (the leader, `leadAcrossProcesses`) and another
 * takes over when it stops; a listener that cannot bind gives the lead up until the next try.
 * `address()` answers where this process listens: null while another leads.
 */
export function startHl7Feed(deps: { db: Knex; clock: Clock; events: DayEvents; logError(err: unknown): void }, options: Hl7FeedOptions): Hl7Feed {
  const inbound = { ...deps, mapping: siuMapping(options.mapping) };
  let listener: MllpListener | null = null;
  /** Whether this process's last try to listen failed to bind. */
  let unbound = false;
  const leadership = leadAcrossProcesses(
    deps.db,
    HL7_LISTENER_LOCK,
    {
      async start() {
        const started = startMllpListener({ port: options.port, host: options.host, idleMs: options.idleMs, logError: deps.logError, handle: (message) => receiveHl7(inbound, message) });
        unbound = !(await started.address());
        if (unbound) return null;
        listener = started;
        return async () => {
          listener = null;
          await started.close();
        };
      },
    },
    { retryMs: options.leaderRetryMs, logError: deps.logError },
  );
  const address = async () => {
    await leadership.settled();
    return listener ? listener.address() : null;
  };
  return {
    address,
    async served() {
      const here = await address();
      if (here) return { host: here.address, port: here.port };
      return unbound ? null : { host: options.host, port: options.port };
    },
    close: () => leadership.close(),
  };
}
