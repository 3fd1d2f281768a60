import { Injectable, Injector, inject } from '@angular/core';
import type { MatSnackBar } from '@angular/material/snack-bar';

/** How long an error stays on screen unless dismissed; long enough to read a sentence twice. */
const SHOWN_FOR_MS = 8000;

/**
 * Tells the user about a failed request in a snack bar. The snack bar brings the CDK overlay and
 * Material's button and ripple (~110 kB), which no first screen needs, so it is loaded on first
 * use, or ahead of time by {@link preload} once a signed-in screen is up: an "unreachable server"
 * error must not depend on fetching code from that server.
 */
@Injectable({ providedIn: 'root' })
export class ErrorNotice {
  private readonly injector = inject(Injector);
  private snackBar: Promise<MatSnackBar> | null = null;

  show(message: string): void {
    this.load().then(
      (snackBar) => snackBar.open(message, 'Dismiss', { duration: SHOWN_FOR_MS }),
      (failure: unknown) => console.error('Could not show the error', message, failure),
    );
  }

  /** Fetches the snack bar's code now, so the first error shows even if the server is gone by then. */
  preload(): void {
    this.load().catch(() => undefined);
  }

  private load(): Promise<MatSnackBar> {
    this.snackBar ??= import('@angular/material/snack-bar').then(
      (module) => this.injector.get(module.MatSnackBar),
      (failure: unknown) => {
        // Forget the failed fetch, so the next error tries again.
        this.snackBar = null;
        throw failure;
      },
    );
    return this.snackBar;
  }
}
