import { Message } from 'node-hl7-client';
import { EXAM_LIST_LIMITS } from '../../../shared/exam-list/columns';
import { HL7_FIELD_VALUES, HL7_MAPPED_FIELDS, ourValue, type Hl7MappedField } from '../../../shared/api/hl7-mapping';
import type { SiuAction, SiuMapping, ObservationSource } from './siu-mapping';

/** MSH fields the acknowledgement and the log need (HL7 v2.5.1 chapter 2, from memory). */
export interface Hl7Header {
  /** MSH-3 sending application, MSH-4 sending facility. */
  sendingApplication: string;
  sendingFacility: string;
  /** MSH-7 date/time of message. */
  sentAt: string;
  /** MSH-9.1 message code, MSH-9.2 trigger event. */
  messageCode: string;
  triggerEvent: string;
  /** MSH-10 message control id. */
  controlId: string;
  /** MSH-11 processing id, MSH-12 version id. */
  processingId: string;
  version: string;
}

/** What a booking message says about one exam; cells are the import's columns. */
export interface SiuBooking {
  action: SiuAction;
  accession: string;
  status: string;
  procedure: string;
  startTs: string;
  durationMinutes: number | null;
  /** AIL-3 text the room is matched on. */
  location: string;
  /** Only what the message or the procedure table gives; absent: not given. */
  precaution?: string;
  mobility?: string;
  coil?: string;
  contrast?: string;
}

/** ERR-3 codes (HL7 table 0357, from memory) for why a message was refused. */
export type Hl7ErrorCode = 100 | 101 | 102 | 103 | 200 | 201 | 204 | 205 | 207;

export type SiuRead =
  | { ok: true; header: Hl7Header; booking: SiuBooking }
  | { ok: false; ack: 'AR' | 'AE'; error: Hl7ErrorCode; reason: string; header: Hl7Header | null; accession?: string };

/** Segments are ended by CR (chapter 2); senders that write LF or CRLF are read alike. */
export function hl7Text(raw: string): string {
  return raw.replace(/\r\n|\n/g, '\r').replace(/\r+$/, '');
}

/** Reads a framed message: AR when it is not an HL7 message this feed takes, AE when its content is unusable. */
export function readSiu(raw: string, mapping: SiuMapping): SiuRead {
  const text = hl7Text(raw);
  if (!text.startsWith('MSH')) return { ok: false, ack: 'AR', error: 100, reason: 'Not an HL7 v2 message: it does not begin with an MSH segment.', header: null };
  let message: Message;
  try {
    message = new Message({ text });
  } catch (err) {
    return { ok: false, ack: 'AR', error: 102, reason: `Unreadable HL7: ${err instanceof Error ? err.message : 'parse error'}.`.slice(0, 300), header: null };
  }
  const get = (path: string) => read(message, path);
  const header: Hl7Header = {
    sendingApplication: get('MSH.3.1'),
    sendingFacility: get('MSH.4.1'),
    sentAt: get('MSH.7.1'),
    messageCode: get('MSH.9.1'),
    triggerEvent: get('MSH.9.2'),
    controlId: get('MSH.10'),
    processingId: get('MSH.11.1'),
    version: get('MSH.12.1'),
  };
  const refuse = (ack: 'AR' | 'AE', error: Hl7ErrorCode, reason: string): SiuRead => ({ ok: false, ack, error, reason, header });
  if (!header.controlId) return refuse('AR', 101, 'MSH-10 (message control id) is empty.');
  if (header.controlId.length > 199) return refuse('AR', 102, 'MSH-10 (message control id) is longer than 199 characters.');
  if (header.messageCode !== 'SIU') return refuse('AR', 200, `Message type ${header.messageCode || '(none)'} is not taken here: this feed reads SIU scheduling messages only.`);
  const action = mapping.events[header.triggerEvent];
  if (!action) return refuse('AR', 201, `Event SIU^${header.triggerEvent || '(none)'} is not taken here: ${Object.keys(mapping.events).join(', ')} are.`);
  const accession = first(get, mapping.accession);
  if (!accession) return refuse('AE', 101, 'No appointment id: SCH-2 (filler) and SCH-1 (placer) are both empty.');

  const code = get(mapping.procedureCode);
  const table = (code && mapping.procedures[code.toLowerCase()]) || {};
  const given: Partial<Record<Hl7MappedField, string>> = {};
  for (const field of HL7_MAPPED_FIELDS) {
    const source = mapping.observations[field];
    const sent = observation(message, source);
    if (!source || sent === undefined || sent === '') continue;
    const ours = ourValue(field, sent, mapping.values[field]);
    // refused, never applied without it: a precaution dropped unseen would plan an isolation case as none
    if (ours === null) return { ...refuse('AE', 103, unknownValue(field, source, sent)), accession } as SiuRead;
    given[field] = ours;
  }
  const booking: SiuBooking = {
    action,
    accession,
    status: get(mapping.status),
    procedure: first(get, mapping.procedure),
    startTs: first(get, mapping.start),
    durationMinutes: duration(get, mapping.duration),
    location: first(get, mapping.room),
    precaution: given.precaution,
    mobility: given.mobility,
    coil: given.coil ?? table.coil,
    contrast: given.contrast ?? (table.contrast === undefined ? undefined : table.contrast ? 'yes' : 'no'),
  };
  return { ok: true, header, booking };
}

/** A message or a segment: node-hl7-client reads both by path. */
type Hl7Node = { get(path: string): { toString(): string } };

function read(message: Hl7Node, path: string): string {
  try {
    return message.get(path).toString().trim();
  } catch {
    return '';
  }
}

function first(get: (path: string) => string, paths: string[]): string {
  for (const path of paths) {
    const value = get(path);
    if (value) return value;
  }
  return '';
}

/** Minutes from the first source that has a value; null when none does or it is unreadable. */
function duration(get: (path: string) => string, sources: SiuMapping['duration']): number | null {
  for (const source of sources) {
    const value = get(source.value);
    if (!value) continue;
    // TQ duration (SCH-11.3): S seconds, M minutes, H hours, D days, e.g. M45 (from memory)
    const tq = /^([SMHD])(\d+)$/i.exec(value);
    if (tq) return Math.ceil((Number(tq[2]) * { S: 1 / 60, M: 1, H: 60, D: 1440 }[tq[1]!.toUpperCase() as 'S'])) || null;
    const n = Number(value);
    if (!Number.isFinite(n) || n <= 0) return null;
    const per = unitMinutes(source.units ? get(source.units) : '');
    return per === null ? null : Math.ceil(n * per);
  }
  return null;
}

/** Minutes per duration unit (AIS-8 / SCH-10, ISO+ codes such as min, h, s); blank is minutes. */
function unitMinutes(unit: string): number | null {
  const u = unit.toLowerCase();
  if (u === '' || u === 'm' || u === 'min' || u === 'mins' || u === 'minute' || u === 'minutes') return 1;
  if (u === 'h' || u === 'hr' || u === 'hour' || u === 'hours') return 60;
  if (u === 's' || u === 'sec' || u === 'second' || u === 'seconds') return 1 / 60;
  return null;
}

function observation(message: Message, source: ObservationSource): string | undefined {
  if (!source) return undefined;
  let found: string | undefined;
  if ('obx' in source) {
    const code = source.obx.toLowerCase();
    eachSegment(message, 'OBX', (segment) => {
      if (found === undefined && read(segment, '3.1').toLowerCase() === code) found = read(segment, '5');
    });
  } else {
    const prefix = source.ntePrefix.toLowerCase();
    eachSegment(message, 'NTE', (segment) => {
      const text = read(segment, '3');
      if (found === undefined && text.toLowerCase().startsWith(prefix)) found = text.slice(prefix.length).trim();
    });
  }
  return found;
}

function eachSegment(message: Message, name: string, visit: (segment: Hl7Node) => void): void {
  try {
    const list = message.get(name) as unknown as { forEach?: (fn: (s: Hl7Node) => void) => void };
    list.forEach?.(visit);
  } catch {
    // no such segment
  }
}

/** MSA-3 for a value neither ours nor translated: where it came from, what it was, where to map it. */
function unknownValue(field: Hl7MappedField, source: NonNullable<ObservationSource>, sent: string): string {
  const where = 'obx' in source ? `OBX ${source.obx} (OBX-5)` : `NTE "${source.ntePrefix}" (NTE-3)`;
  const ours = HL7_FIELD_VALUES[field];
  const wanted = ours ? `one of ${ours.join(', ')}` : `a coil name of at most ${EXAM_LIST_LIMITS.coilMaxChars} characters`;
  return `${where} sent ${field} "${sent.slice(0, 40)}": not ${wanted}, and not translated in Setup → Site → Booking system feed. Nothing was applied.`;
}
