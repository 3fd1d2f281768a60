import { DOCUMENT, Injectable, inject } from '@angular/core';

import { ShellChrome } from '../../core/layout/shell-chrome';

/** The wall display's effect on the window: no toolbar or navigation, and full screen when allowed. */
@Injectable()
export class WallDisplay {
  private readonly chrome = inject(ShellChrome);
  private readonly document = inject(DOCUMENT);

  show(on: boolean): void {
    this.chrome.hidden.set(on);
    if (!on && this.document.fullscreenElement) {
      this.document.exitFullscreen().catch(() => undefined);
    }
  }

  /** Must run inside the click that asked for it: browsers refuse full screen otherwise. */
  requestFullscreen(): void {
    const root = this.document.documentElement;
    // Refused in an iframe or by policy: the wall display still works inside the window.
    root.requestFullscreen?.().catch(() => undefined);
  }
}
