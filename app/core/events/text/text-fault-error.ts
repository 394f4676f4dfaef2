import { EventFormatError } from '../event-format-error';
import type { TextLayout } from './text-layout';
import type { TextFault } from './text-range-types';
import { sensorLabel } from './text-sensor-comment';
import { formatTicks, TIME_UNITS, type TextTimeUnit } from './text-time-unit';

const ROLE_NAMES = ['t', 'x', 'y', 'p'];

/** The fields of a line as a person reads them (the hot loop only points at one). */
function splitTextLine(layout: TextLayout, text: string): string[] {
  const line = text.replace(/\r$/, '');
  return layout.format === 'csv' ? line.split(',').map((f) => f.trim()) : line.trim().split(/[ \t\r]+/);
}

/** The text of the line that starts at `at`, for a message. */
export function lineTextAt(bytes: Uint8Array, at: number): string {
  const newline = bytes.indexOf(10, at);
  return new TextDecoder().decode(bytes.slice(at, newline < 0 ? bytes.length : newline)).replace(/\r$/, '');
}

const offText = (code: number): string => (code === 2 ? '-1' : '0');

const decimalsAdvice: Readonly<Record<TextTimeUnit, string>> = {
  us: 'has decimals, but t is in whole microseconds; give t in ns (t_ns) for finer times',
  ns: 'has decimals, but t is in whole nanoseconds',
  ms: 'has more than 3 decimals, finer than a microsecond; give t in us or ns (t_us, t_ns)',
  s: 'has more than 9 decimals, finer than a nanosecond',
};

/** Turns a fault from the hot loop into the error a person reads. */
export function textFaultError(file: string, layout: TextLayout, fault: TextFault, lineText: string): EventFormatError {
  const fields = splitTextLine(layout, lineText);
  const column = fault.field >= 0 ? ROLE_NAMES[layout.roles[fault.field]!]! : '';
  const got = fault.field >= 0 ? fields[fault.field] ?? '' : '';
  const quoted = got === '' ? 'nothing' : `'${got}'`;
  const sensor = layout.sensor;
  const unit = layout.unit;
  const problem = (() => {
    switch (fault.kind) {
      case 'malformed':
        return `expected 4 fields (${layout.roles.map((r) => ROLE_NAMES[r]).join(layout.format === 'csv' ? ',' : ' ')}), found ${fields.length}`;
      case 'not-a-number':
        return `column ${column}: expected ${column === 't' ? 'a number' : column === 'p' ? 'a polarity (0 or 1, or -1 and 1)' : 'a whole number'}, got ${quoted}`;
      case 'negative-time':
        return `column t: timestamps cannot be negative, got ${quoted}`;
      case 'too-many-decimals':
        return `column t: ${quoted} ${decimalsAdvice[unit]}`;
      case 'time-too-large':
        return `column t: ${quoted} is too large to hold exactly (at most ${formatTicks(TIME_UNITS[unit].tickLimit, unit)} ${unit})`;
      case 'negative-coordinate':
        return `column ${column}: coordinates cannot be negative, got ${quoted}`;
      case 'coordinate-too-large':
        return `column ${column}: ${got} is above 65535, the largest coordinate`;
      case 'outside-sensor':
        return `column ${column}: ${got} is outside the ${sensorLabel(sensor!)} sensor (${column} must be below ${column === 'x' ? sensor!.width : sensor!.height})`;
      case 'bad-polarity':
        return `column p: polarity must be 0 or 1 (or -1 and 1), got ${quoted}`;
      case 'mixed-polarity':
        return `OFF is written as ${offText(3 - fault.earlierOffCode)} here but as ${offText(fault.earlierOffCode)} on line ${fault.earlierLine}; use 0/1 or -1/1 for polarity, not both`;
      case 'unsorted':
        return `timestamp ${formatTicks(fault.ticks, unit)} is earlier than ${formatTicks(fault.earlierTicks, unit)} on line ${fault.earlierLine} (use --sort to reorder)`;
    }
  })();
  return new EventFormatError(file, `line ${fault.line}`, problem);
}
