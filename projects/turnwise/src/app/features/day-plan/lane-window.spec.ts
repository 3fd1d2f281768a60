import { signal } from '@angular/core';

import { LaneWindow } from './lane-window';
import { LANE_HEIGHT_PX } from './lane-size';
import { examplePlan, exampleRoom } from './testing/example-plan';

// Invented: 40 empty rooms, ids 1–40, in that order.
const plan = signal(examplePlan(Array.from({ length: 40 }, (_, i) => exampleRoom([], [], { id: i + 1, name: `Room ${i + 1}` }))));
const scroller = (scrollTop: number, clientHeight: number) => ({ scrollTop, clientHeight }) as HTMLElement;

describe('LaneWindow', () => {
  it('draws the lanes in view and half a view below, not the whole day', () => {
    const window = new LaneWindow(plan);
    window.seen(scroller(0, 4 * LANE_HEIGHT_PX));
    expect([...window.drawn()]).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });

  it('adds the lanes scrolled to and keeps those drawn before', () => {
    const window = new LaneWindow(plan);
    window.seen(scroller(0, 4 * LANE_HEIGHT_PX));
    expect(window.drawn().has(1)).toBe(true);
    window.seen(scroller(20 * LANE_HEIGHT_PX, 4 * LANE_HEIGHT_PX));
    const drawn = window.drawn();
    expect(drawn.has(1)).toBe(true);
    expect([19, 21, 24, 27].every((id) => drawn.has(id))).toBe(true);
    expect(drawn.has(12) || drawn.has(18) || drawn.has(28)).toBe(false);
    expect(drawn.has(40)).toBe(false);
  });

  it('scrolls a lane far below into view and draws it', () => {
    const window = new LaneWindow(plan);
    const element = scroller(0, 4 * LANE_HEIGHT_PX);
    window.seen(element);
    window.reveal(element, 30);
    expect(element.scrollTop).toBeGreaterThan(25 * LANE_HEIGHT_PX);
    expect(window.drawn().has(30)).toBe(true);
  });
});
