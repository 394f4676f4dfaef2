import type { StageCommand } from '../../app/contract';
import type { StageSurface } from './surface';

type Show = Extract<StageCommand, { type: 'showTarget' }>;

/**
 * Calibration, validation and drift-check targets: a white disc that starts large to draw
 * the eye and shrinks to its resting size, with a black centre dot to fixate.
 */
export class TargetLayer {
  private readonly targets = new Map<string, { command: Show; shownAtMs: number }>();

  show(command: Show, nowMs: number): void {
    this.targets.set(command.id, { command, shownAtMs: nowMs });
  }

  hide(id: string): void {
    this.targets.delete(id);
  }

  get count(): number {
    return this.targets.size;
  }

  draw(surface: StageSurface, nowMs: number): void {
    for (const { command, shownAtMs } of this.targets.values()) {
      const progress = command.shrinkMs > 0 ? Math.min(1, (nowMs - shownAtMs) / command.shrinkMs) : 1;
      const radius = command.outerPx + (command.innerPx - command.outerPx) * progress;
      surface.fillDisc(command.x, command.y, radius, [255, 255, 255]);
      surface.fillDisc(command.x, command.y, Math.max(1.5, command.innerPx / 3), [0, 0, 0]);
    }
  }
}
