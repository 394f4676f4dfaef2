import type { SensorSize } from '../core/events/event-batch';
import { checkDisplayGeometry, type DisplayGeometry } from '../core/geometry/display-geometry';
import type { TextTimeUnit } from '../core/events/text/text-event-decoder';
import { CliError, type CommandContext } from './command';

/** Shared option readers: each names the option and what it expected when the value is wrong. */
export function stringOption(context: CommandContext, name: string): string | undefined {
  const value = context.values[name];
  return typeof value === 'string' ? value : undefined;
}

export function requiredString(context: CommandContext, name: string): string {
  const value = stringOption(context, name);
  if (value === undefined || value === '') throw new CliError(`--${name} is required`);
  return value;
}

export function numberOption(context: CommandContext, name: string, check: { integer?: boolean; min?: number; max?: number } = {}): number | undefined {
  const text = stringOption(context, name);
  if (text === undefined) return undefined;
  const value = Number(text);
  const ok = text.trim() !== '' && Number.isFinite(value) && (!check.integer || Number.isInteger(value)) && (check.min === undefined || value >= check.min) && (check.max === undefined || value <= check.max);
  if (!ok) {
    const kind = check.integer ? 'an integer' : 'a number';
    const range = check.min !== undefined && check.max !== undefined ? ` from ${check.min} to ${check.max}` : check.min !== undefined ? ` of at least ${check.min}` : '';
    throw new CliError(`--${name} must be ${kind}${range}, got "${text}"`);
  }
  return value;
}

export function requiredNumber(context: CommandContext, name: string, check: { integer?: boolean; min?: number; max?: number } = {}): number {
  const value = numberOption(context, name, check);
  if (value === undefined) throw new CliError(`--${name} is required`);
  return value;
}

/** --width W --height H: both or neither. */
export function sensorOption(context: CommandContext): SensorSize | undefined {
  const width = numberOption(context, 'width', { integer: true, min: 1, max: 65536 });
  const height = numberOption(context, 'height', { integer: true, min: 1, max: 32768 });
  if ((width === undefined) !== (height === undefined)) throw new CliError('give --width and --height together');
  return width === undefined || height === undefined ? undefined : { width, height };
}

const timeUnits = ['us', 'ns', 'ms', 's'] as const;

export function timeUnitOption(context: CommandContext): TextTimeUnit | undefined {
  const unit = stringOption(context, 'time-unit');
  if (unit === undefined) return undefined;
  if (!(timeUnits as readonly string[]).includes(unit)) throw new CliError(`--time-unit must be one of ${timeUnits.join(', ')}, got "${unit}"`);
  return unit as TextTimeUnit;
}

export function positional(context: CommandContext, index: number, name: string): string {
  const value = context.positionals[index];
  if (value === undefined) throw new CliError(`expected ${name}`);
  return value;
}

export function noExtraPositionals(context: CommandContext, count: number): void {
  if (context.positionals.length > count) throw new CliError(`unexpected argument "${context.positionals[count]}"`);
}

export const sensorOptions = { width: { type: 'string' }, height: { type: 'string' } } as const;
export const readOptions = { ...sensorOptions, 'time-unit': { type: 'string' }, sort: { type: 'boolean', default: false } } as const;

/** A "WxH" option, e.g. --resolution 1920x1080. */
export function sizeOption(context: CommandContext, name: string, integer: boolean): { width: number; height: number } | undefined {
  const text = stringOption(context, name);
  if (text === undefined) return undefined;
  const match = /^\s*([0-9.]+)\s*[xX×]\s*([0-9.]+)\s*$/.exec(text);
  const width = Number(match?.[1]);
  const height = Number(match?.[2]);
  const valid = match && width > 0 && height > 0 && (!integer || (Number.isInteger(width) && Number.isInteger(height)));
  if (!valid) throw new CliError(`--${name} must be WIDTHxHEIGHT${integer ? ' in whole pixels' : ''}, e.g. ${integer ? '1920x1080' : '530x298'}, got "${text}"`);
  return { width, height };
}

/** --screen-mm WxH --resolution WxH --distance-mm D: all three or none. */
export function displayOption(context: CommandContext): DisplayGeometry | undefined {
  const mm = sizeOption(context, 'screen-mm', false);
  const px = sizeOption(context, 'resolution', true);
  const distanceMm = numberOption(context, 'distance-mm', { min: 1 });
  const given = [mm, px, distanceMm].filter((v) => v !== undefined).length;
  if (given === 0) return undefined;
  if (given !== 3) throw new CliError('give --screen-mm, --resolution and --distance-mm together');
  return checkDisplayGeometry({ widthMm: mm!.width, heightMm: mm!.height, widthPx: px!.width, heightPx: px!.height, distanceMm: distanceMm! });
}

export const displayOptions = { 'screen-mm': { type: 'string' }, resolution: { type: 'string' }, 'distance-mm': { type: 'string' } } as const;
