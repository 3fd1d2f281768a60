import { ChangeDetectionStrategy, Component, effect, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { EQUIPMENT_KIND_LABELS, MR_MARKING_LABELS, ZONE_IV_MARKINGS, type EquipmentItem } from '@shared/api/equipment';
import { KIT_ZONE_LABELS } from '@shared/api/mr-zones';
import { serverState } from '../../core/state/server-state';
import { TurnoverService } from './turnover-service';

/**
 * An MR room's cleaning kit with each item's ASTM F2503 marking, the room's zone layout (the
 * ACR's four zones) and the magnet-room caution: what a technologist checks before taking
 * anything through the Zone IV door.
 */
@Component({
  selector: 'tw-mr-kit-panel',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="mr-kit-title" class="panel">
      <h2 id="mr-kit-title">MR safety: kit and zones</h2>
      <div class="caution" role="note" aria-label="MR safety caution">
        <mat-icon svgIcon="warning" aria-hidden="true" />
        <p>
          The magnet is always on. Only items marked <strong>MR Safe</strong> or <strong>MR Conditional</strong>
          (ASTM F2503), within their stated conditions, enter Zone IV, the magnet room (ACR MR safety zones).
          Your local MR safety policy and your MR safety officer rule; when in doubt, keep it out.
        </p>
      </div>
      @if (kit.value(); as answer) {
        @if (answer.mrZones; as zones) {
          <dl class="zones">
            <dt>Kit kept in</dt>
            <dd>{{ zones.kitKeptIn ? kitZoneLabels[zones.kitKeptIn] : 'not said' }}</dd>
            @if (zones.zoneIvAreas) {
              <dt>Zone IV</dt>
              <dd>{{ zones.zoneIvAreas }}</dd>
            }
            @if (zones.notes) {
              <dt>Notes</dt>
              <dd>{{ zones.notes }}</dd>
            }
          </dl>
        }
        @if (answer.kit.length === 0) {
          <p class="quiet">No cleaning kit is set up for this room (Setup, Rooms, Kit).</p>
        } @else {
          <ul class="kit" aria-label="Cleaning kit">
            @for (item of answer.kit; track item.id) {
              <li [class.refused]="!mayEnter(item)">
                <span class="name">{{ item.name }}</span>&ngsp;
                <span class="kind">{{ kindLabels[item.kind] }}</span>&ngsp;
                <span class="marking">
                  <mat-icon [svgIcon]="mayEnter(item) ? 'check_circle' : 'warning'" aria-hidden="true" />
                  {{ markingLabels[item.marking] }}{{ mayEnter(item) ? '' : ': keep out of Zone IV' }}
                </span>
                @if (item.marking === 'mr-conditional') {
                  &ngsp;<span class="conditions">Conditions: {{ item.conditions }}</span>
                }
              </li>
            }
          </ul>
        }
      } @else if (kit.error(); as problem) {
        <p class="quiet" role="alert">{{ problem.message }}</p>
      } @else {
        <p class="quiet" role="status">Loading the kit…</p>
      }
    </section>
  `,
  styles: `
    .panel h2 {
      margin: 0 0 8px;
      font: var(--mat-sys-title-large);
    }
    .caution {
      display: flex;
      gap: 10px;
      align-items: flex-start;
      padding: 10px 14px;
      border-left: 4px solid var(--mat-sys-error);
      background: var(--mat-sys-surface-container);
      border-radius: var(--tw-radius-s, 6px);
      p { margin: 0; }
      mat-icon { flex: none; color: var(--mat-sys-error); }
    }
    .zones {
      display: grid;
      grid-template-columns: max-content 1fr;
      gap: 4px 16px;
      margin: 12px 0;
      dt { font-weight: 500; }
      dd { margin: 0; }
    }
    .kit {
      list-style: none;
      margin: 12px 0 0;
      padding: 0;
      display: grid;
      gap: 6px;
    }
    .kit li {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      align-items: center;
      padding: 8px 12px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--tw-radius-s, 6px);
    }
    .kit li.refused {
      border: 2px dashed var(--mat-sys-error);
    }
    .name { font-weight: 500; }
    .marking {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      mat-icon { width: 18px; height: 18px; }
    }
    .conditions { flex-basis: 100%; color: var(--mat-sys-on-surface-variant); }
    .quiet { margin: 12px 0 0; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class MrKitPanel {
  private readonly service = inject(TurnoverService);
  readonly roomId = input.required<number>();
  protected readonly kit = serverState((roomId: number) => this.service.kit(roomId), 'The room’s kit could not be shown.');
  protected readonly kindLabels = EQUIPMENT_KIND_LABELS;
  protected readonly markingLabels = MR_MARKING_LABELS;
  protected readonly kitZoneLabels = KIT_ZONE_LABELS;

  constructor() {
    effect(() => this.kit.show(this.roomId()));
  }

  /** The API keeps MR Unsafe and unmarked items out of an MR room's kit; a room turned MR later could still list one. */
  protected mayEnter(item: EquipmentItem): boolean {
    return ZONE_IV_MARKINGS.includes(item.marking);
  }
}
