import type { EquipmentItem } from '@shared/api/equipment';
import type { SetupRoom } from '@shared/api/rooms';
import { button, errorUnder, refusal, renderSetup as render, settle, submit, type } from '../../../testing/setup-dialogs';
import { KitDialog } from './kit-dialog';
import { RoomDialog } from './room-dialog';
import { UserDialog } from './user-dialog';

const WEEK = [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, closed: weekday === 7, opensAt: '07:00', closesAt: '19:00' }));
const MR2: SetupRoom = { id: 2, name: 'MR 2', modality: 'MR', airChangesPerHour: 12, staff: 1, opensAt: '07:00', closesAt: '19:00', retired: false, retiredAt: null, week: WEEK, mrZones: null, hl7Code: null };

describe('RoomDialog', () => {
  it('puts the API’s 422 problems under their fields and stays open', async () => {
    const { fixture, backend, page, close } = render(RoomDialog, MR2);
    await settle(fixture);
    type(page, 'input[formcontrolname="name"]', 'MR 1');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/rooms/2' });
    expect(request.request.body).toMatchObject({ name: 'MR 1', modality: 'MR', airChangesPerHour: 12, staff: 1 });
    request.flush(
      { error: { code: 'validation_failed', message: 'A room named "MR 1" already exists.', details: { problems: [{ field: 'name', message: 'already exists' }] } } },
      { status: 422, statusText: 'Unprocessable' },
    );
    await settle(fixture);
    expect(errorUnder(page, 'input[formcontrolname="name"]')).toBe('already exists');
    expect(close).not.toHaveBeenCalled();
  });

  it('checks the same limits before sending (air changes 1–60) and closes with the saved room', async () => {
    const { fixture, backend, page, close } = render(RoomDialog, null);
    await settle(fixture);
    type(page, 'input[formcontrolname="name"]', 'CT 2');
    type(page, 'input[formcontrolname="airChangesPerHour"]', '0');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/rooms');
    expect(errorUnder(page, 'input[formcontrolname="airChangesPerHour"]')).toBe('at least 1');

    type(page, 'input[formcontrolname="airChangesPerHour"]', '15');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/rooms' });
    request.flush({ room: { ...MR2, id: 9, name: 'CT 2', airChangesPerHour: 15 } }, { status: 201, statusText: 'Created' });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(expect.objectContaining({ id: 9, name: 'CT 2' }));
  });

  it('sends the HL7 location code and shows a code another room has under its field', async () => {
    const { fixture, backend, page, close } = render(RoomDialog, { ...MR2, hl7Code: 'MRI-2' });
    await settle(fixture);
    expect(page.querySelector<HTMLInputElement>('input[formcontrolname="hl7Code"]')!.value).toBe('MRI-2');
    type(page, 'input[formcontrolname="hl7Code"]', 'MRI-1');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/rooms/2' });
    expect(request.request.body).toMatchObject({ name: 'MR 2', hl7Code: 'MRI-1' });
    request.flush(...refusal([{ field: 'hl7Code', message: "already MR 1's" }]));
    await settle(fixture);
    expect(errorUnder(page, 'input[formcontrolname="hl7Code"]')).toBe("already MR 1's");
    expect(close).not.toHaveBeenCalled();
  });

  it('shows the MR caution (ASTM F2503, Zone IV) for an MR room', async () => {
    const { fixture, page } = render(RoomDialog, MR2);
    await settle(fixture);
    expect(page.textContent).toMatch(/ASTM F2503/);
    expect(page.textContent).toMatch(/Zone IV/);
  });
});

describe('RoomDialog week editor', () => {
  const time = (weekday: number, which: 'opens' | 'closes') => `input[aria-label="${['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'][weekday - 1]} ${which} at"]`;
  const closedBox = (page: HTMLElement, weekday: number) => page.querySelectorAll<HTMLInputElement>('.day input[type="checkbox"]')[weekday - 1]!;

  it('edits Monday to Sunday, copies Monday to the other weekdays, and sends the whole week', async () => {
    const { fixture, backend, page } = render(RoomDialog, MR2);
    await settle(fixture);
    expect(Array.from(page.querySelectorAll('.day .name')).map((n) => n.textContent)).toEqual(['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday']);
    // Sunday is closed: its times are kept but not editable
    expect(closedBox(page, 7).checked).toBe(true);
    expect(page.querySelector<HTMLInputElement>(time(7, 'opens'))!.disabled).toBe(true);

    type(page, time(1, 'opens'), '08:00');
    type(page, time(1, 'closes'), '17:00');
    button(page, 'Copy Monday').click();
    type(page, time(6, 'closes'), '12:30');
    closedBox(page, 7).click();
    await settle(fixture);
    type(page, time(7, 'opens'), '22:00');
    type(page, time(7, 'closes'), '02:00'); // over midnight, as the engine reads it
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/rooms/2' });
    expect(request.request.body.week).toEqual([
      { weekday: 1, closed: false, opensAt: '08:00', closesAt: '17:00' },
      { weekday: 2, closed: false, opensAt: '08:00', closesAt: '17:00' },
      { weekday: 3, closed: false, opensAt: '08:00', closesAt: '17:00' },
      { weekday: 4, closed: false, opensAt: '08:00', closesAt: '17:00' },
      { weekday: 5, closed: false, opensAt: '08:00', closesAt: '17:00' },
      { weekday: 6, closed: false, opensAt: '07:00', closesAt: '12:30' },
      { weekday: 7, closed: false, opensAt: '22:00', closesAt: '02:00' },
    ]);
    // the usual hours stay as stored on an edit
    expect(request.request.body).toMatchObject({ opensAt: '07:00', closesAt: '19:00' });
  });

  it('refuses a day that closes when it opens before sending, and puts the API’s problem on its day', async () => {
    const { fixture, backend, page } = render(RoomDialog, MR2);
    await settle(fixture);
    type(page, time(3, 'closes'), '07:00');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/rooms/2');
    expect(errorUnder(page, time(3, 'closes'))).toMatch(/must differ from the opening time/);

    type(page, time(3, 'closes'), '19:00');
    submit(page);
    backend.expectOne({ method: 'PUT', url: '/api/rooms/2' }).flush(...refusal([{ field: 'week.4.opensAt', message: 'use HH:MM (24-hour)' }]));
    await settle(fixture);
    expect(errorUnder(page, time(5, 'opens'))).toBe('use HH:MM (24-hour)');
  });
});

describe('RoomDialog MR zones', () => {
  it('records where an MR room’s kit is kept and what is Zone IV (the ACR’s four zones), and sends it', async () => {
    const { fixture, backend, page } = render(RoomDialog, { ...MR2, mrZones: { kitKeptIn: 'zone-iii', zoneIvAreas: '', notes: '' } });
    await settle(fixture);
    // ACR Manual on MR Safety: Zone I public … Zone IV the magnet room
    expect(page.querySelector('tw-room-mr-zones')!.textContent).toMatch(/ACR Manual on MR Safety.*Zone I public areas.*Zone IV the magnet room/s);
    type(page, 'textarea[formcontrolname="zoneIvAreas"]', 'Magnet room and the door from the control room');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/rooms/2' });
    expect(request.request.body.mrZones).toEqual({ kitKeptIn: 'zone-iii', zoneIvAreas: 'Magnet room and the door from the control room', notes: '' });
  });

  it('has no zone layout for a room that is not MR, and sends none', async () => {
    const { fixture, backend, page } = render(RoomDialog, { ...MR2, modality: 'CT', name: 'CT 1' });
    await settle(fixture);
    expect(page.querySelector('tw-room-mr-zones')).toBeNull();
    submit(page);
    expect(backend.expectOne({ method: 'PUT', url: '/api/rooms/2' }).request.body).not.toHaveProperty('mrZones');
  });
});

describe('UserDialog', () => {
  it('states and checks the password policy before sending', async () => {
    const { fixture, backend, page } = render(UserDialog, null);
    await settle(fixture);
    expect(page.textContent).toContain('At least 12 characters');
    type(page, 'input[formcontrolname="username"]', 'rtaylor');
    type(page, 'input[formcontrolname="displayName"]', 'Robin Taylor');
    type(page, 'input[formcontrolname="email"]', 'robin@example.org');
    type(page, 'input[formcontrolname="password"]', 'short');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/users');
    expect(errorUnder(page, 'input[formcontrolname="password"]')).toBe('use at least 12 characters');
  });

  it('shows a taken username under the username field', async () => {
    const { fixture, backend, page, close } = render(UserDialog, null);
    await settle(fixture);
    type(page, 'input[formcontrolname="username"]', 'tech');
    type(page, 'input[formcontrolname="displayName"]', 'Another Tech');
    type(page, 'input[formcontrolname="email"]', 'tech2@example.org');
    type(page, 'input[formcontrolname="password"]', 'a-long-first-password');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/users' });
    expect(request.request.body).toEqual({ username: 'tech', displayName: 'Another Tech', email: 'tech2@example.org', role: 'tech', password: 'a-long-first-password' });
    request.flush({ error: { code: 'validation_failed', message: 'taken', details: { problems: [{ field: 'username', message: 'already taken' }] } } }, { status: 422, statusText: 'Unprocessable' });
    await settle(fixture);
    expect(errorUnder(page, 'input[formcontrolname="username"]')).toBe('already taken');
    expect(close).not.toHaveBeenCalled();
  });

  it('shows the last-admin refusal (409) as the form’s message', async () => {
    const admin = { id: 1, username: 'admin', displayName: 'Sam', email: null, role: 'admin', active: true, mustChangePassword: false, createdAt: '' };
    const { fixture, backend, page } = render(UserDialog, admin);
    await settle(fixture);
    type(page, 'input[formcontrolname="email"]', 'sam@example.org');
    submit(page);
    backend
      .expectOne({ method: 'PATCH', url: '/api/users/1' })
      .flush({ error: { code: 'last_admin', message: 'Sam is the last active admin: make another admin first.' } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('last active admin');
  });
});

describe('KitDialog', () => {
  const item = (id: number, name: string, marking: EquipmentItem['marking']): EquipmentItem => ({ id, name, kind: 'mop', marking, conditions: marking === 'mr-conditional' ? '3 T or less' : '', notes: '', retired: false, roomIds: [] });

  it('an MR room cannot take MR Unsafe or unmarked items (ASTM F2503, Zone IV); the API’s refusal is shown', async () => {
    const equipment = [item(1, 'Fibreglass mop', 'mr-safe'), item(2, 'Steel bucket', 'mr-unsafe'), item(3, 'Old bottle', 'not-marked'), item(4, 'Plastic cart', 'mr-conditional')];
    const { fixture, backend, page } = render(KitDialog, { room: MR2, equipment });
    await settle(fixture);
    const boxes = Array.from(page.querySelectorAll<HTMLInputElement>('input[type="checkbox"]'));
    expect(boxes.map((b) => b.disabled)).toEqual([false, true, true, false]);
    expect(page.textContent).toContain('Not allowed in Zone IV (ASTM F2503 marking: MR Unsafe)');
    expect(page.textContent).toContain('Conditions: 3 T or less');

    boxes[0]!.click();
    await settle(fixture);
    Array.from(page.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Save kit'))!.click();
    const request = backend.expectOne({ method: 'PUT', url: '/api/rooms/2/kit' });
    expect(request.request.body).toEqual({ equipmentIds: [1] });
    // the server has the last word (an item re-marked meanwhile)
    request.flush(
      { error: { code: 'kit_not_mr_safe', message: 'MR 2 is an MR room: … ASTM F2503 … Zone IV', details: { items: [], problems: [] } } },
      { status: 422, statusText: 'Unprocessable' },
    );
    await settle(fixture);
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('ASTM F2503');
  });
});
