import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { RoomState } from '@shared/api/board';

/** Icon and plain-language meaning of each room state; the word itself is the product's term. */
export const ROOM_STATE_DISPLAY: Readonly<Record<RoomState, { icon: string; meaning: string }>> = {
  'in exam': { icon: 'sensor_occupied', meaning: 'a patient is being scanned' },
  'turning over': { icon: 'cleaning_services', meaning: 'the room is being cleaned' },
  drying: { icon: 'water_drop', meaning: 'surfaces are wet with disinfectant' },
  'air hold': { icon: 'air', meaning: 'the room stays empty while the air is exchanged' },
  ready: { icon: 'check_circle', meaning: 'ready for the next patient' },
  closed: { icon: 'no_meeting_room', meaning: 'not in use now' },
};

/**
 * A room's state as icon, word and the state's colours from styles.scss (`--tw-state-…`), so it
 * reads without colour; the meaning is in the accessible name.
 */
@Component({
  selector: 'tw-room-state-chip',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-room-state-chip', '[attr.data-state]': 'state()', '[attr.title]': 'display().meaning' },
  template: `
    <mat-icon [svgIcon]="display().icon" aria-hidden="true" />
    <span class="word">{{ state() }}</span>
    <span class="hidden">: {{ display().meaning }}</span>
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      padding: 4px 12px 4px 8px;
      border-radius: 999px;
      font: var(--mat-sys-title-small);
      color: var(--ink);
      background: var(--tint);
      border: 2px solid var(--ink);
    }
    :host([data-state='in exam']) { --ink: var(--tw-state-in-exam-ink); --tint: var(--tw-state-in-exam-tint); }
    :host([data-state='turning over']) { --ink: var(--tw-state-turning-over-ink); --tint: var(--tw-state-turning-over-tint); }
    :host([data-state='drying']) { --ink: var(--tw-state-drying-ink); --tint: var(--tw-state-drying-tint); }
    :host([data-state='air hold']) { --ink: var(--tw-state-air-hold-ink); --tint: var(--tw-state-air-hold-tint); }
    :host([data-state='ready']) { --ink: var(--tw-state-ready-ink); --tint: var(--tw-state-ready-tint); }
    :host([data-state='closed']) { --ink: var(--tw-state-closed-ink); --tint: var(--tw-state-closed-tint); }
    .hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap; }
  `,
})
export class RoomStateChip {
  readonly state = input.required<RoomState>();
  protected readonly display = computed(() => ROOM_STATE_DISPLAY[this.state()] ?? ROOM_STATE_DISPLAY.closed);
}
