import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { Fix } from '@shared/fixes/model';
import { SiteTime } from '../../shared/ui/site-time';
import { VerdictChip } from '../../shared/ui/verdict-chip';

/**
 * A fix that leaves its gap still short or overlapping: it helps, but does not fix the gap.
 *
 * @example
 * isPartialFix({ ...fix, effect: { ...fix.effect, verdictAfter: 'short', shortByAfter: 8 } }); // true
 */
export function isPartialFix(fix: Pick<Fix, 'effect'>): boolean {
  return fix.effect.shortByAfter > 0 || fix.effect.verdictAfter === 'short' || fix.effect.verdictAfter === 'overlap';
}

/**
 * One suggested fix: what it does, the gap's verdict afterwards, how the day's end moves and
 * whether it makes other gaps short. A fix that does asks once more before it is applied. A fix
 * that only helps says so in its heading and its effect, so it is not taken for a full fix.
 */
@Component({
  selector: 'tw-fix-card',
  imports: [MatButtonModule, MatIconModule, SiteTime, VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-fix-card', '[attr.data-fix-id]': 'fix().id', '[class.partial]': 'partial()' },
  template: `
    <h4>
      @if (partial()) {
        <span class="helps-tag">helps</span>
      }
      {{ fix().title }}
    </h4>
    <p class="detail">{{ fix().detail }}</p>
    <ul class="effect">
      <li>
        Afterwards <tw-verdict-chip [verdict]="fix().effect.verdictAfter" />
        @if (partial()) {
          <strong class="helps">helps: still short by {{ fix().effect.shortByAfter }} min</strong>
        }
      </li>
      <li>Day ends {{ fix().effect.dayEndsBefore | siteTime }} → {{ fix().effect.dayEndsAfter | siteTime }}</li>
      @if (risky()) {
        <li class="warning">
          <mat-icon svgIcon="warning" aria-hidden="true" />
          Makes {{ fix().effect.newProblems }} other {{ fix().effect.newProblems === 1 ? 'gap' : 'gaps' }} short
        </li>
      }
    </ul>
    @if (mayApply()) {
      @if (confirming()) {
        <div class="confirm" role="group" aria-label="Confirm the fix">
          <p>
            This fix makes {{ fix().effect.newProblems }} other {{ fix().effect.newProblems === 1 ? 'gap' : 'gaps' }} short. Apply it
            anyway?
          </p>
          <button mat-flat-button type="button" class="apply-anyway" [disabled]="busy()" (click)="applied.emit(true)">Apply anyway</button>
          <button mat-button type="button" (click)="confirming.set(false)">Cancel</button>
        </div>
      } @else {
        <button mat-stroked-button type="button" class="apply" [disabled]="busy()" (click)="apply()">
          <mat-icon svgIcon="auto_fix_high" />Apply
        </button>
      }
    }
  `,
  styles: `
    :host { display: grid; gap: 6px; padding: 10px 12px; border-radius: var(--tw-radius-s); background: var(--mat-sys-surface); border: 1px solid var(--mat-sys-outline-variant); }
    h4 { margin: 0; font: var(--mat-sys-title-small); }
    :host(.partial) { border-style: dashed; background: var(--mat-sys-surface-container-low); }
    .helps-tag { margin-right: 6px; padding: 0 6px; border: 1px solid var(--tw-verdict-snug-ink); border-radius: 3px; color: var(--tw-verdict-snug-ink); font: var(--mat-sys-label-medium); }
    .helps { color: var(--tw-verdict-short-ink); }
    .detail { margin: 0; }
    .effect { display: grid; gap: 4px; margin: 0; padding: 0; list-style: none; font: var(--mat-sys-body-small); }
    .effect li { display: flex; flex-wrap: wrap; align-items: center; gap: 6px; }
    .warning { color: var(--tw-verdict-short-ink); font-weight: 600; }
    .warning mat-icon { width: 18px; height: 18px; }
    .confirm { display: flex; flex-wrap: wrap; align-items: center; gap: 8px; }
    .confirm p { margin: 0; flex-basis: 100%; font-weight: 600; }
    .apply { justify-self: start; }
  `,
})
export class FixCard {
  readonly fix = input.required<Fix>();
  readonly mayApply = input(false);
  readonly busy = input(false);
  /** Emits whether the new problems the fix causes were accepted. */
  readonly applied = output<boolean>();

  protected readonly risky = computed(() => this.fix().effect.newProblems > 0);
  protected readonly partial = computed(() => isPartialFix(this.fix()));
  protected readonly confirming = signal(false);

  protected apply(): void {
    if (this.risky()) this.confirming.set(true);
    else this.applied.emit(false);
  }
}
