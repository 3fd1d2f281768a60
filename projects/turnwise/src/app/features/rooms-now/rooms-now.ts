import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the Rooms now screen is built. */
@Component({
  selector: 'tw-rooms-now',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Rooms now</h1>
    <p>The front-desk board: each room's state, when it is ready, and the next patient slot, updating live.</p>
  `,
})
export class RoomsNow {}
