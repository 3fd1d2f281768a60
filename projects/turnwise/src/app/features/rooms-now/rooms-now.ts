import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';
import { Observable, switchMap, tap } from 'rxjs';

import { AuthService } from '../../core/auth/auth-service';
import { may } from '../../core/auth/roles';
import { liveDay } from '../../core/live/day-refresh';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { Clock, serverNow } from '../../core/time/clock';
import { CautionNote } from '../../shared/ui/caution-note';
import { LiveIndicator } from '../../shared/ui/live-indicator';
import { SiteTime } from '../../shared/ui/site-time';
import { ArrivalsList } from './arrivals-list';
import { BoardCard } from './board-card';
import { BoardService } from './board-service';
import { WallDisplay } from './wall-display';

/** States change with time alone (a surface dries), so the board is fetched again this often. */
const REFRESH_MS = 30_000;

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
  private readonly user = inject(AuthService).user;
  private readonly role = computed(() => this.user()?.role ?? null);
  private readonly wallDisplay = inject(WallDisplay);
  private readonly router = inject(Router);
  private readonly date = inject(SiteSettingsService).today;
  private readonly server = serverNow(inject(Clock));

  /** `?display=wall` opens the wall display, so a screen on the wall can be bookmarked. */
  readonly display = input<string | undefined>();

  protected readonly wall = computed(() => this.display() === 'wall');
  protected readonly board = serverState((date: string) => this.fetch(date), 'The board could not be shown.');
  protected readonly status = liveDay(this.board, this.date, { day: (date) => date, everyMs: REFRESH_MS });
  /** Marking or taking back an arrival answers the board again; a double tap sends one. */
  protected readonly arrival = action((call: Observable<unknown>, date: string) => call.pipe(switchMap(() => this.fetch(date))));
  /** A refused arrival until the next one or the next good fetch; else a failed fetch. */
  protected readonly error = computed(() => this.arrival.error() ?? this.board.error());
  protected readonly now = this.server.now;

  protected readonly canMarkArrived = computed(() => may(this.role(), 'markArrivals'));
  protected readonly canWorkTurnover = computed(() => may(this.role(), 'workTurnovers'));
  /** As square a grid as the rooms allow (4 → 2 × 2, 9 → 3 × 3), so the wall's cards fill the screen. */
  protected readonly wallColumns = computed(() => Math.max(1, Math.ceil(Math.sqrt(this.board.value()?.rooms.length ?? 1))));
  protected readonly hasMr = computed(() => this.board.value()?.rooms.some((room) => room.modality === 'MR') ?? false);

  constructor() {
    effect(() => this.wallDisplay.show(this.wall()));
    inject(DestroyRef).onDestroy(() => this.wallDisplay.show(false));
  }

  protected markArrived(examId: number): void {
    void this.arrive(this.boards.markArrived(examId));
  }

  protected undoArrived(examId: number): void {
    void this.arrive(this.boards.undoArrived(examId));
  }

  protected enterWall(): void {
    // Full screen needs the click that asked for it; a bookmarked ?display=wall opens without.
    this.wallDisplay.requestFullscreen();
    void this.router.navigate([], { queryParams: { display: 'wall' }, queryParamsHandling: 'merge' });
  }

  protected leaveWall(): void {
    void this.router.navigate([], { queryParams: { display: null }, queryParamsHandling: 'merge' });
  }

  private async arrive(call: Observable<unknown>): Promise<void> {
    const date = this.date();
    if (!date) return;
    const result = await this.arrival.run(call, date);
    if (result.status === 'done') this.board.set(result.value);
  }

  private fetch(date: string) {
    return this.boards.board(date).pipe(
      tap((board) => {
        this.server.heard(board.now);
        // A good fetch also clears an arrival's refusal (not while one is on its way).
        if (!this.arrival.pending()) this.arrival.reset();
      }),
    );
  }
}
