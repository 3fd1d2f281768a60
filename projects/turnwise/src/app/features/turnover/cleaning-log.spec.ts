import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';

import type { LogEntry } from '@shared/api/board';
import { fakeAuth } from '../../../testing/fake-auth';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { provideIcons } from '../../core/layout/icons';
import { CleaningLog } from './cleaning-log';
import { logCsvUrl } from './log-service';
import { at } from './testing/example-checklist';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };
const ROOMS = { rooms: [{ id: 1, name: 'MR 1', modality: 'MR' }, { id: 2, name: 'CT 2', modality: 'CT' }] };

function entry(id: number, overrides: Partial<LogEntry> = {}): LogEntry {
  return {
    id,
    at: at('10:34'),
    day: '2027-03-15',
    roomId: 1,
    roomName: 'MR 1',
    examAccession: 'ACC-2041',
    cleanType: 'routine',
    kind: 'step',
    stepKey: 'table',
    stepLabel: 'Table top and rails',
    productName: 'Standard surface wipe',
    contactRequiredMinutes: 2,
    contactAchievedMinutes: 5,
    earlyReason: null,
    note: null,
    correctsId: null,
    username: 'robin',
    displayName: 'Robin Example',
    ...overrides,
  };
}

// Invented: one step ticked early (contact short of the label's), and a correction of it.
const ENTRIES = [
  // As the server writes a correction: it copies the step it is about and adds the note.
  entry(8, { kind: 'correction', productName: null, contactRequiredMinutes: null, contactAchievedMinutes: null, note: 'Product was the sporicidal wipe', correctsId: 7, at: at('10:50') }),
  entry(7, { earlyReason: 'Patient waiting on a stretcher', contactAchievedMinutes: 1, protocol: { modality: 'MR', version: 2, effectiveFrom: '2027-03-01' } }),
];

async function render() {
  TestBed.configureTestingModule({
    imports: [CleaningLog],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'casey', role: 'charge' }).provider,
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const fixture = TestBed.createComponent(CleaningLog);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  backend.expectOne('/api/rooms').flush(ROOMS);
  await settle(fixture);
  const first = backend.expectOne((request) => request.url === '/api/log');
  first.flush({ entries: ENTRIES });
  await settle(fixture);
  return { fixture, backend, firstParams: first.request.params, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
const rows = (page: HTMLElement) => Array.from(page.querySelectorAll('tr.mat-mdc-row'));

describe('CleaningLog', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it("renders the day's entries with contact required against achieved and the early reason", async () => {
    const { page, firstParams } = await render();
    expect(firstParams.get('date')).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(firstParams.has('roomId')).toBe(false);
    const step = rows(page)[1];
    expect(text(step.querySelector('.mat-column-step'))).toBe('step Table top and rails');
    // with the protocol version its turnover was planned with
    expect(text(step.querySelector('.mat-column-room'))).toBe('MR 1 ACC-2041 routine clean MR protocol v2 (from 2027-03-01)');
    expect(text(rows(page)[0].querySelector('.mat-column-room'))).toBe('MR 1 ACC-2041 routine clean');
    expect(text(step.querySelector('.mat-column-product'))).toBe('Standard surface wipe 2 min / 1 min');
    expect(step.querySelector('.mat-column-product .contact')!.classList).toContain('short');
    expect(text(step.querySelector('.mat-column-earlyReason'))).toBe('Patient waiting on a stretcher');
    expect(text(step.querySelector('.mat-column-who'))).toBe('Robin Example');
  });

  it('shows the whole entry in seven columns, so a tablet needs no sideways scrolling for who, reason and corrections', async () => {
    const { page } = await render();
    const headers = Array.from(page.querySelectorAll('th')).map((th) => text(th));
    expect(headers).toEqual(['Time', 'Room and exam', 'Entry', 'Product; contact required / achieved', 'Who', 'Early reason', 'Corrections']);
  });

  it('picks the day with the same day picker as every other screen, written in words', async () => {
    const { page, backend, fixture, firstParams } = await render();
    // the browser's own date field writes the day in the computer's locale: it must not be the one shown
    expect(page.querySelector('.filters input[type="date"]:not(.calendar)')).toBeNull();
    const day = firstParams.get('date')!;
    expect(text(page.querySelector('tw-day-picker .long'))).toMatch(/^[A-Z][a-z]+day \d{1,2} [A-Z][a-z]+ \d{4}$/);
    page.querySelector<HTMLButtonElement>('tw-day-picker button[aria-label="Previous day"]')!.click();
    await settle(fixture);
    const request = backend.expectOne((r) => r.url === '/api/log');
    const previous = new Date(`${day}T12:00:00Z`);
    previous.setUTCDate(previous.getUTCDate() - 1);
    expect(request.request.params.get('date')).toBe(previous.toISOString().slice(0, 10));
    request.flush({ entries: [] });
    await settle(fixture);
  });

  it('links a correction and the entry it corrects both ways', async () => {
    const { page } = await render();
    expect(text(rows(page)[0].querySelector('.links a'))).toBe('corrects #7');
    expect(text(rows(page)[1].querySelector('.links a'))).toBe('corrected by #8');
    expect(rows(page)[1].id).toBe('log-7');
    // the step is copied onto the correction; its note must still show
    expect(text(rows(page)[0].querySelector('.mat-column-step'))).toBe('correction Table top and rails Product was the sporicidal wipe');
  });

  it('says entries are never edited or deleted, and offers no way to do either', async () => {
    const { page } = await render();
    expect(text(page.querySelector('.append-only'))).toContain('never edited or deleted');
    const labels = Array.from(page.querySelectorAll('button')).map((b) => text(b).toLowerCase());
    expect(labels.some((label) => /delete|remove|edit/.test(label))).toBe(false);
  });

  it('adds a correction as a new entry', async () => {
    const { page, backend, fixture } = await render();
    rows(page)[1].querySelector<HTMLButtonElement>('button.correct')!.click();
    await settle(fixture);
    const note = page.querySelector<HTMLTextAreaElement>('.correction textarea')!;
    note.value = 'Linen change was done by Sam';
    note.dispatchEvent(new Event('input'));
    await settle(fixture);
    page.querySelector<HTMLButtonElement>('button.save-correction')!.click();
    const request = backend.expectOne('/api/log/7/corrections');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ note: 'Linen change was done by Sam' });
    request.flush(entry(9, { kind: 'correction', note: 'Linen change was done by Sam', correctsId: 7 }));
    await settle(fixture);
    expect(rows(page)).toHaveLength(3);
    expect(page.querySelector('.correction')).toBeNull();
  });

  it('filters by room and person, and the CSV link carries the same filters', async () => {
    const { page, backend, fixture } = await render();
    const room = page.querySelector<HTMLSelectElement>('select[name="room"]')!;
    room.value = '2';
    room.dispatchEvent(new Event('change'));
    const user = page.querySelector<HTMLInputElement>('input[name="user"]')!;
    user.value = 'robin';
    user.dispatchEvent(new Event('change'));
    await settle(fixture);
    const request = backend.expectOne((r) => r.url === '/api/log');
    expect(request.request.params.get('roomId')).toBe('2');
    expect(request.request.params.get('user')).toBe('robin');
    request.flush({ entries: [] });
    await settle(fixture);
    const href = page.querySelector('a.export')!.getAttribute('href')!;
    expect(href).toMatch(/^\/api\/log\.csv\?date=\d{4}-\d{2}-\d{2}&roomId=2&user=robin$/);
    expect(text(page.querySelector('.empty'))).toBe('No entries for these filters.');
  });
});

describe('logCsvUrl', () => {
  it('leaves out the filters that are not set', () => {
    expect(logCsvUrl({ date: '2027-03-15', roomId: null, user: ' ' })).toBe('/api/log.csv?date=2027-03-15');
  });
});
