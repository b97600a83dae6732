// A short digest of a letter's traced ink: every boundary point of its contours, in
// order. Two traces of a letter give the same digest exactly when they found the same
// boundary, so an outline the user edited can be kept when the scan is traced again
// with other settings, and only then. FNV-1a, 32 bits (Fowler, Noll and Vo; the
// offset basis and prime are the published 32-bit ones), run twice with different
// seeds for 64 bits: a digest, not a defence against anyone crafting collisions.
import type { Contour } from '../../../core/raster/index.ts';

/** FNV-1a 32-bit offset basis and prime (published FNV parameters). */
const FNV_OFFSET_BASIS = 0x811c9dc5;
const FNV_PRIME = 0x01000193;
/** Seed of the second pass: any value other than the basis; the golden-ratio constant 0x9e3779b9, from memory. */
const SECOND_SEED = 0x9e3779b9;

function fnv1a(text: string, seed: number): string {
  let hash = seed >>> 0;
  for (let i = 0; i < text.length; i++) {
    hash ^= text.charCodeAt(i);
    hash = Math.imul(hash, FNV_PRIME) >>> 0;
  }
  return hash.toString(16).padStart(8, '0');
}

/** The digest of the contours with these indices (depth and points, in order). */
export function inkDigest(contours: readonly Contour[], indices: readonly number[]): string {
  const text = indices
    .map((i) => {
      const contour = contours[i];
      return contour ? `${contour.depth}:${contour.points.map((p) => `${p.x},${p.y}`).join(';')}` : '-';
    })
    .join('|');
  return fnv1a(text, FNV_OFFSET_BASIS) + fnv1a(text, SECOND_SEED);
}
