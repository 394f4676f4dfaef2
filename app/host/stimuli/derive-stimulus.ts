import type { EventBatch, SensorSize } from '../../core/events/event-batch';
import { BackgroundActivityFilter, HotPixelRemoval, RegionCrop, trimToTimeRange } from '../../core/events/ops';
import type { EventStats, StimulusMeta, StimulusOperation } from '../../contract/schemas/stimuli';

/** What an operation does to a stream: the output sensor, a per-batch transform and a label. */
export interface Derivation {
  readonly sensor: SensorSize;
  readonly transform: (batch: EventBatch) => EventBatch;
  readonly describe: string;
  readonly parameters: Record<string, number | string | boolean>;
}

const seconds = (us: number, origin: number): string => `${((us - origin) / 1e6).toFixed(3)} s`;

/** Builds the streaming transform for one library operation on a parent stimulus. */
export function derivationFor(parent: StimulusMeta, stats: EventStats | null, op: StimulusOperation): Derivation {
  switch (op.operation) {
    case 'trim':
      if (!(op.toUs > op.fromUs)) throw new RangeError(`trim: the end (${op.toUs} µs) must come after the start (${op.fromUs} µs)`);
      return {
        sensor: parent.sensor,
        transform: (batch) => trimToTimeRange(batch, op.fromUs, op.toUs),
        describe: `trimmed to ${seconds(op.fromUs, parent.tStartUs)}–${seconds(op.toUs, parent.tStartUs)}`,
        parameters: { fromUs: op.fromUs, toUs: op.toUs },
      };
    case 'crop': {
      const crop = new RegionCrop(parent.sensor, { x0: op.x0, y0: op.y0, width: op.width, height: op.height });
      return {
        sensor: crop.outputSensor,
        transform: (batch) => crop.push(batch),
        describe: `cropped to ${op.width}×${op.height} at (${op.x0}, ${op.y0})`,
        parameters: { x0: op.x0, y0: op.y0, width: op.width, height: op.height },
      };
    }
    case 'remove-hot-pixels': {
      const pixels = stats?.hot_pixels.pixels ?? [];
      const removal = new HotPixelRemoval(parent.sensor, pixels);
      return {
        sensor: parent.sensor,
        transform: (batch) => removal.push(batch),
        describe: `${pixels.length} hot pixels removed`,
        parameters: { pixels: pixels.length },
      };
    }
    case 'background-activity': {
      const filter = new BackgroundActivityFilter(parent.sensor, { dtUs: op.dtUs });
      return {
        sensor: parent.sensor,
        transform: (batch) => filter.push(batch),
        describe: `background-activity filtered (${(op.dtUs / 1000).toFixed(1)} ms)`,
        parameters: { dtUs: op.dtUs },
      };
    }
  }
}
