// From the pointer on screen to the scan's pixel frame, for the sheet's SVG (whose
// viewBox is the scan in pixels): the inverse of the SVG's current screen transform,
// so zoom, scroll and the frame's padding are all accounted for.

/** The scan pixel under the client point (clientX, clientY) of `svg`; the origin when the SVG is not laid out. */
export function sheetPoint(svg: SVGSVGElement, clientX: number, clientY: number): { x: number; y: number } {
  const matrix = svg.getScreenCTM();
  if (matrix === null) return { x: 0, y: 0 };
  const point = new DOMPoint(clientX, clientY).matrixTransform(matrix.inverse());
  return { x: point.x, y: point.y };
}
