import type { NoticeKind } from '../../../shared/api/notices';
import { NOTICE_KIND_LABELS } from '../../../shared/api/notices';
import { unsubscribeToken } from './unsubscribe';

/** What every notice needs besides its content: where links point and who signs them. */
export interface NoticeContext {
  /** The address people open Turnwise at, without a trailing slash (PUBLIC_URL). */
  publicUrl: string;
  secret: string;
}

/** A notice's content: a heading, paragraphs and lines of a list, all plain text (escaped for HTML here). */
export interface NoticeBody {
  subject: string;
  intro: string;
  /** Sections, e.g. one per room; each line one gap or one exam. */
  sections: { heading: string; lines: string[] }[];
  link: { label: string; url: string };
}

export interface RenderedNotice {
  subject: string;
  text: string;
  html: string;
  unsubscribeUrl: string;
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function unsubscribeUrl(ctx: NoticeContext, userId: number, kind: NoticeKind): string {
  return `${ctx.publicUrl}/api/notices/unsubscribe?token=${encodeURIComponent(unsubscribeToken(ctx.secret, userId, kind))}`;
}

/**
 * Plain text and HTML of one notice to one user. Only what the body holds goes in (accession
 * numbers, rooms, times): never patient data. The HTML is small and inline-styled, since mail
 * clients drop style sheets.
 */
export function renderNotice(ctx: NoticeContext, kind: NoticeKind, userId: number, body: NoticeBody): RenderedNotice {
  const unsubscribe = unsubscribeUrl(ctx, userId, kind);
  const why = `You receive this because "${NOTICE_KIND_LABELS[kind]}" is on in your Turnwise profile.`;
  const text = [
    body.intro,
    '',
    ...body.sections.flatMap((s) => [s.heading, ...s.lines.map((l) => `  - ${l}`), '']),
    `${body.link.label}: ${body.link.url}`,
    '',
    '-- ',
    why,
    `Turn it off: ${unsubscribe}`,
    '',
  ].join('\n');
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.4; color: #1b1b1f">',
    `<p>${escape(body.intro)}</p>`,
    ...body.sections.map((s) => `<h3 style="margin: 16px 0 4px">${escape(s.heading)}</h3><ul>${s.lines.map((l) => `<li>${escape(l)}</li>`).join('')}</ul>`),
    `<p><a href="${escape(body.link.url)}">${escape(body.link.label)}</a></p>`,
    `<hr><p style="font-size: 12px; color: #555">${escape(why)} <a href="${escape(unsubscribe)}">Turn it off</a>.</p>`,
    '</body></html>',
  ].join('\n');
  return { subject: body.subject, text, html, unsubscribeUrl: unsubscribe };
}
