import { EventStatsAccumulator } from '../../../core/events/stats';
import { openEventInput } from '../../../host/events/event-input';
import type { Command } from '../../command';
import { asBadInput } from '../../input-errors';
import { noExtraPositionals, positional, readOptions, sensorOption, timeUnitOption } from '../../options';

const format = (n: number | null, digits = 0) => (n === null ? 'n/a' : n.toLocaleString('en-GB', { maximumFractionDigits: digits }));

export const eventsStatsCommand: Command = {
  path: ['events', 'stats'],
  summary: 'Count, duration, sensor size, ON/OFF counts, mean and peak rate, the rate over time and hot pixels of an event file',
  usage: 'FILE [--width W --height H] [--time-unit us|ns|ms|s] [--sort] [--json]',
  options: readOptions,
  async run(context) {
    const file = positional(context, 0, 'FILE');
    noExtraPositionals(context, 1);
    return asBadInput(async () => {
      const input = await openEventInput(file, { sensor: sensorOption(context), timeUnit: timeUnitOption(context), sort: context.values.sort === true }, (f) => context.progress(f, 'reading'));
      try {
        input.warnings.forEach(context.warn);
        const stats = new EventStatsAccumulator(input.sensor);
        for await (const batch of input.batches()) stats.push(batch);
        const s = stats.finish();
        const text = [
          `${file}: ${format(s.count)} events on a ${s.width}x${s.height} sensor`,
          `time ${format(s.t_start_us)} .. ${format(s.t_end_us)} µs (${s.duration_s.toFixed(6)} s)`,
          `ON ${format(s.on_count)}, OFF ${format(s.off_count)}`,
          `mean rate ${format(s.mean_rate_hz)} events/s, peak ${format(s.peak_rate_hz)} events/s (1 ms bins)`,
          `hot pixels: ${s.hot_pixels.pixels.length} (over ${s.hot_pixels.threshold_factor}x the median ${format(s.hot_pixels.median_count, 1)})`,
        ].join('\n');
        return { json: { file, ...s }, text };
      } finally {
        await input.close();
      }
    });
  },
};
