// Where a batch build's tasks run: in this thread, one after another (`--jobs 1`), or
// on a pool of worker threads (`--jobs N`). Both run the same task functions
// (batch-tasks.ts), so the results are the same bytes either way.
import { runBatchTask, type BatchTask, type BatchTaskResult } from './batch-tasks.ts';
import { WorkerPool } from './worker-pool.ts';
import { batchWorkerScript, type WorkerScript } from './worker-script.ts';

export interface BatchRunner {
  /** Tasks that can run at once. */
  readonly parallelism: number;
  run<T extends BatchTask>(task: T): Promise<BatchTaskResult<T>>;
  /** Runs a task in this thread, whatever the runner (for work that can start before the workers are up). */
  runHere<T extends BatchTask>(task: T): Promise<BatchTaskResult<T>>;
  /** Resolves when another task may be given without the queue growing past its cap. */
  room(): Promise<void>;
  close(): Promise<void>;
}

/**
 * Tasks kept waiting per worker: enough that a worker finishing a letter finds the
 * next one ready without waiting for the main thread, few enough that the letters'
 * boundaries are not all held at once (common practice for work queues: a small
 * multiple of the workers).
 */
export const QUEUED_TASKS_PER_WORKER = 4;

/** Runs every task in this thread, one at a time. */
export function inlineRunner(): BatchRunner {
  return {
    parallelism: 1,
    run: (task) => runBatchTask(task),
    runHere: (task) => runBatchTask(task),
    room: () => Promise.resolve(),
    close: () => Promise.resolve(),
  };
}

/**
 * Runs tasks on `workers` worker threads; with `fitHere`, this thread fits letters
 * too and counts as one of the threads.
 */
export function poolRunner(workers: number, script: WorkerScript = batchWorkerScript(), options: { fitHere?: boolean } = {}): BatchRunner {
  const pool = new WorkerPool(workers, script, options);
  return {
    parallelism: workers + (options.fitHere === true ? 1 : 0),
    run: (task) => pool.run(task),
    runHere: (task) => runBatchTask(task),
    room: () => pool.room(QUEUED_TASKS_PER_WORKER * (workers + (options.fitHere === true ? 1 : 0))),
    close: () => pool.close(),
  };
}

/** The runner for `--jobs jobs`: this thread alone for 1; for more, this thread and jobs − 1 workers. */
export function runnerForJobs(jobs: number): BatchRunner {
  return jobs <= 1 ? inlineRunner() : poolRunner(jobs - 1, batchWorkerScript(), { fitHere: true });
}
