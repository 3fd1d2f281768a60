/** A press that moves less than this is a click, not a drag. */
const DRAG_THRESHOLD_PX = 4;

/** Where a pointer drag started and where the pointer is now (client pixels). */
export interface DragPointer {
  x0: number;
  y0: number;
  x: number;
  y: number;
}

/**
 * Follows one pointer from press to release on the window (the block under it is redrawn, even
 * in another lane, as it moves), reports at most one frame per animation frame once it has
 * moved past a click's wobble, then the release or the cancel.
 */
export class PointerDrag {
  private readonly at: DragPointer;
  private started = false;
  private frame = 0;

  constructor(
    start: { clientX: number; clientY: number },
    private readonly on: { frame: (at: DragPointer) => void; drop: (at: DragPointer) => void; cancel: () => void },
  ) {
    this.at = { x0: start.clientX, y0: start.clientY, x: start.clientX, y: start.clientY };
    window.addEventListener('pointermove', this.move);
    window.addEventListener('pointerup', this.up);
    window.addEventListener('pointercancel', this.cancel);
  }

  /** Stops listening without a drop (the screen went away). */
  end(): void {
    cancelAnimationFrame(this.frame);
    this.frame = 0;
    window.removeEventListener('pointermove', this.move);
    window.removeEventListener('pointerup', this.up);
    window.removeEventListener('pointercancel', this.cancel);
  }

  private readonly move = (event: PointerEvent): void => {
    this.at.x = event.clientX;
    this.at.y = event.clientY;
    if (!this.started && Math.hypot(this.at.x - this.at.x0, this.at.y - this.at.y0) < DRAG_THRESHOLD_PX) return;
    this.started = true;
    event.preventDefault();
    // One preview per animation frame, however fast the pointer reports.
    this.frame ||= requestAnimationFrame(() => {
      this.frame = 0;
      this.on.frame(this.at);
    });
  };

  private readonly up = (): void => {
    this.end();
    if (this.started) this.on.drop(this.at);
  };

  private readonly cancel = (): void => {
    this.end();
    this.on.cancel();
  };
}
