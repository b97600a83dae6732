// Number and attribute formatting shared by the SVG writers (boundary chains, fitted
// outlines): coordinates to 1/1000 px, which is below any boundary's accuracy and
// below a font unit at any sensible scale, with no trailing zeros and no "-0".

const COORDINATE_DECIMALS = 3;

export function formatCoordinate(value: number): string {
  const text = value.toFixed(COORDINATE_DECIMALS).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text;
}

export function escapeAttribute(text: string): string {
  return text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c] ?? c);
}

/** The document's opening lines: the image's pixel frame as the viewBox. */
export function svgHeader(width: number, height: number): string[] {
  return ['<?xml version="1.0" encoding="UTF-8"?>', `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}">`];
}
