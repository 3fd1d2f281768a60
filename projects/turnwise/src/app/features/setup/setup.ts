import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the Setup screen is built. */
@Component({
  selector: 'tw-setup',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Setup</h1>
    <p>Not built yet. This screen will show: rooms, disinfectant products, protocol steps, equipment, users and site settings.</p>
  `,
})
export class Setup {}
