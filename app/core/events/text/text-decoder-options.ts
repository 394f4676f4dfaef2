import type { SensorSize } from '../event-batch';
import { isTextTimeUnit, type TextTimeUnit } from './text-time-unit';

export interface TextDecoderOptions {
  /** The file's name, for messages. */
  readonly file: string;
  /** The unit of t (the --time-unit option); it must agree with a unit the CSV header names. */
  readonly timeUnit?: TextTimeUnit;
  /** The sensor size, when known from elsewhere; it must agree with a `# width=W height=H` line. */
  readonly sensor?: SensorSize;
  /** Skip the check that timestamps never decrease (the caller sorts the events afterwards). */
  readonly allowUnsorted?: boolean;
}

/** Throws RangeError naming the option that is invalid. */
export function checkTextDecoderOptions(options: TextDecoderOptions): void {
  if (typeof options.file !== 'string') throw new RangeError('file must be a string');
  if (options.timeUnit !== undefined && !isTextTimeUnit(options.timeUnit)) {
    throw new RangeError(`timeUnit must be one of us, ns, ms, s, got ${String(options.timeUnit)}`);
  }
  const sensor = options.sensor;
  if (sensor !== undefined) {
    const valid = (n: number) => Number.isInteger(n) && n >= 1 && n <= 65536;
    if (!valid(sensor.width) || !valid(sensor.height)) {
      throw new RangeError(`sensor must have integer width and height from 1 to 65536, got ${sensor.width}x${sensor.height}`);
    }
  }
}
