// Writes fitted letters as SVG on the scan's pixel frame (viewBox = the image, pixel
// (col,row) covers [col,col+1]×[row,row+1], y down): one <path> per letter, absolute
// M, L, C and Z commands only, fill rule nonzero. Outer contours and holes wind
// oppositely (the font-unit outline's directions, mirrored by the y flip), so the
// holes show. Other tools read this output: keep it stable.
import { contourSegments } from '../../core/outline/index.ts';
import { toScanPixels, type TracedLetter } from '../../core/pipeline/index.ts';
import type { Point } from '../../core/geometry/index.ts';
import { escapeAttribute, formatCoordinate, svgHeader } from './svg-format.ts';

function xy(p: Point): string {
  return `${formatCoordinate(p.x)} ${formatCoordinate(p.y)}`;
}

/** Path data of a letter's outline on the scan: absolute M/L/C/Z. */
export function letterPathData(letter: TracedLetter): string {
  if (!letter.outline) return '';
  const px = (p: Point) => xy(toScanPixels(letter.frame, p));
  return letter.outline.contours
    .map((contour) => {
      const segments = contourSegments(contour);
      const first = segments[0];
      if (!first) return '';
      const parts = [`M${px(first.p0)}`];
      for (const segment of segments) {
        parts.push(segment.kind === 'line' ? `L${px(segment.p1)}` : `C${px(segment.p1)} ${px(segment.p2)} ${px(segment.p3)}`);
      }
      return `${parts.join(' ')} Z`;
    })
    .filter((d) => d.length > 0)
    .join(' ');
}

export function outlineSvg(width: number, height: number, letters: readonly TracedLetter[]): string {
  const lines = svgHeader(width, height);
  for (const letter of letters) {
    if (!letter.outline) continue;
    const character = letter.character === null ? '' : ` data-character="${escapeAttribute(letter.character)}"`;
    lines.push(`  <path id="letter-${letter.index}" data-row="${letter.row}"${character} fill-rule="nonzero" d="${letterPathData(letter)}"/>`);
  }
  lines.push('</svg>', '');
  return lines.join('\n');
}
