import { ChangeDetectionStrategy, Component } from '@angular/core';

import { CautionNote } from '../../shared/ui/caution-note';

/** Placeholder until the Turnover screen is built. */
@Component({
  selector: 'tw-turnover',
  imports: [CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Turnover</h1>
    <p>The checklist for the room's current turnover: steps in order, wet and dry countdowns, and who ticked off what with which product.</p>
    <tw-caution-note kind="mr" />
  `,
})
export class Turnover {}
