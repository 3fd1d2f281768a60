import type { Knex } from 'knex';
import nodemailer, { type Transporter } from 'nodemailer';
import type { MailDelivery } from '../../../shared/api/notices';
import { startDemoMailServer, type DemoMailServer } from './demo-mail-server';
import type { SmtpSettings } from './smtp-settings';

/** What sends a notice: nodemailer's `sendMail`, or a test's stand-in. */
export interface NoticeTransport {
  sendMail(message: { from: string; to: string[]; subject: string; text: string; html: string; messageId: string; headers?: Record<string, string> }): Promise<unknown>;
}

/**
 * The app's one way out for e-mail. `demo-server` starts the local demo mail server the first
 * time something is sent (so a test that sends nothing opens no port); `close()` ends it.
 */
export interface Mailer {
  delivery: MailDelivery;
  /** Null when delivery is `off`. */
  transport(): Promise<NoticeTransport | null>;
  /** The demo server's port once started (tests, start-up line). */
  demoServer(): DemoMailServer | null;
  close(): Promise<void>;
}

export function createMailer(options: { db: Knex; smtp: SmtpSettings | null; demoServer: boolean; now: () => Date }): Mailer {
  if (options.smtp) {
    const smtp = options.smtp;
    const transporter: Transporter = smtp.url
      ? nodemailer.createTransport(smtp.url)
      : nodemailer.createTransport({
          host: smtp.host,
          port: smtp.port,
          secure: smtp.port === 465,
          auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
        });
    return {
      delivery: 'smtp',
      transport: async () => transporter,
      demoServer: () => null,
      close: async () => transporter.close(),
    };
  }
  if (!options.demoServer) {
    return { delivery: 'off', transport: async () => null, demoServer: () => null, close: async () => {} };
  }
  let started: Promise<{ server: DemoMailServer; transporter: Transporter }> | null = null;
  let server: DemoMailServer | null = null;
  let closed = false;
  return {
    delivery: 'demo-server',
    transport: async () => {
      if (closed) return null;
      started ??= startDemoMailServer(options.db, options.now).then((s) => {
        server = s;
        return { server: s, transporter: nodemailer.createTransport({ host: s.host, port: s.port, secure: false, ignoreTLS: true }) };
      });
      return (await started).transporter;
    },
    demoServer: () => server,
    close: async () => {
      closed = true;
      if (!started) return;
      const { server: s, transporter } = await started;
      transporter.close();
      await s.close();
    },
  };
}
