import { TestBed } from '@angular/core/testing';

import { provideIcons } from '../../core/layout/icons';
import { RoomLane } from './room-lane';
import { exampleExam, exampleGap, exampleRoom } from './testing/example-plan';

// Invented lane: MR 1 with one exam at 08:00 after its opening.
const room = exampleRoom([exampleExam(1, '08:00', '08:30')], [exampleGap(null, 1, 'fits', { availableMinutes: 60, requiredMinutes: 7 })]);
const scale = { startMs: Date.parse('2027-03-15T07:00:00-05:00'), endMs: Date.parse('2027-03-15T19:00:00-05:00'), pxPerMinute: 4, widthPx: 2880 };

async function lane(drawn: boolean, shown = room): Promise<HTMLElement> {
  TestBed.configureTestingModule({ imports: [RoomLane], providers: [provideIcons()] });
  const fixture = TestBed.createComponent(RoomLane);
  fixture.componentRef.setInput('room', shown);
  fixture.componentRef.setInput('scale', scale);
  fixture.componentRef.setInput('drawn', drawn);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('RoomLane', () => {
  it('draws its slots and gaps when drawn, the header then being no tab stop of its own', async () => {
    const page = await lane(true);
    expect(page.querySelectorAll('tw-exam-block')).toHaveLength(1);
    expect(page.querySelectorAll('tw-gap-marker')).toHaveLength(1);
    expect(page.querySelector('.header')!.getAttribute('tabindex')).toBeNull();
  });

  it("says on hover that the header's times are its exams', not the room's opening hours", async () => {
    const span = (await lane(true)).querySelector('.span > span')!;
    expect(span.textContent!.trim()).toBe('08:00–08:30');
    expect(span.getAttribute('title')).toBe("First exam starts 08:00, last one ends 08:30 (the room's opening hours are in Setup)");
  });

  it('shows only its header when not drawn, and keeps it a tab stop so focus can bring the lane into view', async () => {
    const page = await lane(false);
    expect(page.querySelectorAll('tw-exam-block, tw-gap-marker')).toHaveLength(0);
    expect(page.querySelector('.header')!.textContent).toContain('MR 1');
    expect(page.querySelector('.header')!.getAttribute('tabindex')).toBe('0');
  });

  it("says a room has no protocol (and draws its exams without gaps) instead of numbers", async () => {
    const message = 'No protocol for CT: set one up in Setup';
    const page = await lane(true, exampleRoom([exampleExam(1, '08:00', '08:30')], [], { modality: 'CT', protocol: null, message }));
    expect(page.querySelector('.no-protocol')!.textContent!.trim()).toBe(message);
    expect(page.querySelectorAll('tw-exam-block')).toHaveLength(1);
    expect(page.querySelectorAll('tw-gap-marker')).toHaveLength(0);
  });

  it('says nothing of protocols when the room has one', async () => {
    expect((await lane(true)).querySelector('.no-protocol')).toBeNull();
  });

  it('says a room is closed on a weekday its hours close it, and shades the whole lane as closed time', async () => {
    const closedDay = exampleRoom([], [], { closed: true, opensAt: '2027-03-15T07:00:00-05:00', closesAt: '2027-03-15T07:00:00-05:00' });
    const page = await lane(true, closedDay);
    expect(page.querySelector('.closed-day')!.textContent).toContain('Closed this day');
    const shaded = Array.from(page.querySelectorAll<HTMLElement>('.track > .closed')).reduce((sum, el) => sum + parseFloat(el.style.width), 0);
    expect(shaded).toBe(scale.widthPx);
  });

  it('says nothing of a closed day when the room is open', async () => {
    expect((await lane(true)).querySelector('.closed-day')).toBeNull();
  });
});
