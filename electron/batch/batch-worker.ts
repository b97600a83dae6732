// A worker thread of a batch build (worker-sheet-thread.ts is its other end). It
// holds whole sheets: it decodes and traces the sheets it is given, deals them their
// characters and fits all their letters itself (held-sheets.ts), so a sheet's
// boundaries never cross between threads — only its letter count, the scale it gives
// and its fitted letters go back. Between its own sheets it fits single letters of a
// sheet the calling thread holds, sent as packed jobs (packed-letter-job.ts). It
// answers its requests one at a time in the order sent (the build may send the next
// before the last is answered, so the worker never waits for it), each with the
// result or the error as plain data.
import { parentPort } from 'node:worker_threads';
import { assembleSheetFit, fitLetterJob } from '../../core/pipeline/index.ts';
import { toPortableError } from './batch-tasks.ts';
import { HeldSheets } from './held-sheets.ts';
import { unpackLetterJob } from './packed-letter-job.ts';
import type { WorkerAnswers, WorkerReply, WorkerRequest } from './worker-messages.ts';

if (!parentPort) throw new Error('batch-worker.ts runs as a worker thread of a batch build, not on its own.');
const port = parentPort;
const held = new HeldSheets();

async function answer(request: WorkerRequest): Promise<WorkerAnswers[WorkerRequest['kind']]> {
  switch (request.kind) {
    case 'trace':
      return held.trace(request.sheet, request.task);
    case 'deal':
      return held.deal(request.sheet, request.characters);
    case 'fit': {
      const { jobs, ...plan } = held.plan(request.sheet, request.reference, request.settings);
      const outcomes = jobs.map((job) => {
        const outcome = fitLetterJob(job);
        port.postMessage({ id: request.id, kind: 'letter-fitted' } satisfies WorkerReply);
        return outcome;
      });
      return assembleSheetFit(plan, outcomes);
    }
    case 'letter':
      return fitLetterJob(unpackLetterJob(request.job));
    case 'release':
      held.release(request.sheet);
      return null;
  }
}

let previous: Promise<void> = Promise.resolve();
port.on('message', (request: WorkerRequest) => {
  previous = previous.then(() =>
    answer(request).then(
      (result) => port.postMessage({ id: request.id, kind: 'done', result } satisfies WorkerReply),
      (error: unknown) => port.postMessage({ id: request.id, kind: 'failed', error: toPortableError(error) } satisfies WorkerReply),
    ),
  );
});
