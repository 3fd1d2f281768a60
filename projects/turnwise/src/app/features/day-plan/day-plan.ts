import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Router, RouterLink } from '@angular/router';
import { of, switchMap } from 'rxjs';

import { AuthService } from '../../core/auth/auth-service';
import { screen } from '../../core/auth/roles';
import { CautionKind, CautionNote } from '../../shared/ui/caution-note';
import { DayPicker } from '../../shared/ui/day-picker';
import { SiteSettingsService } from '../../shared/ui/site-settings-service';
import { VerdictSummary } from '../../shared/ui/verdict-summary';
import { DayPlanService, DayPlanState } from './day-plan-service';
import { RoomCard } from './room-card';

/** The day plan: per room, the exams in order and the turnover each gap needs, with its verdict. */
@Component({
  selector: 'tw-day-plan',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    RouterLink,
    CautionNote,
    DayPicker,
    RoomCard,
    VerdictSummary,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './day-plan.html',
  styleUrl: './day-plan.scss',
})
export class DayPlan {
  private readonly router = inject(Router);
  private readonly plans = inject(DayPlanService);
  private readonly user = inject(AuthService).user;
  protected readonly today = inject(SiteSettingsService).today;

  /** `YYYY-MM-DD` from the address (`/day?date=…` or `/day/…`); absent means today at the site. */
  readonly date = input<string>();

  protected readonly day = computed(() => this.date() || this.today());
  protected readonly onlyProblems = signal(false);

  /** Bumped by "Try again" so the same day is fetched anew. */
  private readonly attempt = signal(0);
  private readonly request = computed(() => ({ day: this.day(), attempt: this.attempt() }));

  protected readonly state = toSignal(
    toObservable(this.request).pipe(switchMap(({ day }) => (day ? this.plans.state(day) : of(null)))),
    { initialValue: null },
  );
  private readonly plan = computed(() => {
    const state: DayPlanState | null = this.state();
    return state?.status === 'loaded' ? state.plan : null;
  });
  protected readonly empty = computed(() => this.plan()?.rooms.every((room) => room.exams.length === 0) ?? false);
  protected readonly cautions = computed(() => {
    const rooms = this.plan()?.rooms ?? [];
    const kinds: CautionKind[] = ['general'];
    if (rooms.some((room) => room.modality === 'MR')) kinds.push('mr');
    if (rooms.some((room) => room.gaps.some((gap) => gap.airHoldMinutes > 0))) kinds.push('airborne');
    return kinds;
  });
  protected readonly mayImport = computed(() => {
    const user = this.user();
    return !!user && screen('import').roles.includes(user.role);
  });

  protected retry(): void {
    this.attempt.update((n) => n + 1);
  }

  protected show(date: string): void {
    void this.router.navigate(['/day'], { queryParams: { date } });
  }
}
