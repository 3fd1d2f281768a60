import { ChangeDetectionStrategy, Component } from '@angular/core';

import { CautionNote } from '../../shared/ui/caution-note';

/** Placeholder until the Day plan screen is built. */
@Component({
  selector: 'tw-day-plan',
  imports: [CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Day plan</h1>
    <p>One lane per room with its exam slots and the computed turnover between them, each gap marked fits, snug, short or overlap, and slots you can drag to fix the short ones.</p>
    <tw-caution-note kind="mr" />
  `,
})
export class DayPlan {}
