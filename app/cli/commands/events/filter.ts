import { BackgroundActivityFilter, HotPixelRemoval } from '../../../core/events/ops';
import { EventStatsAccumulator } from '../../../core/events/stats';
import type { EventBatch } from '../../../core/events/event-batch';
import { openEventInput } from '../../../host/events/event-input';
import { CliError, type Command } from '../../command';
import { noExtraPositionals, numberOption, positional, readOptions, sensorOption, timeUnitOption } from '../../options';
import { transcode } from './transcode';

export const eventsFilterCommand: Command = {
  path: ['events', 'filter'],
  summary:
    'Remove hot pixels (more than 10x the median count of firing pixels) and/or background activity (keep an event only if a neighbouring pixel fired within DT ms; Delbruck 2008)',
  usage: 'IN OUT [--hot-pixels] [--background-activity-ms DT] [--width W --height H] [--json]',
  options: { ...readOptions, 'hot-pixels': { type: 'boolean', default: false }, 'background-activity-ms': { type: 'string' } },
  run: (context) => {
    const [inPath, outPath] = [positional(context, 0, 'IN'), positional(context, 1, 'OUT')];
    noExtraPositionals(context, 2);
    const hot = context.values['hot-pixels'] === true;
    const dtMs = numberOption(context, 'background-activity-ms', { min: 0.001 });
    if (!hot && dtMs === undefined) throw new CliError('choose --hot-pixels, --background-activity-ms DT, or both');
    const options = { sensor: sensorOption(context), timeUnit: timeUnitOption(context), sort: context.values.sort === true };
    return transcode(context, inPath, outPath, options, async (input) => {
      const steps: Array<(b: EventBatch) => EventBatch> = [];
      const described: string[] = [];
      if (hot) {
        // Hot pixels are found by a first pass over the whole stream.
        const first = await openEventInput(inPath, options);
        const stats = new EventStatsAccumulator(first.sensor);
        try {
          for await (const batch of first.batches()) stats.push(batch);
        } finally {
          await first.close();
        }
        const pixels = stats.finish().hot_pixels.pixels;
        const removal = new HotPixelRemoval(input.sensor, pixels);
        steps.push((b) => removal.push(b));
        described.push(`with ${pixels.length} hot pixels removed`);
      }
      if (dtMs !== undefined) {
        const filter = new BackgroundActivityFilter(input.sensor, { dtUs: dtMs * 1000 });
        steps.push((b) => filter.push(b));
        described.push(`background-activity filtered at ${dtMs} ms`);
      }
      return { sensor: input.sensor, apply: (b) => steps.reduce((acc, step) => step(acc), b), describe: described.join(', ') };
    });
  },
};
