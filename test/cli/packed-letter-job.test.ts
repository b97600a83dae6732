// A letter's fitting job packed for another thread keeps every coordinate bit for
// bit (so the letter fits to the same outline there), hands its buffers over instead
// of copying them, and a damaged packing is refused in words.
import { describe, expect, it } from 'vitest';
import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { packLetterJob, unpackLetterJob, type PackedLetterJob } from '../../electron/batch/packed-letter-job.ts';
import type { LetterFitJob } from '../../core/pipeline/index.ts';

/** Coordinates that a lossy packing (Float32, rounding, JSON) would change. */
const AWKWARD = [0.1 + 0.2, 1e-300, -0, 123456789.123456789, -(2 ** -1074), 1 / 3];

const job: LetterFitJob = {
  chains: [
    { points: AWKWARD.map((x, i) => ({ x, y: AWKWARD[(i + 1) % AWKWARD.length] as number })), depth: 0, forcedCorners: [2], forcedSmooth: [4] },
    { points: [{ x: 5, y: 6 }, { x: 7.5, y: -8.25 }, { x: 9, y: 10 }], depth: 1 },
  ],
  options: { tolerance: 2.5, pixelSize: 1.7, scanBlurPx: 0.8 },
};

function receive(port: MessagePort): Promise<PackedLetterJob> {
  return new Promise((resolve) => port.once('message', resolve));
}

describe('a packed letter job', () => {
  it('unpacks to the same chains, depths, forced points and options, each coordinate bit for bit', () => {
    const back = unpackLetterJob(packLetterJob(job).packed);
    expect(back).toEqual(job);
    // toEqual treats 0 and -0 alike; Object.is does not.
    expect(Object.is(back.chains[0]?.points[2]?.x, -0)).toBe(true);
    expect(back.chains[1]).not.toHaveProperty('forcedCorners');
  });

  it('hands its point buffers to the other thread instead of copying them', async () => {
    const { port1, port2 } = new MessageChannel();
    try {
      const { packed, transfer } = packLetterJob(job);
      expect(transfer).toHaveLength(2);
      const arrived = receive(port2);
      port1.postMessage(packed, transfer);
      // A transferred buffer is detached here: nothing of it is left on this side.
      expect(packed.chains.map((chain) => chain.coordinates.byteLength)).toEqual([0, 0]);
      expect(unpackLetterJob(await arrived)).toEqual(job);
    } finally {
      port1.close();
      port2.close();
    }
  });

  it('refuses a chain whose coordinates do not come in x, y pairs', () => {
    expect(() => unpackLetterJob({ chains: [{ coordinates: new Float64Array(3), depth: 0 }], options: {} })).toThrow('A packed chain holds x, y pairs; this one has 3 numbers.');
  });
});
