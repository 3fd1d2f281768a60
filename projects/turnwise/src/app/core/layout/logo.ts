import { ChangeDetectionStrategy, Component } from '@angular/core';

/**
 * The Turnwise mark: a scanner bore seen end-on, with a turning arc for the turnover.
 * Decorative, because the product name always sits beside it.
 */
@Component({
  selector: 'tw-logo',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-logo', 'aria-hidden': 'true' },
  template: `
    <svg viewBox="0 0 32 32" width="32" height="32" focusable="false">
      <rect width="32" height="32" rx="8" class="tile" />
      <circle cx="16" cy="16" r="8.5" class="bore" />
      <path d="M16 4.5a11.5 11.5 0 0 1 11.5 11.5" class="arc" />
      <circle cx="16" cy="16" r="2.5" class="dot" />
    </svg>
  `,
  styles: `
    :host { display: inline-flex; }
    .tile { fill: var(--tw-logo-tile, var(--mat-sys-on-primary)); }
    .bore { fill: none; stroke: var(--mat-sys-primary); stroke-width: 3; }
    .arc { fill: none; stroke: var(--mat-sys-tertiary); stroke-width: 3; stroke-linecap: round; }
    .dot { fill: var(--mat-sys-primary); }
  `,
})
export class Logo {}
