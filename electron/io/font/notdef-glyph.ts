// The missing-character glyph every font must have at glyph index 0 (OpenType spec,
// "Recommendations": glyph 0 is .notdef): a hollow box, so that a character the
// font lacks shows as a visible box instead of vanishing. The outer rectangle runs
// counter-clockwise and the inner one clockwise (the CFF direction convention,
// Adobe Technical Note #5177), so the inside stays open under the nonzero rule.
import { onCurve, type GlyphOutline } from '../../../core/outline/index.ts';

/** Advance of the box glyph, as a fraction of the em (common practice: half an em). */
const NOTDEF_ADVANCE_EM = 0.5;
/** Space either side of the box, fraction of the em (common practice). */
const NOTDEF_SIDEBEARING_EM = 0.05;
/** Stroke thickness of the box, fraction of the em (common practice). */
const NOTDEF_STROKE_EM = 0.05;
/** Box height when the font has no cap height, fraction of the ascender (common practice). */
const NOTDEF_HEIGHT_OF_ASCENDER = 0.7;

export interface NotdefGlyph {
  readonly outline: GlyphOutline;
  readonly advanceWidth: number;
}

/** The box glyph for a font with this em and cap height (all values whole units). */
export function notdefGlyph(unitsPerEm: number, capHeight: number, ascender: number): NotdefGlyph {
  const advanceWidth = Math.round(unitsPerEm * NOTDEF_ADVANCE_EM);
  const side = Math.round(unitsPerEm * NOTDEF_SIDEBEARING_EM);
  const stroke = Math.max(1, Math.round(unitsPerEm * NOTDEF_STROKE_EM));
  const height = capHeight > 0 ? capHeight : Math.round(ascender * NOTDEF_HEIGHT_OF_ASCENDER);
  const left = side;
  const right = advanceWidth - side;
  const outer = [onCurve(left, 0), onCurve(right, 0), onCurve(right, height), onCurve(left, height)];
  const inner = [
    onCurve(left + stroke, stroke),
    onCurve(left + stroke, height - stroke),
    onCurve(right - stroke, height - stroke),
    onCurve(right - stroke, stroke),
  ];
  // A box too low to hold a counter is drawn solid.
  const hasCounter = height - 2 * stroke > 0 && right - left - 2 * stroke > 0;
  return { outline: { contours: hasCounter ? [{ points: outer }, { points: inner }] : [{ points: outer }] }, advanceWidth };
}
