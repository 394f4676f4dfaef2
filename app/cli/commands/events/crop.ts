import { RegionCrop } from '../../../core/events/ops';
import { CliError, type Command } from '../../command';
import { noExtraPositionals, positional, readOptions, requiredString, sensorOption, timeUnitOption } from '../../options';
import { transcode } from './transcode';

export const eventsCropCommand: Command = {
  path: ['events', 'crop'],
  summary: 'Keep the events inside a region and move its top-left corner to (0, 0); the output sensor is the region',
  usage: 'IN OUT --region X,Y,WIDTH,HEIGHT [--width W --height H] [--json]',
  options: { ...readOptions, region: { type: 'string' } },
  run: (context) => {
    const [inPath, outPath] = [positional(context, 0, 'IN'), positional(context, 1, 'OUT')];
    noExtraPositionals(context, 2);
    const text = requiredString(context, 'region');
    const parts = text.split(',').map((p) => Number(p.trim()));
    if (parts.length !== 4 || parts.some((n) => !Number.isInteger(n) || n < 0)) throw new CliError(`--region must be X,Y,WIDTH,HEIGHT as four whole numbers, got "${text}"`);
    const [x0, y0, width, height] = parts as [number, number, number, number];
    const options = { sensor: sensorOption(context), timeUnit: timeUnitOption(context), sort: context.values.sort === true };
    return transcode(context, inPath, outPath, options, (input) => {
      const crop = new RegionCrop(input.sensor, { x0, y0, width, height });
      return { sensor: crop.outputSensor, apply: (b) => crop.push(b), describe: `inside ${width}x${height} at (${x0}, ${y0})` };
    });
  },
};
