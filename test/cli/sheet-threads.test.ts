// This thread fits the letters of its own sheets from the first on and hands letters
// from the last to any helper (a worker with nothing of its own to do); the outcomes
// come back in the letters' order whoever fitted them, so the font is the same.
import { describe, expect, it } from 'vitest';
import { fitLettersSharing, threadsForJobs, type LetterHelper } from '../../electron/batch/sheet-threads.ts';
import { fitLetterJob, planSheetFit, type LetterFitJob, type LetterFitOutcome } from '../../core/pipeline/index.ts';
import { segmentSheet, traceScan } from '../../core/raster/index.ts';

/** Eight letter jobs: a ring and a bar (600 dpi), four times over. */
function jobs(): LetterFitJob[] {
  const width = 260;
  const height = 160;
  const data = new Uint8Array(width * height).fill(240);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const r = Math.hypot(x - 70, y - 80);
      if ((r < 55 && r > 30) || (x > 170 && x < 200 && y > 20 && y < 140)) data[y * width + x] = 20;
    }
  }
  const traced = traceScan({ raster: { width, height, data, dpi: 600 } });
  const plan = planSheetFit({ ...traced, sheet: segmentSheet(traced.contours, { characters: 'ol' }) });
  // Each a job of its own (not the same object twice), so which were handed out can be told.
  return [0, 1, 2, 3].flatMap(() => plan.jobs.map((job) => ({ ...job })));
}

/** A helper that fits what it is given after a pause, two at a time, noting which letters it got. */
function slowHelper(fail = false): LetterHelper & { readonly given: LetterFitJob[] } {
  let running = 0;
  const given: LetterFitJob[] = [];
  return {
    given,
    get canHelp() {
      return running < 2;
    },
    async fitLetter(job): Promise<LetterFitOutcome> {
      running++;
      given.push(job);
      await new Promise((resolve) => setTimeout(resolve, 2));
      running--;
      if (fail) throw new Error('the helper stopped');
      return fitLetterJob(job);
    },
  };
}

describe('fitting a sheet\'s letters with helpers', () => {
  const all = jobs();
  const alone = all.map((job) => fitLetterJob(job));

  it('gives the same outcomes, in the letters\' order, as this thread alone', async () => {
    const helper = slowHelper();
    let reported = 0;
    const outcomes = await fitLettersSharing(all, () => [helper], () => reported++);
    expect(outcomes).toEqual(alone);
    expect(reported).toBe(all.length);
    expect(helper.given.length).toBeGreaterThan(0);
    // Handed out from the last letter back; the first is always fitted here.
    expect(helper.given[0]).toBe(all[all.length - 1]);
    expect(helper.given).not.toContain(all[0]);
  });

  it('fits every letter here when no helper is free', async () => {
    const busy: LetterHelper = { canHelp: false, fitLetter: () => Promise.reject(new Error('never asked')) };
    expect(await fitLettersSharing(all, () => [busy])).toEqual(alone);
  });

  it('fails with the helper\'s error when a helper stops', async () => {
    await expect(fitLettersSharing(all, () => [slowHelper(true)])).rejects.toThrow('the helper stopped');
  });

  it('starts jobs − 1 workers for --jobs, this thread first', async () => {
    const one = threadsForJobs(1);
    const three = threadsForJobs(3);
    try {
      expect(one.threads).toHaveLength(1);
      expect(three.threads).toHaveLength(3);
      expect(three.threads[0]?.constructor.name).toBe('LocalSheetThread');
      expect(three.threads.slice(1).map((thread) => thread.constructor.name)).toEqual(['WorkerSheetThread', 'WorkerSheetThread']);
    } finally {
      await one.close();
      await three.close();
    }
  });
});
