// Writes traced boundary chains as SVG for inspection: the image's pixel frame as
// the viewBox (pixel (col,row) covers [col,col+1]×[row,row+1], y down), one <path>
// per letter holding all its contours (outlines and holes) as closed polylines.
// Outlines and holes wind oppositely, so the nonzero fill rule shows the holes.
import type { Contour, SheetSegmentation } from '../../core/raster/index.ts';
import { escapeAttribute, formatCoordinate, svgHeader } from './svg-format.ts';


/** Path data for closed polylines: absolute M, L and Z only. */
export function polylinePathData(contours: readonly Contour[]): string {
  return contours
    .map((contour) => {
      const [first, ...rest] = contour.points;
      if (!first) return '';
      const moves = [`M${formatCoordinate(first.x)} ${formatCoordinate(first.y)}`];
      for (const point of rest) moves.push(`L${formatCoordinate(point.x)} ${formatCoordinate(point.y)}`);
      return `${moves.join(' ')} Z`;
    })
    .filter((d) => d.length > 0)
    .join(' ');
}

/** The whole SVG document for a traced sheet. */
export function boundarySvg(width: number, height: number, contours: readonly Contour[], sheet: SheetSegmentation): string {
  const lines = svgHeader(width, height);
  for (const letter of sheet.letters) {
    const members = letter.contours.map((index) => contours[index]).filter((c): c is Contour => c !== undefined);
    const character = letter.character === null ? '' : ` data-character="${escapeAttribute(letter.character)}"`;
    lines.push(`  <path id="letter-${letter.index}" data-row="${letter.row}"${character} fill-rule="nonzero" d="${polylinePathData(members)}"/>`);
  }
  lines.push('</svg>', '');
  return lines.join('\n');
}
