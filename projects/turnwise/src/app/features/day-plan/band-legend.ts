import { ChangeDetectionStrategy, Component } from '@angular/core';

import { BAND_PART_LABELS, BandPart } from './turnover-band';

/** What the three patterns of a turnover band mean, drawn with the bands' own fills. */
@Component({
  selector: 'tw-band-legend',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-band-legend' },
  template: `
    <span class="title">Turnover band:</span>
    <ul aria-label="Turnover band patterns">
      @for (part of parts; track part) {
        <li><span class="swatch tw-band-fill" [attr.data-part]="part" aria-hidden="true"></span>{{ labels[part] }}</li>
      }
    </ul>
  `,
  styles: `
    :host { display: flex; flex-wrap: wrap; align-items: center; gap: 4px 12px; font: var(--mat-sys-body-small); }
    ul { display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 0; padding: 0; list-style: none; }
    li { display: inline-flex; align-items: center; gap: 6px; }
    .title { color: var(--mat-sys-on-surface-variant); }
    /* The fills themselves are global (.tw-band-fill in styles.scss), the same as on the lanes' bands. */
    .swatch { display: inline-block; width: 28px; height: 12px; border: 1px solid var(--mat-sys-outline); border-radius: 2px; }
  `,
})
export class BandLegend {
  protected readonly parts: readonly BandPart[] = ['hands-on', 'wet-dry', 'air-hold'];
  protected readonly labels = BAND_PART_LABELS;
}
