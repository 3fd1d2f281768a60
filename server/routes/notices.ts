import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { NOTICE_KIND_LABELS, noticePreferencesSchema, outboxQuerySchema, type OutboxPage } from '../../shared/api/notices';
import { NotFoundError } from '../errors';
import { currentUser, requireRole, requireUser } from '../middleware/roles';
import type { Mailer } from '../services/mail/mailer';
import { listOutbox, outboxMessage } from '../services/notices/outbox';
import { readPreferences, setKind, writePreferences } from '../services/notices/preferences';
import type { NoticeContext } from '../services/notices/render';
import { readUnsubscribeToken } from '../services/notices/unsubscribe';
import { parseInput } from '../validate';
import { idParam } from './params';

export interface NoticeDeps {
  mailer: Mailer;
  context: NoticeContext;
}

const unsubscribeQuery = z.object({ token: z.string().min(1).max(200) });

/** The Outbox (admin): what was queued and sent, with each message's text and HTML. */
export function outboxRoutes(deps: { db: Knex; notices: NoticeDeps }): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', async (req, res) => {
    const query = parseInput(outboxQuerySchema, req.query, 'outbox query');
    const page: OutboxPage = { notices: await listOutbox(deps.db, query), delivery: deps.notices.mailer.delivery };
    res.json(page);
  });
  router.get('/:id', async (req, res) => {
    res.json(await outboxMessage(deps.db, idParam(req.params['id'], 'a message')));
  });
  return router;
}

/** One's own address and notice choices (every role). */
export function noticePreferenceRoutes(deps: { db: Knex }): Router {
  const router = Router();
  router.use(requireUser);
  router.get('/', async (req, res) => {
    res.json(await readPreferences(deps.db, currentUser(req).id));
  });
  router.put('/', async (req, res) => {
    const prefs = parseInput(noticePreferencesSchema, req.body ?? {}, 'notice settings');
    res.json(await writePreferences(deps.db, currentUser(req).id, { email: prefs.email || null, kinds: prefs.kinds }));
  });
  return router;
}

/**
 * The link at the foot of every notice: turns that notice off for its user without signing in
 * (the token is signed by this server). Answers a small page, never JSON, since a person opens it
 * from their mail. A token this server did not sign is a 404.
 */
export function unsubscribeRoutes(deps: { db: Knex; notices: NoticeDeps }): Router {
  const router = Router();
  router.get('/unsubscribe', async (req: Request, res) => {
    const { token } = parseInput(unsubscribeQuery, req.query, 'unsubscribe link');
    const read = readUnsubscribeToken(deps.notices.context.secret, token);
    const user = read && (await deps.db('users').where({ id: read.userId }).first('id'));
    if (!read || !user) throw new NotFoundError('This unsubscribe link is not one Turnwise made.');
    await setKind(deps.db, read.userId, read.kind, false);
    res
      .type('html')
      .send(
        `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Notice turned off</title></head><body style="font-family: sans-serif; max-width: 36rem; margin: 3rem auto">` +
          `<h1>Notice turned off</h1><p>You will no longer receive "${NOTICE_KIND_LABELS[read.kind]}" by e-mail.</p>` +
          `<p>To turn it on again, sign in to Turnwise and open <a href="${deps.notices.context.publicUrl}/profile">your profile</a>.</p></body></html>`,
      );
  });
  return router;
}
