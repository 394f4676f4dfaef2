const ignore = () => undefined;

/**
 * Runs an asynchronous task so that runs never overlap. A call while a run is going
 * returns a run that starts after it ends, and every call made meanwhile shares that one
 * run: a slow fsync delays the next one but never queues up a backlog of them.
 */
export class CoalescingRunner {
  private current: Promise<void> | null = null;
  private next: Promise<void> | null = null;

  constructor(private readonly task: () => Promise<void>) {}

  run(): Promise<void> {
    if (!this.current) return this.start();
    this.next ??= this.current.then(ignore, ignore).then(() => {
      this.next = null;
      return this.start();
    });
    return this.next;
  }

  private start(): Promise<void> {
    const run: Promise<void> = this.task().finally(() => {
      if (this.current === run) this.current = null;
    });
    this.current = run;
    return run;
  }
}
