/** One setup change: who, when, what, before → after (null when created or removed). */
export const AUDIT_AREAS = ['user', 'room', 'equipment', 'kit', 'site', 'product', 'protocol', 'shift task', 'roster'] as const;
export type AuditArea = (typeof AUDIT_AREAS)[number];

export interface AuditEntry {
  id: number;
  at: string;
  by: { username: string; displayName: string };
  area: AuditArea;
  /** What was done, e.g. `created`, `role changed`, `retired`. */
  action: string;
  /** What it was done to, as people read it, e.g. `MR 2` or `jdoe`. */
  subject: string;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

export interface AuditPage {
  entries: AuditEntry[];
  total: number;
}

/** Paging of `GET /api/audit`. */
export const AUDIT_PAGE_MAX = 100;
