/**
 * The curvature combs of an outline and their path data, kept between redraws so that a drag recomputes
 * only what it changed. A drag replaces one contour and, within it, moves the points
 * of two to four segments; every other contour is the same object as before (the
 * glyph document shares what an edit leaves alone) and every other segment has the
 * same control points. So the cache keeps, per contour object, its combs and their
 * SVG path data at the last view; and, for a contour it has not seen, reuses each
 * segment's comb from the previous redraw when the segment's control points are the
 * same. The result is always what contourCombs and teethPathData / envelopePathData
 * give for the whole outline (the tests hold it to that after any run of edits).
 *
 * Plain TypeScript with no DOM: one cache per canvas, living as long as it does.
 * Memory: the combs of the last redraw only, plus entries for contours still held
 * elsewhere (a WeakMap, dropped with them).
 */
import { contourSegments, type GlyphOutline, type OutlineContour, type OutlineSegment } from '../../../core/outline/index.ts';
import { contourCombs, envelopePathData, teethPathData, type CombSettings, type SegmentComb } from './comb-geometry.ts';
import type { ViewTransform } from './view-transform.ts';

/** One contour's combs and the segments they were made from. */
interface ContourEntry {
  readonly settings: CombSettings;
  readonly combs: readonly SegmentComb[];
  /** The same combs by segment key (see segmentKey). */
  readonly keys: ReadonlyMap<string, SegmentComb>;
}

/** SVG path data of combs at one view: the teeth and envelopes standing still, and those moving. */
export interface CombPathData {
  readonly teeth: string;
  readonly envelope: string;
  readonly movingTeeth: string;
  readonly movingEnvelope: string;
}

/**
 * A key naming a cubic segment by its index in its contour and its control points:
 * equal keys, equal combs (the comb records the index).
 */
function segmentKey(index: number, segment: OutlineSegment): string {
  if (segment.kind !== 'cubic') return '';
  const { p0, p1, p2, p3 } = segment;
  return `${index}:${p0.x},${p0.y},${p1.x},${p1.y},${p2.x},${p2.y},${p3.x},${p3.y}`;
}

function sameSettings(a: CombSettings | null, b: CombSettings): boolean {
  return a !== null && a.density === b.density && a.scale === b.scale && a.maxLength === b.maxLength;
}

export class CombCache {
  private readonly byContour = new WeakMap<OutlineContour, ContourEntry>();
  /** Each segment comb's path data at the view it was last drawn at. */
  private readonly drawn = new WeakMap<SegmentComb, { view: ViewTransform; teeth: string; envelope: string }>();
  /** Segment combs of the last redraw by key, and their settings, for contours the cache has not seen. */
  private previous: ReadonlyMap<string, SegmentComb> = new Map();
  private previousSettings: CombSettings | null = null;
  /** The combs the last `combs` call made afresh while keeping others. */
  private moving: ReadonlySet<SegmentComb> = new Set();
  /** The path data of the combs standing still, as last drawn. */
  private still: { view: ViewTransform; combs: readonly SegmentComb[]; teeth: string; envelope: string } | null = null;

  /** The combs of `contour`, reusing the segments unchanged since the last redraw. */
  private entryOf(contour: OutlineContour, settings: CombSettings): ContourEntry {
    const known = this.byContour.get(contour);
    if (known && sameSettings(known.settings, settings)) return known;
    const reuse = sameSettings(this.previousSettings, settings);
    const combs: SegmentComb[] = [];
    const keys = new Map<string, SegmentComb>();
    contourSegments(contour).forEach((segment, i) => {
      if (segment.kind !== 'cubic') return;
      const key = segmentKey(i, segment);
      const comb = (reuse ? this.previous.get(key) : undefined) ?? contourCombs([segment], settings).map((c) => ({ ...c, segment: i }))[0];
      if (!comb) return;
      combs.push(comb);
      keys.set(key, comb);
    });
    const entry: ContourEntry = { settings, combs, keys };
    this.byContour.set(contour, entry);
    return entry;
  }

  /** One segment comb's path data at `view`, made once per comb and view. */
  private pathsOf(comb: SegmentComb, view: ViewTransform): { teeth: string; envelope: string } {
    const known = this.drawn.get(comb);
    if (known && known.view === view) return known;
    const paths = { view, teeth: teethPathData([comb], view), envelope: envelopePathData([comb], view) };
    this.drawn.set(comb, paths);
    return paths;
  }

  /**
   * The combs of every curved segment of `outline`, contour by contour: equal to
   * contourCombs over each contour's segments, concatenated.
   */
  combs(outline: GlyphOutline, settings: CombSettings): SegmentComb[] {
    const before = this.previous;
    const entries = outline.contours.map((contour) => this.entryOf(contour, settings));
    const used = new Map<string, SegmentComb>();
    for (const entry of entries) for (const [key, comb] of entry.keys) used.set(key, comb);
    const combs = entries.flatMap((entry) => entry.combs);
    // Moving: the combs made afresh, when others were kept — the segments an edit is changing.
    const beforeCombs = new Set(before.values());
    const kept = combs.filter((comb) => beforeCombs.has(comb)).length;
    this.moving = kept > 0 && kept < combs.length ? new Set(combs.filter((comb) => !beforeCombs.has(comb))) : new Set();
    this.previous = used;
    this.previousSettings = settings;
    return combs;
  }

  /**
   * The path data of `combs` at `view`, in two parts whose union is teethPathData and
   * envelopePathData of them all (in another order): the combs the last `combs` call
   * made afresh while keeping others (the segments a drag is moving), and the rest.
   * While a drag goes on the rest stays the same string, so the canvas does not set
   * (and the browser does not parse again) the long path of the combs that stand
   * still. Each comb's part is made once per comb object and view (compared by
   * identity: a new view object redraws every part).
   */
  pathData(combs: readonly SegmentComb[], view: ViewTransform): CombPathData {
    const still: SegmentComb[] = [];
    const moving: SegmentComb[] = [];
    for (const comb of combs) (this.moving.has(comb) ? moving : still).push(comb);
    const known = this.still;
    const same = known !== null && known.view === view && known.combs.length === still.length && known.combs.every((comb, i) => comb === still[i]);
    if (!same) {
      const paths = still.map((comb) => this.pathsOf(comb, view));
      this.still = { view, combs: still, teeth: paths.map((p) => p.teeth).join(''), envelope: paths.map((p) => p.envelope).join('') };
    }
    const movingPaths = moving.map((comb) => this.pathsOf(comb, view));
    return {
      teeth: this.still!.teeth,
      envelope: this.still!.envelope,
      movingTeeth: movingPaths.map((p) => p.teeth).join(''),
      movingEnvelope: movingPaths.map((p) => p.envelope).join(''),
    };
  }
}
