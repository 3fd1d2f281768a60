import { DateTime } from 'luxon';
import type { Hl7AckCode } from '../../../shared/api/hl7';
import type { Hl7ErrorCode, Hl7Header } from './siu-read';

/** ERR-3 wording (HL7 table 0357, from memory). */
const ERROR_TEXT: Record<Hl7ErrorCode, string> = {
  100: 'Segment sequence error',
  101: 'Required field missing',
  102: 'Data type error',
  103: 'Table value not found',
  200: 'Unsupported message type',
  201: 'Unsupported event code',
  204: 'Unknown key identifier',
  205: 'Duplicate key identifier',
  207: 'Application internal error',
};

export interface AckInput {
  code: Hl7AckCode;
  /** MSA-3 text message: why, for AE and AR. */
  text?: string;
  error?: Hl7ErrorCode;
  header: Hl7Header | null;
  /** Our own MSH-10 for the ACK. */
  controlId: string;
  now: Date;
}

/**
 * The general acknowledgement, original mode (HL7 v2.5.1 chapter 2, from memory): MSH with the
 * sender's application and facility as receiver, MSH-9 ACK^<event>^ACK; MSA-1 the code, MSA-2
 * the message's control id, MSA-3 why; an ERR segment (ERR-3 code, ERR-4 severity E) for AE/AR.
 */
export function buildAck(input: AckInput): string {
  const h = input.header;
  const stamp = DateTime.fromJSDate(input.now, { zone: 'utc' }).toFormat("yyyyMMddHHmmss'+0000'");
  const msh = ['MSH', '^~\\&', 'TURNWISE', 'TURNWISE', esc(h?.sendingApplication ?? ''), esc(h?.sendingFacility ?? ''), stamp, '', `ACK^${esc(h?.triggerEvent ?? '')}^ACK`, esc(input.controlId), esc(h?.processingId || 'P'), esc(h?.version || '2.5.1')];
  const segments = [msh.join('|'), ['MSA', input.code, esc(h?.controlId ?? ''), esc((input.text ?? '').slice(0, 300))].join('|')];
  if (input.code !== 'AA' && input.error) segments.push(['ERR', '', '', `${input.error}^${ERROR_TEXT[input.error]}^HL70357`, 'E'].join('|'));
  return segments.join('\r');
}

/** HL7 escape sequences for the standard delimiters (chapter 2), so a reason never breaks a field. */
function esc(value: string): string {
  return value.replace(/\\/g, '\\E\\').replace(/\|/g, '\\F\\').replace(/\^/g, '\\S\\').replace(/~/g, '\\R\\').replace(/&/g, '\\T\\').replace(/[\r\n]+/g, ' ');
}
