import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { SetupChecklistItem } from '@shared/api/protocols';
import { serverState } from '../../core/state/server-state';
import { ProtocolsApi } from './protocols-api';

const ITEMS: Record<SetupChecklistItem['key'], { title: string; tab: string }> = {
  rooms: { title: 'Rooms', tab: 'rooms' },
  products: { title: 'Disinfectant products', tab: 'products' },
  protocols: { title: 'A protocol for each modality in use', tab: 'protocols' },
  users: { title: 'An account for each role', tab: 'users' },
};

/** Where a dismissal is kept: for this browser tab's session, so the next sign-in shows it again. */
const DISMISSED = 'tw-setup-checklist-dismissed';

/**
 * What a new department still has to set up before its plan has numbers (rooms, products,
 * protocols per modality, users per role), each linking to its Setup tab. Shows nothing once
 * everything is done; where `dismissible`, the admin may put it away for the session.
 */
@Component({
  selector: 'tw-setup-checklist',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (shown(); as list) {
      <section class="checklist" aria-labelledby="setup-checklist-title">
        <h2 id="setup-checklist-title"><mat-icon svgIcon="checklist" aria-hidden="true" />Setting up Turnwise</h2>
        <p>Turnover times need the department's own rooms, products and protocols. Still to do:</p>
        <ul>
          @for (item of list.items; track item.key) {
            <li [class.done]="item.done">
              <mat-icon [svgIcon]="item.done ? 'task_alt' : 'warning'" aria-hidden="true" />
              <span>
                <a [routerLink]="['/setup']" [queryParams]="{ tab: tab(item) }">{{ title(item) }}</a>
                @if (item.done) {
                  <span class="state">: done</span>
                } @else {
                  <span class="state">: {{ item.missing.join('; ') }}</span>
                }
              </span>
            </li>
          }
        </ul>
        @if (dismissible()) {
          <button mat-button type="button" (click)="dismiss()">Hide for now</button>
        }
      </section>
    }
  `,
  styles: `
    .checklist {
      margin: 0 0 16px;
      padding: 8px 16px 8px;
      border-radius: 8px;
      border-left: 4px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container);
    }
    h2 { display: flex; align-items: center; gap: 8px; font: var(--mat-sys-title-medium); margin: 4px 0; }
    p { margin: 4px 0; }
    ul { list-style: none; margin: 4px 0; padding: 0; }
    li { display: flex; gap: 8px; align-items: flex-start; margin: 4px 0; }
    li mat-icon { flex: none; width: 20px; height: 20px; color: var(--mat-sys-tertiary); }
    li.done mat-icon { color: var(--mat-sys-primary); }
    li.done .state { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class SetupChecklist {
  private readonly api = inject(ProtocolsApi);
  /** Offers "Hide for now" (for this browser session) (where it is shown outside Setup). */
  readonly dismissible = input(false);
  /** Changes when something may have been set up (Setup passes its open tab): fetches again. */
  readonly refresh = input<unknown>(null);
  protected readonly checklist = serverState(() => this.api.checklist(), 'The setup checklist could not be shown.');
  private readonly dismissed = signal(sessionStorage.getItem(DISMISSED) === '1');
  protected readonly shown = computed(() => {
    const list = this.checklist.value();
    return list && !list.complete && !(this.dismissible() && this.dismissed()) ? list : null;
  });

  constructor() {
    this.checklist.show('all');
    let first = true;
    effect(() => {
      this.refresh();
      if (!first) this.checklist.reload();
      first = false;
    });
  }

  protected title(item: SetupChecklistItem): string {
    return ITEMS[item.key]?.title ?? item.key;
  }

  protected tab(item: SetupChecklistItem): string {
    return ITEMS[item.key]?.tab ?? 'rooms';
  }

  protected dismiss(): void {
    sessionStorage.setItem(DISMISSED, '1');
    this.dismissed.set(true);
  }
}
