import type { Knex } from 'knex';
import type { Hl7AckCode } from '../../../shared/api/hl7';
import type { Clock } from '../../clock';
import { HttpError } from '../../errors';
import type { DayEvents } from '../day-events';
import { readSettings } from '../settings';
import { buildAck } from './ack';
import { hl7Instant } from './hl7-time';
import { pruneHl7Log, withoutPatient, type LogRow } from './hl7-log';
import { applySiu, FEED_USER, SiuRefusal, type SiuApplied } from './siu-apply';
import { readHl7Mapping, siteSiuMapping } from './hl7-mapping-setup';
import type { SiuMapping } from './siu-mapping';
import { hl7Text, readSiu, type Hl7ErrorCode, type Hl7Header } from './siu-read';

export interface Hl7InboundDeps {
  db: Knex;
  clock: Clock;
  events: DayEvents;
  /** The mapping's fixed part; the site's part (Setup) is read over it per message. */
  mapping: SiuMapping;
  logError(err: unknown): void;
}

interface Outcome {
  code: Hl7AckCode;
  text: string;
  error?: Hl7ErrorCode;
  applied?: SiuApplied;
  accession?: string | null;
}

/**
 * Answers one message of the booking feed with its ACK (never rejects): reads it, applies it
 * once (a repeat of the same sender and MSH-10 is acknowledged again from the log and changes
 * nothing), logs it without its patient segments, and tells open screens of the day it changed.
 */
export async function receiveHl7(deps: Hl7InboundDeps, raw: string): Promise<string> {
  const now = deps.clock.now();
  let mapping: SiuMapping;
  try {
    // read per message: a change in Setup holds from the next message on
    mapping = { ...deps.mapping, ...siteSiuMapping(await readHl7Mapping(deps.db)) };
  } catch (err) {
    deps.logError(err);
    return buildAck({ code: 'AE', text: 'Turnwise could not read its booking-feed mapping just now; send it again.', error: 207, header: readSiu(raw, deps.mapping).header, controlId: `TW-${now.getTime()}`, now });
  }
  const read = readSiu(raw, mapping);
  const header = read.header;
  const stored = withoutPatient(hl7Text(raw));
  try {
    const { outcome, logId } = await deps.db.transaction(async (trx) => {
      const sender = header ? `${header.sendingApplication}^${header.sendingFacility}` : '';
      const controlId = header?.controlId || null;
      if (controlId) {
        const seen = (await trx('hl7_messages').where({ sender, control_id: controlId }).first()) as LogRow | undefined;
        if (seen) {
          await trx('hl7_messages').where({ id: seen.id }).update({ times_received: seen.times_received + 1, last_received_at: now.toISOString() });
          return { outcome: { code: seen.ack_code, text: seen.ack_code === 'AA' ? '' : seen.outcome } as Outcome, logId: seen.id, repeat: true };
        }
      }
      const outcome = read.ok ? await applyOnce(trx, deps, read.booking, header!, now) : ({ code: read.ack, text: read.reason, error: read.error, accession: read.accession } as Outcome);
      const [{ id: logId }] = await trx('hl7_messages').insert({
        received_at: now.toISOString(),
        last_received_at: now.toISOString(),
        sender,
        control_id: controlId,
        message_type: header ? `${header.messageCode}^${header.triggerEvent}`.slice(0, 40) : '',
        sent_at: header ? hl7Instant(header.sentAt, (await readSettings(trx)).timezone) : null,
        ack_code: outcome.code,
        outcome: (outcome.applied?.summary ?? outcome.text).slice(0, 500),
        accession: outcome.accession ?? null,
        day: outcome.applied?.day ?? null,
        change_id: outcome.applied?.changeId ?? null,
        after_manual_change: outcome.applied?.afterManualChange ?? false,
        raw: stored,
      }).returning('id');
      await pruneHl7Log(trx, now);
      return { outcome, logId: logId as number };
    });
    if (outcome.applied) {
      deps.events.publish({ date: outcome.applied.day, kind: 'plan', reason: 'hl7', by: FEED_USER.displayName, at: now.toISOString() });
    }
    return buildAck({ code: outcome.code, text: outcome.text, error: outcome.error, header, controlId: `TW${logId}`, now });
  } catch (err) {
    deps.logError(err);
    return buildAck({ code: 'AE', text: 'Turnwise could not take this message just now; send it again.', error: 207, header, controlId: `TW-${now.getTime()}`, now });
  }
}

/** Applies in a savepoint, so a refusal undoes its part and is still logged. */
async function applyOnce(trx: Knex.Transaction, deps: Hl7InboundDeps, booking: Parameters<typeof applySiu>[1], header: Hl7Header, now: Date): Promise<Outcome> {
  const accession = booking.accession;
  const stale = await newerApplied(trx, accession, header);
  if (stale) return { code: 'AE', error: 207, accession, text: `Stale: a newer message about ${accession} (sent ${stale}) was applied already; this one (MSH-7 ${header.sentAt}) is older.` };
  const removing = deps.mapping.removingStatuses.some((s) => s.toLowerCase() === booking.status.toLowerCase());
  try {
    const applied = await trx.transaction((inner) => applySiu(inner, booking, removing, now));
    return { code: 'AA', text: '', applied, accession };
  } catch (err) {
    if (err instanceof SiuRefusal) return { code: 'AE', error: err.error, text: err.message, accession };
    if (err instanceof HttpError) return { code: 'AE', error: 207, text: err.message, accession };
    throw err;
  }
}

/** MSH-7 of the newest applied message about this appointment, when it is later than this one's. */
async function newerApplied(trx: Knex, accession: string, header: Hl7Header): Promise<string | null> {
  const sent = hl7Instant(header.sentAt, (await readSettings(trx)).timezone);
  if (!sent) return null;
  const newer = await trx('hl7_messages').where({ accession, ack_code: 'AA' }).andWhere('sent_at', '>', sent).orderBy('sent_at', 'desc').first('sent_at');
  return newer?.sent_at ?? null;
}
