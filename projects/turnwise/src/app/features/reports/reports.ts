import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the Reports screen is built. */
@Component({
  selector: 'tw-reports',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Reports</h1>
    <p>Not built yet. This screen will show: turnover minutes per room and day, short gaps, minutes lost and checklist completion, with CSV export.</p>
  `,
})
export class Reports {}
