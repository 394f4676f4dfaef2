import type { JobStatus } from '../contract/schemas/jobs';
import type { HostLog } from './log';

export type ReportProgress = (fraction: number, message: string) => void;

/** The result of a job: a summary line for the operator and, optionally, the id of what it made. */
export interface JobOutcome {
  readonly message: string;
  readonly resultId: string | null;
}

/**
 * Long host work (imports, operations, demo clips) runs as jobs: the request returns at
 * once with a job id, and every step is sent to the console as a status event. Progress
 * reports are throttled so a fast loop cannot flood the page.
 */
export class JobRunner {
  private readonly jobs = new Map<string, JobStatus>();
  private nextId = 1;

  constructor(
    private readonly emit: (status: JobStatus) => void,
    private readonly log: HostLog,
    private readonly minReportIntervalMs = 100,
  ) {}

  list(): JobStatus[] {
    return [...this.jobs.values()];
  }

  start(kind: string, label: string, work: (report: ReportProgress) => Promise<JobOutcome>): { id: string; done: Promise<JobStatus> } {
    const id = `job-${this.nextId++}`;
    this.set({ id, kind, label, state: 'running', progress: 0, message: 'starting', resultId: null });
    let lastReport = 0;
    const report: ReportProgress = (fraction, message) => {
      const now = Date.now();
      if (now - lastReport < this.minReportIntervalMs) return;
      lastReport = now;
      this.set({ ...this.jobs.get(id)!, progress: Math.min(1, Math.max(0, fraction)), message });
    };
    const done = work(report).then(
      (outcome) => this.set({ ...this.jobs.get(id)!, state: 'done', progress: 1, message: outcome.message, resultId: outcome.resultId }),
      (error: Error) => {
        this.log.warn('job.failed', { job: id, kind, message: error.message });
        return this.set({ ...this.jobs.get(id)!, state: 'failed', message: error.message });
      },
    );
    return { id, done };
  }

  private set(status: JobStatus): JobStatus {
    this.jobs.set(status.id, status);
    this.emit(status);
    return status;
  }
}
