// When autosave writes: once the user has paused for AUTOSAVE_DELAY_MS after their
// last change (every change restarts the wait), so a drag of many pointer moves or a
// burst of nudges makes one write, and a crash loses at most the last few seconds.

/**
 * Two seconds of quiet after the last change: longer than the gaps between the
 * pointer moves of a drag or repeated key presses (tens to hundreds of ms), short
 * enough that a crash loses only what was done in the last moments. Chosen here.
 */
export const AUTOSAVE_DELAY_MS = 2000;

export class AutosaveSchedule {
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor(private readonly write: () => void, private readonly delayMs: number = AUTOSAVE_DELAY_MS) {}

  /** A change happened: write once the user has paused. */
  changed(): void {
    this.cancel();
    this.timer = setTimeout(() => {
      this.timer = null;
      this.write();
    }, this.delayMs);
  }

  /** Whether a write is waiting for the pause. */
  get pending(): boolean {
    return this.timer !== null;
  }

  cancel(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
  }
}
