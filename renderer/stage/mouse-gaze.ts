import type { GazeloomApi } from '../../app/contract';

/**
 * Mouse as gaze, for piloting a protocol without a tracker: pointer positions over the
 * stage (in stage pixels, with the event's own timestamp) go to the host in small batches,
 * where they arrive as a gaze source like any other.
 */
export class MouseGaze {
  private enabled = false;
  private pending: { stageTimeMs: number; x: number; y: number; inside: boolean }[] = [];
  private timer = 0;

  constructor(
    private readonly api: GazeloomApi,
    private readonly canvas: HTMLCanvasElement,
  ) {
    window.addEventListener('pointermove', (event) => {
      if (!this.enabled) return;
      const rect = this.canvas.getBoundingClientRect();
      const sx = this.canvas.width / rect.width;
      const sy = this.canvas.height / rect.height;
      const x = (event.clientX - rect.left) * sx;
      const y = (event.clientY - rect.top) * sy;
      this.pending.push({ stageTimeMs: event.timeStamp, x, y, inside: x >= 0 && y >= 0 && x < this.canvas.width && y < this.canvas.height });
    });
  }

  setEnabled(enabled: boolean): void {
    this.enabled = enabled;
    clearInterval(this.timer);
    if (enabled) this.timer = window.setInterval(() => this.flush(), 20);
  }

  private flush(): void {
    if (this.pending.length === 0) return;
    const samples = this.pending.splice(0, 1000);
    void this.api.reportMouseGaze({ samples });
  }
}
