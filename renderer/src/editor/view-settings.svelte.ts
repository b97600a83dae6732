// How the one-letter editor shows a letter — the scan's opacity under the outline, the
// curvature combs' density and length, and the zoom — held once for the window, so the
// editor's own controls and the View menu's commands change the same settings, and
// the settings stay as the user left them from one letter to the next. Hiding the
// combs or the scan remembers the length or opacity they had, and showing them again
// brings it back. The zoom belongs to the drawing area on screen (it depends on the
// area's size and where the user zoomed or panned), so the canvas of the open letter
// takes the zoom commands while it is shown.
import { DEFAULT_COMB_DENSITY, MAX_COMB_DENSITY, MIN_COMB_DENSITY } from './comb-geometry.ts';
import { KEY_ZOOM_FACTOR } from './view-transform.ts';

/** A slider's range: least and greatest value and its step. */
export interface SettingRange {
  readonly min: number;
  readonly max: number;
  readonly step: number;
}

/** The scan's opacity: from hidden to full; shown at 0.35 to start, faint enough for the outline to stand out over the ink (our own choice). */
export const SCAN_OPACITY_RANGE: SettingRange = { min: 0, max: 1, step: 0.05 };
export const DEFAULT_SCAN_OPACITY = 0.35;

/** Comb length, as a multiple of the base comb length (comb-geometry.ts combScale): hidden at 0, up to 4×; 1× to start. */
export const COMB_LENGTH_RANGE: SettingRange = { min: 0, max: 4, step: 0.1 };
export const DEFAULT_COMB_LENGTH = 1;

/** Teeth per segment, as comb-geometry.ts offers them. */
export const COMB_DENSITY_RANGE: SettingRange = { min: MIN_COMB_DENSITY, max: MAX_COMB_DENSITY, step: 1 };

/** What carries out the zoom commands: the open letter's canvas (LetterCanvas.svelte). */
export interface ZoomTarget {
  /** Zooms in (factor > 1) or out about the drawing area's centre. */
  zoomBy(factor: number): void;
}

export class ViewSettings {
  /** Opacity of the scan under the outline; 0 hides it. */
  scanOpacity = $state(DEFAULT_SCAN_OPACITY);
  /** Comb teeth per segment. */
  combDensity = $state(DEFAULT_COMB_DENSITY);
  /** Comb length as a multiple of the base length; 0 hides the combs. */
  combLength = $state(DEFAULT_COMB_LENGTH);
  /**
   * What the combs and the scan come back at when shown again: the value they had when
   * last hidden by a toggle (the defaults until then). A slider dragged down to nothing is
   * not remembered at the small value it passed last, which would barely show.
   */
  private shownCombLength = DEFAULT_COMB_LENGTH;
  private shownScanOpacity = DEFAULT_SCAN_OPACITY;
  private zoomTarget: ZoomTarget | null = null;

  /** Whether the combs are drawn. */
  get combsShown(): boolean {
    return this.combLength > COMB_LENGTH_RANGE.min;
  }

  /** Whether the scan is drawn under the outline. */
  get scanShown(): boolean {
    return this.scanOpacity > SCAN_OPACITY_RANGE.min;
  }

  /** Hides the combs, remembering their length, or shows them again at it (at 1× when they were never hidden by a toggle). */
  toggleCombs(): void {
    if (this.combsShown) {
      this.shownCombLength = this.combLength;
      this.combLength = COMB_LENGTH_RANGE.min;
    } else this.combLength = this.shownCombLength;
  }

  /** Hides the scan, remembering its opacity, or shows it again at it (at 0.35 when it was never hidden by a toggle). */
  toggleScan(): void {
    if (this.scanShown) {
      this.shownScanOpacity = this.scanOpacity;
      this.scanOpacity = SCAN_OPACITY_RANGE.min;
    } else this.scanOpacity = this.shownScanOpacity;
  }

  /** Makes `target` take the zoom commands; returns the function that lets it go (a later target stays). */
  attachZoom(target: ZoomTarget): () => void {
    this.zoomTarget = target;
    return () => {
      if (this.zoomTarget === target) this.zoomTarget = null;
    };
  }

  /** Zooms the open letter in by one step (the + key's); nothing while no letter is shown. */
  zoomIn(): void {
    this.zoomTarget?.zoomBy(KEY_ZOOM_FACTOR);
  }

  /** Zooms the open letter out by one step; nothing while no letter is shown. */
  zoomOut(): void {
    this.zoomTarget?.zoomBy(1 / KEY_ZOOM_FACTOR);
  }
}
