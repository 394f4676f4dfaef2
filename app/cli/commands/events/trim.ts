import { trimToTimeRange } from '../../../core/events/ops';
import { CliError, type Command } from '../../command';
import { noExtraPositionals, positional, readOptions, requiredNumber, sensorOption, timeUnitOption } from '../../options';
import { transcode } from './transcode';

export const eventsTrimCommand: Command = {
  path: ['events', 'trim'],
  summary: 'Keep the events from --from to --to seconds after the first event (start included, end excluded); timestamps stay as they were',
  usage: 'IN OUT --from S --to S [--width W --height H] [--time-unit U] [--json]',
  options: { ...readOptions, from: { type: 'string' }, to: { type: 'string' } },
  run: (context) => {
    const [inPath, outPath] = [positional(context, 0, 'IN'), positional(context, 1, 'OUT')];
    noExtraPositionals(context, 2);
    const fromS = requiredNumber(context, 'from', { min: 0 });
    const toS = requiredNumber(context, 'to', { min: 0 });
    if (!(toS > fromS)) throw new CliError(`--to (${toS}) must be greater than --from (${fromS})`);
    const options = { sensor: sensorOption(context), timeUnit: timeUnitOption(context), sort: context.values.sort === true };
    return transcode(context, inPath, outPath, options, (input) => {
      let originUs: number | null = null;
      return {
        sensor: input.sensor,
        describe: `between ${fromS} s and ${toS} s`,
        apply: (batch) => {
          originUs ??= batch.t.length > 0 ? batch.t[0]! : null;
          return originUs === null ? batch : trimToTimeRange(batch, originUs + fromS * 1e6, originUs + toS * 1e6);
        },
      };
    });
  },
};
