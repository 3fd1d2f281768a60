import type { Knex } from 'knex';
import type { Clock } from '../../clock';
import type { DayEvents } from '../day-events';
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
}

/** Starts the MLLP listener of the HL7 booking feed; `closeApp` closes it. */
export function startHl7Feed(deps: { db: Knex; clock: Clock; events: DayEvents; logError(err: unknown): void }, options: Hl7FeedOptions): MllpListener {
  const inbound = { ...deps, mapping: siuMapping(options.mapping) };
  return startMllpListener({ port: options.port, host: options.host, idleMs: options.idleMs, logError: deps.logError, handle: (message) => receiveHl7(inbound, message) });
}
