import type { Command } from '../../command';
import { noExtraPositionals, positional, readOptions, sensorOption, timeUnitOption } from '../../options';
import { transcode } from './transcode';

export const eventsConvertCommand: Command = {
  path: ['events', 'convert'],
  summary: 'Convert between event formats; OUT picks the format by extension (.glev binary, .csv text with t in integer µs and a size comment)',
  usage: 'IN OUT [--width W --height H] [--time-unit us|ns|ms|s] [--sort] [--json]',
  options: readOptions,
  run: (context) => {
    const [inPath, outPath] = [positional(context, 0, 'IN'), positional(context, 1, 'OUT')];
    noExtraPositionals(context, 2);
    const options = { sensor: sensorOption(context), timeUnit: timeUnitOption(context), sort: context.values.sort === true };
    return transcode(context, inPath, outPath, options, (input) => ({ sensor: input.sensor, apply: (b) => b, describe: 'converted' }));
  },
};
