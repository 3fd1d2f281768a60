import { z } from 'zod';

/** HL7 v2 acknowledgement codes, original mode (HL7 v2.5.1 chapter 2, MSA-1; table 0008). */
export const HL7_ACK_CODES = ['AA', 'AE', 'AR'] as const;
export type Hl7AckCode = (typeof HL7_ACK_CODES)[number];

/** How the day's history, the timeline and the interface log word a booking-feed move over a hand change. */
export const AFTER_MANUAL_CHANGE = 'moved by the booking system after a manual change';

/**
 * The interface log keeps this many days of messages; older rows are pruned as new ones arrive
 * (a few per message, so pruning never holds up the feed). A sender repeating a control id older
 * than this would be applied again.
 */
export const HL7_LOG_KEEP_DAYS = 90;

/** One message of the booking feed's interface log (`GET /api/hl7/messages`). */
export interface Hl7LogEntry {
  id: number;
  /** When it first arrived, and when last (a sender repeats a message it got no ACK for). */
  receivedAt: string;
  lastReceivedAt: string;
  timesReceived: number;
  /** MSH-3^MSH-4 (sending application and facility). */
  sender: string;
  /** MSH-10; null when the message was unreadable. */
  controlId: string | null;
  /** MSH-9, e.g. SIU^S12. */
  messageType: string;
  ackCode: Hl7AckCode;
  /** The change it made (as the day's history words it) or why it was refused. */
  outcome: string;
  accession: string | null;
  day: string | null;
  /** The day's history entry it made. */
  changeId: number | null;
  /** It moved an exam that someone had moved by hand since the last message about it. */
  afterManualChange: boolean;
}

/** `GET /api/hl7/messages/:id`: the entry and the message as received, patient segments dropped. */
export interface Hl7LogMessage extends Hl7LogEntry {
  raw: string;
}

/** `GET /api/hl7/messages` answer: newest first; `before` the next page's cursor. */
export interface Hl7LogPage {
  messages: Hl7LogEntry[];
  /** Pass as `before` for older messages; null when there are none. */
  before: number | null;
  /** Whether the listener is on (HL7_PORT) and where. */
  listener: { host: string; port: number } | null;
}

export const hl7LogQuerySchema = z.object({
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  ack: z.enum(HL7_ACK_CODES).optional(),
});
export type Hl7LogQuery = z.infer<typeof hl7LogQuerySchema>;
