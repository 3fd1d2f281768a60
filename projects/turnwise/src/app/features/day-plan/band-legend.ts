import { ChangeDetectionStrategy, Component } from '@angular/core';

import { BAND_PART_LABELS, BandPart } from './turnover-band';

/** What the three patterns of a turnover band mean. */
@Component({
  selector: 'tw-band-legend',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-band-legend' },
  template: `
    <span class="title">Turnover band:</span>
    <ul aria-label="Turnover band patterns">
      @for (part of parts; track part) {
        <li><span class="swatch" [attr.data-part]="part" aria-hidden="true"></span>{{ labels[part] }}</li>
      }
    </ul>
  `,
  styles: `
    :host { display: flex; flex-wrap: wrap; align-items: center; gap: 4px 12px; font: var(--mat-sys-body-small); --ink: var(--mat-sys-on-surface); }
    ul { display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 0; padding: 0; list-style: none; }
    li { display: inline-flex; align-items: center; gap: 6px; }
    .title { color: var(--mat-sys-on-surface-variant); }
    .swatch { display: inline-block; width: 28px; height: 12px; border: 1px solid var(--ink); border-radius: 2px; }
    .swatch[data-part='hands-on'] { background: var(--ink); }
    .swatch[data-part='wet-dry'] { background: repeating-linear-gradient(135deg, var(--ink) 0 2px, transparent 2px 6px); }
    .swatch[data-part='air-hold'] { background: radial-gradient(circle, var(--ink) 1.2px, transparent 1.6px) 0 0 / 6px 6px; }
  `,
})
export class BandLegend {
  protected readonly parts: readonly BandPart[] = ['hands-on', 'wet-dry', 'air-hold'];
  protected readonly labels = BAND_PART_LABELS;
}
