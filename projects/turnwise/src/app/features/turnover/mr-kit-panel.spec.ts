import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { EquipmentItem } from '@shared/api/equipment';
import type { RoomKitAnswer } from '@shared/api/mr-zones';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { provideIcons } from '../../core/layout/icons';
import { MrKitPanel } from './mr-kit-panel';

// Invented kit items; the markings are ASTM F2503's words.
const item = (id: number, name: string, kind: EquipmentItem['kind'], marking: EquipmentItem['marking'], conditions = ''): EquipmentItem => ({
  id, name, kind, marking, conditions, notes: '', retired: false, roomIds: [1],
});
const KIT: RoomKitAnswer = {
  kit: [
    item(1, 'Fibreglass mop', 'mop', 'mr-safe'),
    item(2, 'Plastic cart', 'cart', 'mr-conditional', '3 T or less; spatial gradient 20 T/m or less'),
  ],
  mrZones: { kitKeptIn: 'zone-iii', zoneIvAreas: 'Magnet room; door M1 from the control room', notes: '' },
};

async function render(answer: RoomKitAnswer) {
  TestBed.configureTestingModule({
    imports: [MrKitPanel],
    providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting(), provideIcons(), { provide: MatSnackBar, useValue: { open: jest.fn() } }],
  });
  const fixture = TestBed.createComponent(MrKitPanel);
  fixture.componentRef.setInput('roomId', 1);
  await fixture.whenStable();
  TestBed.inject(HttpTestingController).expectOne('/api/rooms/1/kit').flush(answer);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

const text = (el: Element | null) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

describe('MrKitPanel', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('lists the room’s kit with each item’s ASTM F2503 marking, an MR Conditional item’s conditions, and the zones', async () => {
    const page = await render(KIT);
    const rows = Array.from(page.querySelectorAll('.kit li')).map(text);
    expect(rows).toEqual([
      'Fibreglass mop Mop MR Safe',
      'Plastic cart Cart MR Conditional Conditions: 3 T or less; spatial gradient 20 T/m or less',
    ]);
    const terms = Array.from(page.querySelectorAll('.zones dt, .zones dd')).map(text);
    expect(terms).toEqual(['Kit kept in', 'Zone III', 'Zone IV', 'Magnet room; door M1 from the control room']);
  });

  it('shows the caution: only MR Safe or MR Conditional items enter Zone IV, the magnet is always on, local policy and the MR safety officer rule', async () => {
    const caution = text((await render(KIT)).querySelector('[role="note"]'));
    // ASTM F2503 markings; ACR MR safety zones (Zone IV, the magnet room)
    expect(caution).toMatch(/magnet is always on/);
    expect(caution).toMatch(/Only items marked MR Safe or MR Conditional \(ASTM F2503\).*enter Zone IV/);
    expect(caution).toMatch(/local MR safety policy and your MR safety officer rule/);
  });

  it('marks an item that may not enter Zone IV (a room turned MR later) in words and with its own border', async () => {
    const page = await render({ kit: [item(3, 'Steel bucket', 'bucket', 'mr-unsafe')], mrZones: null });
    const row = page.querySelector('.kit li')!;
    expect(row.classList).toContain('refused');
    expect(text(row)).toContain('MR Unsafe: keep out of Zone IV');
    expect(page.querySelector('.zones')).toBeNull();
  });

  it('says when no kit is set up', async () => {
    expect(text((await render({ kit: [], mrZones: null })).querySelector('.quiet'))).toMatch(/No cleaning kit is set up/);
  });
});
