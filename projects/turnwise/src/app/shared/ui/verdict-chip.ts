import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { Verdict } from '@shared/api/plan';

/** Icon and plain-language meaning of each verdict; the word itself is the product's term. */
export const VERDICT_DISPLAY: Readonly<Record<Verdict, { icon: string; meaning: string }>> = {
  fits: { icon: 'done', meaning: 'the turnover fits with room to spare' },
  snug: { icon: 'timelapse', meaning: 'the turnover fits with little to spare' },
  short: { icon: 'warning', meaning: 'the gap is shorter than the turnover' },
  overlap: { icon: 'error', meaning: 'the next exam starts before this one ends' },
};

/**
 * A gap's verdict as a chip: icon, the word and the verdict's colours from styles.scss, so it
 * reads without colour (and without sight: the meaning is in the accessible name).
 */
@Component({
  selector: 'tw-verdict-chip',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'tw-verdict-chip',
    '[attr.data-verdict]': 'verdict()',
    '[attr.title]': 'display().meaning',
  },
  template: `
    <mat-icon [svgIcon]="display().icon" aria-hidden="true" />
    <span class="word">{{ verdict() }}</span>
    <span class="tw-visually-hidden">: {{ display().meaning }}</span>
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 999px;
      font: var(--mat-sys-label-large);
      color: var(--ink);
      background: var(--tint);
      border: 1px solid var(--ink);
    }
    mat-icon { width: 18px; height: 18px; font-size: 18px; }
    :host([data-verdict='fits']) { --ink: var(--tw-verdict-fits-ink); --tint: var(--tw-verdict-fits-tint); }
    :host([data-verdict='snug']) { --ink: var(--tw-verdict-snug-ink); --tint: var(--tw-verdict-snug-tint); }
    :host([data-verdict='short']) { --ink: var(--tw-verdict-short-ink); --tint: var(--tw-verdict-short-tint); }
    :host([data-verdict='overlap']) { --ink: var(--tw-verdict-overlap-ink); --tint: var(--tw-verdict-overlap-tint); }
    .tw-visually-hidden {
      position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap;
    }
  `,
})
export class VerdictChip {
  readonly verdict = input.required<Verdict>();
  protected readonly display = computed(() => VERDICT_DISPLAY[this.verdict()]);
}
