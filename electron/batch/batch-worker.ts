// The worker thread of a batch build (worker-pool.ts): takes one task at a time from
// its parent — trace a sheet file or fit a letter (batch-tasks.ts) — and answers with
// the result or the error as plain data. It holds nothing between tasks.
import { parentPort } from 'node:worker_threads';
import { runBatchTask, toPortableError, type BatchTask } from './batch-tasks.ts';
import type { WorkerReply, WorkerRequest } from './worker-messages.ts';

if (!parentPort) throw new Error('batch-worker.ts runs as a worker thread of a batch build, not on its own.');
const port = parentPort;

port.on('message', (request: WorkerRequest<BatchTask>) => {
  runBatchTask(request.task).then(
    (result) => port.postMessage({ id: request.id, ok: true, result } satisfies WorkerReply),
    (error: unknown) => port.postMessage({ id: request.id, ok: false, error: toPortableError(error) } satisfies WorkerReply),
  );
});
