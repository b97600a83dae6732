// The progress bar `stemline build` draws on a terminal: one line on stderr, redrawn
// in place, cleared before any other message and at the end. It is drawn only when
// stderr is a terminal (main.ts); piped or captured output never sees it, so the
// command's output stays exactly as its contract says. The line itself is a pure
// function of the progress, tested on its own.
import type { BatchProgress } from '../batch/fit-sheet-files.ts';

/** Where the CLI shows progress: `show` redraws the line, `clear` takes it away. */
export interface ProgressDisplay {
  show(progress: BatchProgress): void;
  clear(): void;
}

/** Cells of the bar: wide enough to move visibly with each per cent or two, short enough for an 80-column terminal with the counts beside it. */
export const BAR_CELLS = 24;
/** Redraw at most this often, ms: ten times a second reads as smooth (common practice) and costs nothing. */
const REDRAW_INTERVAL_MS = 100;

/**
 * Share of the work done, 0–1: tracing counts for half of each sheet and fitting its
 * letters for the other half. Letters on sheets not yet traced are not known, so the
 * fitted share is of the letters found so far, weighted by the sheets traced.
 */
export function progressFraction(progress: BatchProgress): number {
  if (progress.sheetCount <= 0) return 1;
  const traced = Math.min(progress.sheetsTraced, progress.sheetCount) / progress.sheetCount;
  const fittedOfFound = progress.lettersFound > 0 ? Math.min(progress.lettersFitted, progress.lettersFound) / progress.lettersFound : 0;
  return (traced + traced * fittedOfFound) / 2;
}

/** "m:ss" for a duration. */
function clock(ms: number): string {
  const seconds = Math.max(0, Math.floor(ms / 1000));
  return `${Math.floor(seconds / 60)}:${String(seconds % 60).padStart(2, '0')}`;
}

/**
 * The progress line, e.g. `[██████░░░░…] 25%  sheets 1/2  letters 31/62  0:01`.
 * `elapsedMs` is the time since the build started.
 */
export function formatProgress(progress: BatchProgress, elapsedMs: number): string {
  const fraction = progressFraction(progress);
  const filled = Math.round(fraction * BAR_CELLS);
  const bar = `${'█'.repeat(filled)}${'░'.repeat(BAR_CELLS - filled)}`;
  const percent = `${Math.floor(fraction * 100)}%`.padStart(4);
  return `[${bar}] ${percent}  sheets ${progress.sheetsTraced}/${progress.sheetCount}  letters ${progress.lettersFitted}/${progress.lettersFound}  ${clock(elapsedMs)}`;
}

/** Carriage return, then erase to the end of the line (ECMA-48 EL, CSI K). */
const ERASE_LINE = '\r\u001b[K';

/** A progress line drawn on a terminal through `write`. */
export function terminalProgress(write: (text: string) => void, now: () => number = () => performance.now()): ProgressDisplay {
  const started = now();
  let lastDrawn = Number.NEGATIVE_INFINITY;
  let shown = false;
  return {
    show(progress) {
      const at = now();
      const finished = progress.sheetsTraced === progress.sheetCount && progress.lettersFitted === progress.lettersFound;
      if (at - lastDrawn < REDRAW_INTERVAL_MS && !finished) return;
      lastDrawn = at;
      write(`${ERASE_LINE}${formatProgress(progress, at - started)}`);
      shown = true;
    },
    clear() {
      if (!shown) return;
      write(ERASE_LINE);
      shown = false;
      lastDrawn = Number.NEGATIVE_INFINITY;
    },
  };
}
