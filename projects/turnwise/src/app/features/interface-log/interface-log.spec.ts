import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { Hl7LogEntry, Hl7LogMessage, Hl7LogPage } from '@shared/api/hl7';
import { renderSetup, settle } from '../../../testing/setup-dialogs';
import { InterfaceLog } from './interface-log';

// Invented messages; MSA-1 codes AA / AE / AR are HL7 v2 table 0008 (from memory).
const APPLIED: Hl7LogEntry = {
  id: 12,
  receivedAt: '2027-03-12T14:15:00.000Z',
  lastReceivedAt: '2027-03-12T14:16:00.000Z',
  timesReceived: 2,
  sender: 'RIS^INVENTED',
  controlId: 'C-200',
  messageType: 'SIU^S13',
  ackCode: 'AA',
  outcome: 'Edited HL-4: MR 1 09:00 → 09:30 (moved by the booking system after a manual change)',
  accession: 'HL-4',
  day: '2027-03-12',
  changeId: 40,
  afterManualChange: true,
};
const REFUSED: Hl7LogEntry = { ...APPLIED, id: 11, timesReceived: 1, controlId: 'C-199', messageType: 'SIU^S12', ackCode: 'AE', outcome: 'Unknown room "MR 9" (AIL-3)', changeId: null, afterManualChange: false };
const UNREADABLE: Hl7LogEntry = { ...REFUSED, id: 10, controlId: null, messageType: '', ackCode: 'AR', outcome: 'No MSH segment' };
const FIRST: Hl7LogPage = { messages: [APPLIED, REFUSED], before: 11, listener: { host: '127.0.0.1', port: 2575 } };

async function render() {
  const screen = renderSetup(InterfaceLog);
  await settle(screen.fixture);
  return screen;
}

const rowsOf = (page: HTMLElement) =>
  Array.from(page.querySelectorAll('tr.mat-mdc-row')).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.replace(/\s+/g, ' ').trim()));
const button = (page: HTMLElement, text: string) => Array.from(page.querySelectorAll('button')).find((b) => b.textContent!.trim().startsWith(text)) as HTMLButtonElement;

describe('InterfaceLog', () => {
  afterEach(() => {
    const backend = TestBed.inject(HttpTestingController);
    backend.match('/api/settings'); // the site's zone, read by the shell's settings service
    backend.verify();
  });

  it('lists each message with time, type, control id, the ACK code in words and the change or the reason', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/hl7/messages' && r.params.get('limit') === '50' && !r.params.has('ack') && !r.params.has('before')).flush(FIRST);
    await settle(fixture);
    expect(rowsOf(page)).toEqual([
      [expect.stringMatching(/^2027-03-12 \d\d:15:00 received 2 times$/), 'SIU^S13', 'C-200', 'AA applied', `${APPLIED.outcome} moved by the booking system after a manual change`],
      [expect.stringMatching(/^2027-03-12 \d\d:15:00$/), 'SIU^S12', 'C-199', 'AE refused', 'Unknown room "MR 9" (AIL-3)'],
    ]);
    expect(page.querySelector('.ack[data-ack="AE"] mat-icon')).not.toBeNull();
    expect(page.textContent).toContain('127.0.0.1 port 2575');
  });

  it('filters by ACK code and pages to older messages and back', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/hl7/messages').flush(FIRST);
    await settle(fixture);
    expect(button(page, 'Newer messages').disabled).toBe(true);
    button(page, 'Older messages').click();
    await settle(fixture);
    backend.expectOne((r) => r.url === '/api/hl7/messages' && r.params.get('before') === '11').flush({ ...FIRST, messages: [UNREADABLE], before: null });
    await settle(fixture);
    expect(rowsOf(page).map((r) => r[1])).toEqual(['unreadable']);
    expect(button(page, 'Older messages').disabled).toBe(true);
    button(page, 'Newer messages').click();
    await settle(fixture);
    backend.expectOne((r) => r.url === '/api/hl7/messages' && !r.params.has('before')).flush(FIRST);
    await settle(fixture);

    const toggle = Array.from(page.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent!.includes('AR')) as HTMLButtonElement;
    toggle.click();
    await settle(fixture);
    backend.expectOne((r) => r.url === '/api/hl7/messages' && r.params.get('ack') === 'AR' && !r.params.has('before')).flush({ ...FIRST, messages: [UNREADABLE], before: null });
    await settle(fixture);
    expect(rowsOf(page)).toEqual([[expect.any(String), 'unreadable', '(none)', 'AR rejected, unreadable', 'No MSH segment']]);
  });

  it('shows a message as stored, one segment a line, in a dialog', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/hl7/messages').flush(FIRST);
    await settle(fixture);
    (page.querySelector('button.open') as HTMLButtonElement).click();
    await settle(fixture);
    const stored: Hl7LogMessage = { ...APPLIED, raw: 'MSH|^~\\&|RIS|INVENTED\rSCH|PHL-4^RIS|HL-4^RIS\rAIL|1||^MR 1^^IMG' };
    backend.expectOne('/api/hl7/messages/12').flush(stored);
    await settle(fixture);
    const raw = document.querySelector('tw-raw-message-dialog pre.raw')!;
    expect(raw.textContent!.split('\n')).toEqual(['MSH|^~\\&|RIS|INVENTED', 'SCH|PHL-4^RIS|HL-4^RIS', 'AIL|1||^MR 1^^IMG']);
    expect(document.querySelector('tw-raw-message-dialog')!.textContent).toContain('ACK AA (applied)');
  });

  it('says when the log cannot be read', async () => {
    const { fixture, backend, page } = await render();
    backend.expectOne((r) => r.url === '/api/hl7/messages').flush({ error: { code: 'forbidden', message: 'Admins only.' } }, { status: 403, statusText: 'Forbidden' });
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('Admins only.');
  });
});
