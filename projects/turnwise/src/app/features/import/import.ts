import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the Import screen is built. */
@Component({
  selector: 'tw-import',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Import</h1>
    <p>Upload the day list as CSV or Excel, check every row in a preview, then commit it whole.</p>
  `,
})
export class Import {}
