import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { PRECAUTION_ICONS } from './exam-tags';

// The Day plan's exam tags' icons, so a precaution looks alike on every screen.
const ICONS: Readonly<Record<string, string>> = PRECAUTION_ICONS;

/** An exam's precaution as icon plus words ("airborne precautions"); "no precautions" for none. */
@Component({
  selector: 'tw-precaution-label',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-precaution-label', '[class.isolation]': 'isolation()' },
  template: `
    @if (isolation()) {
      <mat-icon [svgIcon]="icon()" aria-hidden="true" />{{ precaution() }} precautions
    } @else {
      no precautions
    }
  `,
  styles: `
    :host { display: inline-flex; align-items: center; gap: 4px; }
    :host(.isolation) { font-weight: 600; color: var(--mat-sys-tertiary); }
    mat-icon { width: 20px; height: 20px; }
  `,
})
export class PrecautionLabel {
  readonly precaution = input.required<string>();
  protected readonly isolation = computed(() => this.precaution() !== 'none' && this.precaution() !== '');
  protected readonly icon = computed(() => ICONS[this.precaution()] ?? 'warning');
}
