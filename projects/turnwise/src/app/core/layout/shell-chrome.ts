import { Injectable, signal } from '@angular/core';

/**
 * Lets a screen take the whole window (Rooms now on a wall display): while `hidden` is true the
 * shell leaves out its toolbar and navigation. The screen that hides them shows them again when
 * it is left, so no other screen ever opens without them.
 */
@Injectable({ providedIn: 'root' })
export class ShellChrome {
  readonly hidden = signal(false);
}
