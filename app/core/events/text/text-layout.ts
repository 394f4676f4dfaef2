import type { SensorSize } from '../event-batch';
import { EventFormatError } from '../event-format-error';
import { parseCsvHeader } from './text-csv-header';
import type { TextDecoderOptions } from './text-decoder-options';
import { parseSensorComment, sameSensor, sensorLabel } from './text-sensor-comment';
import type { TextTimeUnit } from './text-time-unit';

export type TextFormat = 'csv' | 'whitespace';

/** What the lines before the events say: the format, the column order, units and sensor. */
export interface TextLayout {
  readonly format: TextFormat;
  /** The role of each field in file order: 0 t, 1 x, 2 y, 3 p. */
  readonly roles: readonly number[];
  readonly unit: TextTimeUnit;
  /** The size a `# width=W height=H` first line declares. */
  readonly declaredSensor: SensorSize | null;
  /** The size events are checked against: the one given in the options, else the declared one. */
  readonly sensor: SensorSize | null;
  /** Where the event lines begin, and how many physical lines come before them. */
  readonly bodyByte: number;
  readonly bodyLine: number;
}

/**
 * Reads the start of a text event file: an optional `# width=W height=H` first line, blank
 * lines, then either a CSV header row or the first headerless line `t x y p` (t in seconds
 * unless the options say otherwise). Returns null while `bytes` (not `complete`) may still
 * be cut before that line ends, 'empty' when the complete text has no such line.
 */
export function readTextLayout(bytes: Uint8Array, complete: boolean, options: TextDecoderOptions): TextLayout | 'empty' | null {
  const { file } = options;
  const decoder = new TextDecoder();
  const hasBom = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
  let at = hasBom ? 3 : 0;
  let line = 0;
  let declaredSensor: SensorSize | null = null;
  while (at < bytes.length) {
    const newline = bytes.indexOf(10, at);
    if (newline < 0 && !complete) return null;
    const end = newline < 0 ? bytes.length : newline;
    const next = newline < 0 ? bytes.length : newline + 1;
    line++;
    // slice(), not subarray(): TextDecoder refuses views of shared memory.
    const text = decoder.decode(bytes.slice(at, end)).replace(/\r$/, '');
    const trimmed = text.trim();
    if (trimmed.startsWith('#')) {
      if (line !== 1) throw new EventFormatError(file, `line ${line}`, "only the first line may be a comment, and only '# width=W height=H'");
      declaredSensor = parseSensorComment(file, text);
    } else if (trimmed.includes(',')) {
      const header = parseCsvHeader(file, line, text);
      if (header.unit && options.timeUnit && header.unit !== options.timeUnit) {
        throw new EventFormatError(file, `line ${line}`, `the header gives t in ${header.unit} (t_${header.unit}) but the time unit option says ${options.timeUnit}`);
      }
      const unit = header.unit ?? options.timeUnit ?? 'us';
      return layout(file, 'csv', header.roles, unit, declaredSensor, options.sensor, next, line);
    } else if (trimmed !== '') {
      if (!/^[-.\d]/.test(trimmed)) {
        throw new EventFormatError(file, `line ${line}`, `expected a CSV header naming the columns t, x, y, p, or headerless lines 't x y p' with t in seconds; got '${trimmed}'`);
      }
      return layout(file, 'whitespace', [0, 1, 2, 3], options.timeUnit ?? 's', declaredSensor, options.sensor, at, line - 1);
    }
    at = next;
  }
  return complete ? 'empty' : null;
}

function layout(
  file: string,
  format: TextFormat,
  roles: readonly number[],
  unit: TextTimeUnit,
  declaredSensor: SensorSize | null,
  givenSensor: SensorSize | undefined,
  bodyByte: number,
  bodyLine: number,
): TextLayout {
  if (declaredSensor && givenSensor && !sameSensor(declaredSensor, givenSensor)) {
    throw new EventFormatError(file, 'line 1', `the file declares a ${sensorLabel(declaredSensor)} sensor but the sensor size given is ${sensorLabel(givenSensor)}`);
  }
  return { format, roles, unit, declaredSensor, sensor: givenSensor ?? declaredSensor, bodyByte, bodyLine };
}
