// A letter's fitting job in the shape that crosses between threads cheaply: each
// boundary chain's points as one Float64Array of x, y pairs, whose buffer is handed
// over (transferred) instead of copied. Copying a chain as an array of {x, y} objects
// costs the structured clone an object per point; a sheet's letters hold tens of
// thousands of points. Float64 keeps every coordinate bit for bit, so the letter fits
// to the same outline on either side.
import type { GlyphChain } from '../../core/fit/index.ts';
import type { LetterFitJob } from '../../core/pipeline/index.ts';

/** One chain with its points as x0, y0, x1, y1, …. */
export interface PackedChain {
  readonly coordinates: Float64Array;
  readonly depth: number;
  readonly forcedCorners?: readonly number[];
  readonly forcedSmooth?: readonly number[];
}

export interface PackedLetterJob {
  readonly chains: readonly PackedChain[];
  readonly options: LetterFitJob['options'];
}

/** The job packed, with the buffers to transfer when it is posted (each is unusable here afterwards). */
export function packLetterJob(job: LetterFitJob): { packed: PackedLetterJob; transfer: ArrayBuffer[] } {
  const transfer: ArrayBuffer[] = [];
  const chains = job.chains.map((chain): PackedChain => {
    const coordinates = new Float64Array(2 * chain.points.length);
    chain.points.forEach((point, i) => {
      coordinates[2 * i] = point.x;
      coordinates[2 * i + 1] = point.y;
    });
    transfer.push(coordinates.buffer as ArrayBuffer);
    return {
      coordinates,
      depth: chain.depth,
      ...(chain.forcedCorners === undefined ? {} : { forcedCorners: chain.forcedCorners }),
      ...(chain.forcedSmooth === undefined ? {} : { forcedSmooth: chain.forcedSmooth }),
    };
  });
  return { packed: { chains, options: job.options }, transfer };
}

/** The job as the fitter takes it. Throws RangeError for a chain whose coordinates do not come in pairs. */
export function unpackLetterJob(packed: PackedLetterJob): LetterFitJob {
  const chains = packed.chains.map((chain): GlyphChain => {
    const { coordinates } = chain;
    if (coordinates.length % 2 !== 0) throw new RangeError(`A packed chain holds x, y pairs; this one has ${coordinates.length} numbers.`);
    const points = Array.from({ length: coordinates.length / 2 }, (_, i) => ({ x: coordinates[2 * i] as number, y: coordinates[2 * i + 1] as number }));
    return {
      points,
      depth: chain.depth,
      ...(chain.forcedCorners === undefined ? {} : { forcedCorners: chain.forcedCorners }),
      ...(chain.forcedSmooth === undefined ? {} : { forcedSmooth: chain.forcedSmooth }),
    };
  });
  return { chains, options: packed.options };
}
