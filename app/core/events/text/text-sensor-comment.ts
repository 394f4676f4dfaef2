import type { SensorSize } from '../event-batch';
import { EventFormatError } from '../event-format-error';

const SIZE_COMMENT = /^#\s*width\s*=\s*(\d+)\s+height\s*=\s*(\d+)\s*$/;

/** Reads the optional first line `# width=W height=H` that declares the sensor size. */
export function parseSensorComment(file: string, text: string): SensorSize {
  const match = SIZE_COMMENT.exec(text.trim());
  if (!match) throw new EventFormatError(file, 'line 1', `expected '# width=W height=H' declaring the sensor size, got '${text.trim()}'`);
  const width = Number(match[1]);
  const height = Number(match[2]);
  if (!(width >= 1 && width <= 65536 && height >= 1 && height <= 65536)) {
    throw new EventFormatError(file, 'line 1', `sensor size ${width}x${height} is out of range (width and height from 1 to 65536)`);
  }
  return { width, height };
}

export const sameSensor = (a: SensorSize, b: SensorSize): boolean => a.width === b.width && a.height === b.height;

export const sensorLabel = (s: SensorSize): string => `${s.width}x${s.height}`;
