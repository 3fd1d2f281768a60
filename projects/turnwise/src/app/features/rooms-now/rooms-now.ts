import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';
import { Observable, catchError, filter, of, switchMap, tap } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import type { Board } from '@shared/api/board';
import { AuthService } from '../../core/auth/auth-service';
import type { Role } from '../../core/auth/roles';
import { ShellChrome } from '../../core/layout/shell-chrome';
import { CautionNote } from '../../shared/ui/caution-note';
import { Clock } from '../../core/time/clock';
import { serverSkew } from '../../shared/ui/countdown';
import { DayEvents, DayStreamStatus } from '../../core/live/day-events';
import { dayRefreshes } from '../../core/live/day-refresh';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { SiteTime } from '../../shared/ui/site-time';
import { ArrivalsList } from './arrivals-list';
import { BoardCard } from './board-card';
import { BoardService } from './board-service';
import { WallDisplay } from './wall-display';

/** States change with time alone (a surface dries), so the board is fetched again this often. */
const REFRESH_MS = 30_000;
const MARKS_ARRIVALS: readonly Role[] = ['frontdesk', 'charge', 'admin', 'tech'];
const WORKS_TURNOVERS: readonly Role[] = ['tech', 'charge', 'admin'];

/** Rooms now: the front desk's live board of every room, with a wall-display mode. */
@Component({
  selector: 'tw-rooms-now',
  imports: [MatButtonModule, MatIconModule, ArrivalsList, BoardCard, CautionNote, LiveIndicator, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [WallDisplay],
  host: { '[class.wall]': 'wall()', '[style.--wall-columns]': 'wallColumns()', '(document:keydown.escape)': 'wall() && leaveWall()' },
  templateUrl: './rooms-now.html',
  styleUrl: './rooms-now.scss',
})
export class RoomsNow {
  private readonly boards = inject(BoardService);
  private readonly events = inject(DayEvents);
  private readonly clock = inject(Clock);
  private readonly user = inject(AuthService).user;
  private readonly role = computed(() => this.user()?.role ?? null);
  private readonly wallDisplay = inject(WallDisplay);
  private readonly router = inject(Router);

  /** `?display=wall` opens the wall display, so a screen on the wall can be bookmarked. */
  readonly display = input<string | undefined>();

  protected readonly wall = computed(() => this.display() === 'wall');
  protected readonly status = signal<DayStreamStatus>('connecting');
  protected readonly board = signal<Board | null>(null);
  protected readonly error = signal<ApiError | null>(null);
  /** Exams with an arrival call on its way, so a double tap sends one. */
  protected readonly busy = signal<ReadonlySet<number>>(new Set());
  private readonly skew = signal(0);
  protected readonly now = computed(() => this.clock.now() + this.skew());

  protected readonly canMarkArrived = computed(() => this.may(MARKS_ARRIVALS));
  protected readonly canWorkTurnover = computed(() => this.may(WORKS_TURNOVERS));
  /** As square a grid as the rooms allow (4 → 2 × 2, 9 → 3 × 3), so the wall's cards fill the screen. */
  protected readonly wallColumns = computed(() => Math.max(1, Math.ceil(Math.sqrt(this.board()?.rooms.length ?? 1))));
  protected readonly hasMr = computed(() => this.board()?.rooms.some((room) => room.modality === 'MR') ?? false);

  private readonly date = inject(SiteSettingsService).today;

  constructor() {
    effect(() => this.wallDisplay.show(this.wall()));
    toObservable(this.date)
      .pipe(
        filter((date): date is string => date !== null),
        switchMap((date) =>
          dayRefreshes(this.events.stream(date), { everyMs: REFRESH_MS, onStatus: (status) => this.status.set(status) }).pipe(
            switchMap(() => this.fetch(date)),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe();
    inject(DestroyRef).onDestroy(() => this.wallDisplay.show(false));
  }

  private may(roles: readonly Role[]): boolean {
    const role = this.role();
    return role !== null && roles.includes(role);
  }

  protected roomBusy(examId: number | undefined): boolean {
    return examId !== undefined && this.busy().has(examId);
  }

  protected markArrived(examId: number): void {
    this.act(examId, this.boards.markArrived(examId));
  }

  protected undoArrived(examId: number): void {
    this.act(examId, this.boards.undoArrived(examId));
  }

  protected enterWall(): void {
    // Full screen needs the click that asked for it; a bookmarked ?display=wall opens without.
    this.wallDisplay.requestFullscreen();
    void this.router.navigate([], { queryParams: { display: 'wall' }, queryParamsHandling: 'merge' });
  }

  protected leaveWall(): void {
    void this.router.navigate([], { queryParams: { display: null }, queryParamsHandling: 'merge' });
  }

  private fetch(date: string): Observable<unknown> {
    return this.boards.board(date).pipe(
      tap((board) => {
        this.skew.set(serverSkew(board.now, this.clock.now()));
        this.board.set(board);
        this.error.set(null);
      }),
      catchError((error: ApiError) => {
        this.error.set(error);
        return of(null);
      }),
    );
  }

  private act(examId: number, call: Observable<unknown>): void {
    const date = this.date();
    this.busy.update((busy) => new Set(busy).add(examId));
    const done = () =>
      this.busy.update((busy) => {
        const next = new Set(busy);
        next.delete(examId);
        return next;
      });
    call.pipe(switchMap(() => (date ? this.fetch(date) : of(null)))).subscribe({
      next: done,
      error: (error: ApiError) => {
        this.error.set(error);
        done();
      },
    });
  }
}
