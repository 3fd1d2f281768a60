import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * Which caution to show. Every variant carries the general one; `mr` adds the magnet-room rule
 * for screens about MR rooms, `airborne` the limits of the computed air hold.
 */
export type CautionKind = 'general' | 'mr' | 'airborne';

/**
 * The cautions a whole day calls for: the magnet room's when it has an MR room, the air hold's
 * when any gap holds the room for the air.
 * @example cautionsForDay(plan?.rooms ?? []); // ['general', 'mr']
 */
export function cautionsForDay(rooms: readonly { modality: string; gaps: readonly { airHoldMinutes: number }[] }[]): CautionKind[] {
  const kinds: CautionKind[] = ['general'];
  if (rooms.some((room) => room.modality === 'MR')) kinds.push('mr');
  if (rooms.some((room) => room.gaps.some((gap) => gap.airHoldMinutes > 0))) kinds.push('airborne');
  return kinds;
}

/** The safety caution a screen shows wherever its times could be mistaken for instructions. */
@Component({
  selector: 'tw-caution-note',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { role: 'note', 'aria-label': 'Caution', class: 'tw-caution-note' },
  template: `
    <mat-icon svgIcon="info" aria-hidden="true" />
    <div class="text">
      <p>
        Turnover times are planning aids. The disinfectant's label contact time, your facility's
        infection-prevention policy and local codes always rule.
      </p>
      @if (has('mr')) {
        <p>
          Only MR Safe or suitably MR Conditional cleaning equipment (ASTM F2503 marking) enters the
          magnet room, Zone IV of the ACR MR safety zones. Keep MR Unsafe carts, buckets and mops out.
        </p>
      }
      @if (has('airborne')) {
        <p>
          Air-hold times assume well-mixed air at the room's measured air changes per hour, with the
          patient gone. Poorly mixed air takes longer; follow your infection-prevention team.
        </p>
      }
    </div>
  `,
  styles: `
    :host {
      display: flex;
      gap: 10px;
      align-items: flex-start;
      padding: 10px 14px;
      border-radius: var(--tw-radius-s, 6px);
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface-variant);
      border-left: 4px solid var(--mat-sys-tertiary);
      font: var(--mat-sys-body-small);
    }
    mat-icon { flex: none; color: var(--mat-sys-tertiary); }
    p { margin: 0; }
    p + p { margin-top: 6px; }
  `,
})
export class CautionNote {
  /** One kind, or several when a screen covers MR rooms and airborne holds at once. */
  readonly kind = input<CautionKind | readonly CautionKind[]>('general');

  private readonly kinds = computed(() => {
    const kind = this.kind();
    return typeof kind === 'string' ? [kind] : kind;
  });

  protected has(kind: CautionKind): boolean {
    return this.kinds().includes(kind);
  }
}
