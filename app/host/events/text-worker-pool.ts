import { Worker } from 'node:worker_threads';
import { textWorkerSource, type TextWorkerJob, type TextWorkerReply } from './text-worker';

/** How long idle decode workers are kept for the next file before they are stopped. */
const IDLE_MS = 10_000;

type Done = Extract<TextWorkerReply, { kind: 'done' }>;

/**
 * Text decode workers, kept for a while after use: starting one costs tens of
 * milliseconds, a noticeable share of decoding a large file. Idle workers do not keep the
 * process alive.
 */
class TextWorkerPool {
  readonly #idle: Worker[] = [];
  #timer: NodeJS.Timeout | null = null;

  /** Runs each job on its own worker; progress reports the bytes each piece covered. */
  async run(jobs: readonly TextWorkerJob[], onProgress: (bytes: number) => void): Promise<Done[]> {
    const workers = jobs.map(() => this.#idle.pop() ?? new Worker(textWorkerSource(), { eval: true }));
    if (this.#timer) clearTimeout(this.#timer);
    const settled = await Promise.allSettled(jobs.map((job, k) => runJob(workers[k]!, job, onProgress)));
    settled.forEach((outcome, k) => {
      const worker = workers[k]!;
      if (outcome.status === 'rejected' && outcome.reason instanceof WorkerLost) return;
      worker.unref();
      this.#idle.push(worker);
    });
    this.#timer = setTimeout(() => this.#idle.splice(0).forEach((w) => void w.terminate()), IDLE_MS);
    this.#timer.unref();
    const failed = settled.find((outcome) => outcome.status === 'rejected');
    if (failed) throw failed.reason;
    return settled.map((outcome) => (outcome as PromiseFulfilledResult<Done>).value);
  }
}

class WorkerLost extends Error {}

function runJob(worker: Worker, job: TextWorkerJob, onProgress: (bytes: number) => void): Promise<Done> {
  worker.ref();
  return new Promise((resolve, reject) => {
    const onMessage = (reply: TextWorkerReply) => {
      if (reply.kind === 'progress') return onProgress(reply.bytes);
      stop();
      if (reply.kind === 'done') resolve(reply);
      else reject(new Error(`text decode worker: ${reply.message}`));
    };
    const onError = (error: Error) => {
      stop();
      reject(new WorkerLost(`text decode worker failed: ${error.message}`));
    };
    const onExit = (code: number) => {
      stop();
      reject(new WorkerLost(`text decode worker stopped (exit code ${code})`));
    };
    const stop = () => {
      worker.off('message', onMessage);
      worker.off('error', onError);
      worker.off('exit', onExit);
    };
    worker.on('message', onMessage);
    worker.on('error', onError);
    worker.on('exit', onExit);
    worker.postMessage(job);
  });
}

export const textWorkerPool = new TextWorkerPool();
