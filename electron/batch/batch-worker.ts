// The worker thread of a batch build (worker-pool.ts): takes tasks from its parent —
// trace a sheet file or fit a letter (batch-tasks.ts) — and runs them one at a time
// in the order given (the parent may send the next before the last is done, so the
// worker never waits for it), answering each with the result or the error as plain
// data. It holds nothing between tasks.
import { parentPort } from 'node:worker_threads';
import { runBatchTask, toPortableError, type BatchTask } from './batch-tasks.ts';
import type { WorkerReply, WorkerRequest } from './worker-messages.ts';

if (!parentPort) throw new Error('batch-worker.ts runs as a worker thread of a batch build, not on its own.');
const port = parentPort;

let previous: Promise<void> = Promise.resolve();
port.on('message', (request: WorkerRequest<BatchTask>) => {
  previous = previous.then(() =>
    runBatchTask(request.task).then(
      (result) => port.postMessage({ id: request.id, ok: true, result } satisfies WorkerReply),
      (error: unknown) => port.postMessage({ id: request.id, ok: false, error: toPortableError(error) } satisfies WorkerReply),
    ),
  );
});
