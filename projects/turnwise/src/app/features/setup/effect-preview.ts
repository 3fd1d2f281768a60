import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { EffectPreview as Preview, PreviewGapType, PreviewRequired } from '@shared/api/protocols';
import { SiteTime } from '../../shared/ui/site-time';
import { VerdictChip } from '../../shared/ui/verdict-chip';

const GAP_TYPE_LABELS: Record<PreviewGapType, string> = {
  plain: 'Routine gap',
  'contrast-next': 'Contrast exam next',
  'coil-change': 'Coil change',
  contact: 'After contact precautions',
  enteric: 'After enteric precautions',
  droplet: 'After droplet precautions',
  airborne: 'After airborne precautions',
  opening: 'Room opening',
};

/**
 * What a product or protocol draft would change, shown before it is saved: required minutes for
 * the common gap types (before → after) and the stored gaps of today and the next 7 days whose
 * verdict would change.
 */
@Component({
  selector: 'tw-effect-preview',
  imports: [SiteTime, VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let answer = preview();
    <section class="preview" aria-label="Effect of this change">
      <h3>Effect of this change</h3>
      @if (answer.problems.length > 0) {
        <p class="problem" role="alert">This draft would be refused: {{ problemText() }}</p>
      }
      @for (warning of answer.warnings; track $index) {
        <p class="warning">{{ warning.message }}</p>
      }
      @if (changed().length === 0) {
        <p>No required minutes change for the common gap types.</p>
      } @else {
        <table class="required" aria-label="Required minutes, before and after">
          <thead><tr><th scope="col">Modality</th><th scope="col">Gap</th><th scope="col">Before</th><th scope="col">After</th></tr></thead>
          <tbody>
            @for (row of changed(); track row.modality + row.gapType) {
              <tr>
                <td>{{ row.modality === '*' ? 'Other (*)' : row.modality }}</td>
                <td>{{ gapLabel(row) }}</td>
                <td>{{ minutes(row.before) }}</td>
                <td>{{ minutes(row.after) }}</td>
              </tr>
            }
          </tbody>
        </table>
      }
      @if (answer.changes.length === 0) {
        <p>No gap from {{ answer.days[0] }} to {{ answer.days[answer.days.length - 1] }} changes verdict.</p>
      } @else {
        <p>{{ answer.changes.length }} {{ answer.changes.length === 1 ? 'gap changes' : 'gaps change' }} verdict from {{ answer.days[0] }} to {{ answer.days[answer.days.length - 1] }}:</p>
        <ul class="changes">
          @for (change of answer.changes; track change.date + change.roomId + change.time) {
            <li>
              {{ change.date }} {{ change.time | siteTime }}, {{ change.roomName }} ({{ change.accessions[1] }}):
              @if (change.before; as before) { <tw-verdict-chip [verdict]="before.verdict" /> {{ before.requiredMinutes }} min } @else { no numbers }
              →
              @if (change.after; as after) { <tw-verdict-chip [verdict]="after.verdict" /> {{ after.requiredMinutes }} min } @else { no numbers }
            </li>
          }
        </ul>
      }
    </section>
  `,
  styles: `
    .preview { border-top: 1px solid var(--mat-sys-outline-variant); margin-top: 8px; padding-top: 4px; }
    h3 { font: var(--mat-sys-title-small); margin: 8px 0 4px; }
    p { margin: 4px 0; }
    .problem { color: var(--mat-sys-error); }
    .warning { color: var(--mat-sys-tertiary); }
    table { border-collapse: collapse; margin: 4px 0; }
    th, td { text-align: left; padding: 2px 12px 2px 0; }
    th { font-weight: 500; }
    .changes { margin: 4px 0; padding-left: 20px; }
    .changes li { margin: 2px 0; }
  `,
})
export class EffectPreview {
  readonly preview = input.required<Preview>();
  /** Only the rows that change: the rest would be noise. */
  protected readonly changed = computed(() => this.preview().required.filter((row) => row.before !== row.after));
  protected readonly problemText = computed(() => this.preview().problems.map((p) => p.message).join('; '));

  protected gapLabel(row: PreviewRequired): string {
    return GAP_TYPE_LABELS[row.gapType] ?? row.gapType;
  }

  protected minutes(value: number | null): string {
    return value === null ? 'no protocol' : `${value} min`;
  }
}
