import { z } from 'zod';

/**
 * E-mail notices: the kinds a user can turn on or off (profile page), the Outbox's rows (admin),
 * and the preference form. Notices carry accession numbers only, never patient data.
 */
export const NOTICE_KINDS = ['import-digest', 'slot-moves', 'day-before', 'weekly-summary'] as const;
export type NoticeKind = (typeof NOTICE_KINDS)[number];

export const NOTICE_KIND_LABELS: Record<NoticeKind, string> = {
  'import-digest': 'After an import with short or overlapping gaps',
  'slot-moves': 'When slots of a day I follow move',
  'day-before': 'The day before: tomorrow’s problem gaps and isolation cases (charge technologists)',
  'weekly-summary': 'Weekly summary: early closes, contact time below required, overdue shift tasks (admins)',
};

export const NOTICE_STATUSES = ['queued', 'sending', 'sent', 'failed'] as const;
export type NoticeStatus = (typeof NOTICE_STATUSES)[number];

/** `GET /api/outbox`: one queued or sent message. */
export interface OutboxNotice {
  id: number;
  kind: NoticeKind;
  to: string[];
  subject: string;
  status: NoticeStatus;
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
  nextAttemptAt: string;
}

/** `GET /api/outbox/:id`: the message with its bodies. */
export interface OutboxMessage extends OutboxNotice {
  text: string;
  html: string;
}

/** `GET /api/outbox`: the newest first; `delivery` says where mail goes (the demo server, an SMTP host, nowhere). */
export interface OutboxPage {
  notices: OutboxNotice[];
  delivery: MailDelivery;
}

export type MailDelivery = 'demo-server' | 'smtp' | 'off';

export const outboxQuerySchema = z.object({
  status: z.enum(NOTICE_STATUSES).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

/** `GET/PUT /api/profile/notices`: one's own address and which notices to receive. */
export interface NoticePreferences {
  email: string | null;
  kinds: Record<NoticeKind, boolean>;
}

export const noticePreferencesSchema = z.object({
  email: z.union([z.literal(''), z.null(), z.string().trim().max(254, 'use at most 254 characters').pipe(z.email('not an e-mail address'))]),
  // a kind left out keeps its setting (a client older than the kind still saves the rest)
  kinds: z.object(Object.fromEntries(NOTICE_KINDS.map((k) => [k, z.boolean().optional()])) as Record<NoticeKind, z.ZodOptional<z.ZodBoolean>>),
});
