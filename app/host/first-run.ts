import type { FirstRunTask } from '../contract';
import type { HostLog } from './log';

export interface FirstRunJob {
  readonly id: string;
  readonly label: string;
  /** Does the work; reports progress in [0, 1] with a short message. Resolves with a summary. */
  run(report: (progress: number, message: string) => void): Promise<string>;
}

/**
 * Work a new installation needs once (building the demo study, for example). It runs in
 * the background after the host is listening, one job at a time, and every step is sent
 * to the console so the operator sees progress instead of a frozen window.
 */
export class FirstRunQueue {
  private readonly tasks = new Map<string, FirstRunTask>();
  private readonly jobs: FirstRunJob[] = [];
  private running: Promise<void> | null = null;

  constructor(
    private readonly log: HostLog,
    private readonly onChange: (task: FirstRunTask) => void,
  ) {}

  add(job: FirstRunJob): void {
    this.jobs.push(job);
    this.tasks.set(job.id, { id: job.id, label: job.label, state: 'pending', progress: 0, message: 'waiting' });
  }

  status(): FirstRunTask[] {
    return [...this.tasks.values()];
  }

  /** Starts the queue once; later calls return the same promise. */
  start(): Promise<void> {
    this.running ??= this.runAll();
    return this.running;
  }

  private update(id: string, patch: Partial<FirstRunTask>): void {
    const next = { ...this.tasks.get(id)!, ...patch };
    this.tasks.set(id, next);
    this.onChange(next);
  }

  private async runAll(): Promise<void> {
    for (const job of this.jobs) {
      this.update(job.id, { state: 'running', message: 'starting' });
      try {
        const summary = await job.run((progress, message) =>
          this.update(job.id, { progress: Math.min(1, Math.max(0, progress)), message }),
        );
        this.update(job.id, { state: 'done', progress: 1, message: summary });
        this.log.info('first_run.done', { job: job.id, summary });
      } catch (error) {
        this.update(job.id, { state: 'failed', message: (error as Error).message });
        this.log.error('first_run.failed', { job: job.id, message: (error as Error).message });
      }
    }
  }
}
