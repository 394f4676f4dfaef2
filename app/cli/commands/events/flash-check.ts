import type { LookName } from '../../../core/render/look-settings';
import type { PlacementMode } from '../../../core/geometry/placement';
import type { FlashAnalysis, FlashFailure } from '../../../core/safety';
import { screenEventFile } from '../../../host/stimuli/screen-event-file';
import { CliError, type Command, type CommandContext } from '../../command';
import { asBadInput } from '../../input-errors';
import { displayOption, displayOptions, noExtraPositionals, numberOption, positional, readOptions, sensorOption, stringOption, timeUnitOption } from '../../options';

const looks: readonly LookName[] = ['polarity', 'decay', 'grey'];
const placements: readonly PlacementMode[] = ['fit', '1:1', 'integer'];

function choice<T extends string>(context: CommandContext, name: string, allowed: readonly T[], fallback: T): T {
  const value = stringOption(context, name) ?? fallback;
  if (!(allowed as readonly string[]).includes(value)) throw new CliError(`--${name} must be one of ${allowed.join(', ')}, got "${value}"`);
  return value as T;
}

const describeFailure = (f: FlashFailure): string =>
  `  ${f.kind} flashing ${f.flashes_per_s} a second from ${f.start_s.toFixed(2)} s to ${f.end_s.toFixed(2)} s, ` +
  `screen ${f.region.width_px}x${f.region.height_px} px at (${f.region.x_px}, ${f.region.y_px}), ` +
  `${f.region.left_deg}..${f.region.right_deg} deg across, ${f.region.top_deg}..${f.region.bottom_deg} deg down, ${f.region.solid_angle_sr} sr`;

function asText(file: string, a: FlashAnalysis): string {
  const w = a.analysedWith;
  const head = `${file}: ${a.pass ? 'pass' : 'FAIL'}: flash screening (WCAG 2.2 SC 2.3.1 thresholds) in the ${w.look} look at ${w.speed}x, ${w.placement}, ${w.rateHz} Hz, ${w.frames} frames`;
  return [head, ...a.failures.map(describeFailure)].join('\n');
}

export const eventsFlashCheckCommand: Command = {
  path: ['events', 'flash-check'],
  summary: 'Screen an event clip, rendered as the stage shows it, for flashing above the general and red flash thresholds of WCAG 2.2 (SC 2.3.1)',
  usage: 'FILE [--look polarity|decay|grey] [--speed S] [--placement fit|1:1|integer] --screen-mm WxH --resolution WxH --distance-mm D [--rate-hz R] [--width W --height H] [--time-unit U] [--json]',
  options: { ...readOptions, ...displayOptions, look: { type: 'string' }, speed: { type: 'string' }, placement: { type: 'string' }, 'rate-hz': { type: 'string' } },
  async run(context) {
    const file = positional(context, 0, 'FILE');
    noExtraPositionals(context, 1);
    const display = displayOption(context);
    if (!display) throw new CliError('give the display: --screen-mm WxH --resolution WxH --distance-mm D');
    const look = choice(context, 'look', looks, 'polarity');
    const placement = choice(context, 'placement', placements, 'fit');
    const speed = numberOption(context, 'speed', { min: 0.01, max: 100 }) ?? 1;
    const rateHz = numberOption(context, 'rate-hz', { min: 1, max: 1000 }) ?? 60;
    return asBadInput(async () => {
      const { analyses, warnings } = await screenEventFile(file, [look], { speed, placement, display, rateHz }, (f) => context.progress(f, 'screening'), {
        sensor: sensorOption(context),
        timeUnit: timeUnitOption(context),
        sort: context.values.sort === true,
      });
      warnings.forEach(context.warn);
      const analysis = analyses[0]!;
      const w = analysis.analysedWith;
      return {
        json: {
          file,
          pass: analysis.pass,
          failures: analysis.failures,
          analysed_with: { look: w.look, speed: w.speed, placement: w.placement, display: w.display, rate_hz: w.rateHz, frames: w.frames, cells: w.cells, cell_side_deg: w.cellSideDeg, analyser_version: w.analyserVersion },
        },
        text: asText(file, analysis),
      };
    });
  },
};
