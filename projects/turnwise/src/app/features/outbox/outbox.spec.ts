import type { OutboxMessage, OutboxPage } from '@shared/api/notices';
import { renderSetup, settle } from '../../../testing/setup-dialogs';
import { Outbox } from './outbox';

const SENT: OutboxMessage = {
  id: 7,
  kind: 'import-digest',
  to: ['charge@example.test'],
  subject: 'Turnwise: 1 problem gap on 2027-03-10 after an import',
  status: 'sent',
  attempts: 1,
  lastError: null,
  createdAt: '2027-03-10T14:00:00.000Z',
  sentAt: '2027-03-10T14:00:30.000Z',
  nextAttemptAt: '2027-03-10T14:00:00.000Z',
  text: '10:30 before N-2: short by 4 min',
  html: '<p>short by 4 min</p><script>parent.alert(1)</script>',
};
const FAILED = { ...SENT, id: 8, subject: 'Refused', status: 'failed' as const, attempts: 5, lastError: '550 Mailbox unavailable', sentAt: null };
const PAGE: OutboxPage = { delivery: 'demo-server', notices: [FAILED, SENT].map(({ text: _t, html: _h, ...n }) => n) };

async function render() {
  const screen = renderSetup(Outbox);
  await settle(screen.fixture);
  return screen;
}

describe('Outbox', () => {
  it('lists each message with recipient, subject, time, status, attempts and last error', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/outbox').flush(PAGE);
    await settle(fixture);
    const rows = Array.from(page.querySelectorAll('tr.mat-mdc-row')).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.trim()));
    expect(rows).toEqual([
      ['charge@example.test', 'Refused', expect.stringMatching(/^2027-03-10 \d\d:\d\d$/), 'failed', '5', '550 Mailbox unavailable'],
      ['charge@example.test', SENT.subject, expect.stringMatching(/^2027-03-10 \d\d:\d\d$/), 'sent', '1', ''],
    ]);
    expect(page.textContent).toContain('demo mail server');
  });

  it('shows a message as text, and as HTML only in a sandboxed frame', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/outbox').flush(PAGE);
    await settle(fixture);
    page.querySelectorAll<HTMLButtonElement>('button.subject')[1].click();
    await settle(fixture);
    backend.expectOne('/api/outbox/7').flush(SENT);
    await settle(fixture);
    expect(page.querySelector('pre.text')!.textContent).toContain('short by 4 min');
    const htmlToggle = Array.from(page.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent!.includes('HTML')) as HTMLButtonElement;
    htmlToggle.click();
    await settle(fixture);
    const frame = page.querySelector('iframe')!;
    expect(frame.getAttribute('sandbox')).toBe('');
    expect(frame.getAttribute('srcdoc')).toContain('short by 4 min');
    expect(frame.getAttribute('srcdoc')).not.toContain('<script');
  });

  it('says when the outbox cannot be read', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/outbox').flush({ error: { code: 'forbidden', message: 'Admins only.' } }, { status: 403, statusText: 'Forbidden' });
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('Admins only.');
  });
});
