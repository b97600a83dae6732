/**
 * Curvature combs as the editor draws them: for every curved segment of a contour, a
 * row of teeth standing on the curve along its normal, each |κ|·scale long (core
 * geometry's curvatureComb, which puts them on the convex side), and the envelope
 * line through the teeth's outer ends. Straight segments have κ = 0 everywhere and get
 * no comb. A tooth longer than the settings' longest is drawn at that length (its
 * curvature kept), so a tight turn shows as a plateau of the envelope instead of a
 * spike across the whole view. Font units in, font units out; the canvas maps them to
 * the screen.
 */
import type { Point } from '../../../core/geometry/vector.ts';
import { curvatureComb } from '../../../core/geometry/curvature.ts';
import type { OutlineSegment } from '../../../core/outline/index.ts';
import { toScreen, type ViewTransform } from './view-transform.ts';

/** One segment's comb. */
export interface SegmentComb {
  /** Index of the segment in its contour. */
  readonly segment: number;
  /** Each tooth from its foot on the curve to its outer end. */
  readonly teeth: readonly { readonly foot: Point; readonly tip: Point; readonly curvature: number }[];
  /** The outer ends in order along the segment: the comb's envelope. */
  readonly envelope: readonly Point[];
}

export interface CombSettings {
  /** Teeth per segment (both ends included). */
  readonly density: number;
  /** Tooth length per unit curvature, font units² (tooth length = scale · |κ|). */
  readonly scale: number;
  /** The longest tooth drawn, font units; longer ones are drawn this long. Absent: no limit. */
  readonly maxLength?: number;
}

/** Teeth per segment offered by the density control, and its default (core's default comb density). */
export const MIN_COMB_DENSITY = 4;
export const MAX_COMB_DENSITY = 64;
export const DEFAULT_COMB_DENSITY = 32;

/**
 * Comb length for the scale control's 1×: a circle whose diameter is the reference
 * height (the cap height) gets teeth a fortieth of that height long — long enough to
 * read bumps at whole-letter zoom, short enough not to hide the letter: the bowls of a
 * lowercase, at a third of that diameter, get teeth three times as long (our own
 * choice; a tenth hid the demo alphabet's "a" under its combs, and a twentieth still
 * fanned its tight pen turns across the counters). The control goes to 4× for a closer look.
 * Tooth = scale·κ = scale·2/h, so scale = h²/80.
 */
export const BASE_COMB_SHARE = 1 / 80;

/** Tooth length per unit curvature for `multiplier` × the base comb length at reference height `height`. */
export function combScale(height: number, multiplier: number): number {
  return BASE_COMB_SHARE * height * height * multiplier;
}

/**
 * The longest tooth at 1×, as a share of the reference height: a sixth of the cap
 * height, which a 1× tooth reaches on a turn of radius 3/40 of the height. A turn
 * tighter than that (a pen terminal, the join of a bowl to its stem) would otherwise
 * throw teeth many times the letter's size across the view, hiding the letter; the
 * bowls and arches of a lowercase keep their teeth's true lengths (our own choice,
 * tried on the demo alphabet's lowercase, whose "a" once drew a tooth 80,000 units long).
 */
export const MAX_TOOTH_SHARE = 1 / 6;

/** The longest tooth drawn for `multiplier` × the base comb length at reference height `height`, font units. */
export function combMaxLength(height: number, multiplier: number): number {
  return MAX_TOOTH_SHARE * height * multiplier;
}

/** `tip` brought along the tooth from `foot` to at most `maxLength` away. */
function limitedTip(foot: Point, tip: Point, maxLength: number | undefined): Point {
  const length = Math.hypot(tip.x - foot.x, tip.y - foot.y);
  if (maxLength === undefined || length <= maxLength) return tip;
  const share = maxLength / length;
  return { x: foot.x + (tip.x - foot.x) * share, y: foot.y + (tip.y - foot.y) * share };
}

/** The combs of a contour's curved segments. */
export function contourCombs(segments: readonly OutlineSegment[], settings: CombSettings): SegmentComb[] {
  const combs: SegmentComb[] = [];
  segments.forEach((segment, i) => {
    if (segment.kind !== 'cubic') return;
    const samples = curvatureComb(segment, { samples: settings.density, scale: settings.scale });
    const teeth = samples.map((s) => ({ foot: s.point, tip: limitedTip(s.point, s.tip, settings.maxLength), curvature: s.curvature }));
    combs.push({ segment: i, teeth, envelope: teeth.map((t) => t.tip) });
  });
  return combs;
}

function fmt(n: number): string {
  return (Math.round(n * 100) / 100).toString();
}

/** SVG path data, in screen pixels, of every tooth of `combs` (one M/L pair per tooth). */
export function teethPathData(combs: readonly SegmentComb[], view: ViewTransform): string {
  const parts: string[] = [];
  for (const comb of combs) {
    for (const tooth of comb.teeth) {
      const a = toScreen(view, tooth.foot);
      const b = toScreen(view, tooth.tip);
      parts.push(`M${fmt(a.x)} ${fmt(a.y)}L${fmt(b.x)} ${fmt(b.y)}`);
    }
  }
  return parts.join('');
}

/** SVG path data, in screen pixels, of every comb's envelope (one polyline per segment). */
export function envelopePathData(combs: readonly SegmentComb[], view: ViewTransform): string {
  return combs
    .map((comb) => comb.envelope.map((p, i) => {
      const s = toScreen(view, p);
      return `${i === 0 ? 'M' : 'L'}${fmt(s.x)} ${fmt(s.y)}`;
    }).join(''))
    .join('');
}
