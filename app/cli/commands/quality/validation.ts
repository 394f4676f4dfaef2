import { readFile } from 'node:fs/promises';
import { validationFromRows } from '../../../core/quality/file-validation';
import { DEFAULT_WINDOW_MS } from '../../../core/quality/sample-window';
import { parseGazeTsv, parseTargetsTsv, QualityFileError } from '../../../core/quality/validation-tsv';
import { CliError, type Command, type CommandContext } from '../../command';
import { asBadInput } from '../../input-errors';
import { displayOption, displayOptions, noExtraPositionals, requiredString, stringOption } from '../../options';

/** --window-ms FROM-TO, milliseconds after each target's onset. */
function windowOption(context: CommandContext): { fromMs: number; toMs: number } {
  const text = stringOption(context, 'window-ms');
  if (text === undefined) return { ...DEFAULT_WINDOW_MS };
  const match = /^\s*(\d+(?:\.\d+)?)\s*-\s*(\d+(?:\.\d+)?)\s*$/.exec(text);
  const fromMs = Number(match?.[1]);
  const toMs = Number(match?.[2]);
  if (!match || !(toMs > fromMs)) throw new CliError(`--window-ms must be FROM-TO in milliseconds after onset with FROM < TO, e.g. 300-1300, got "${text}"`);
  return { fromMs, toMs };
}

const deg = (v: number | null): string => (v === null ? 'n/a' : `${v.toFixed(3)}°`);

export const qualityValidationCommand: Command = {
  path: ['quality', 'validation'],
  summary:
    'One validation from files: accuracy (angle from the target to the mean gaze), precision (RMS-S2S and SD) and data loss per target, from a gaze TSV (timestamp, x_coordinate, y_coordinate; n/a invalid) and a targets TSV (onset, duration, x, y), with the samples from 300 to 1300 ms after each onset unless --window-ms says otherwise',
  usage: '--input GAZE.tsv --targets TARGETS.tsv --screen-mm WxH --resolution WxH --distance-mm D [--window-ms 300-1300] [--json]',
  options: { input: { type: 'string' }, targets: { type: 'string' }, 'window-ms': { type: 'string' }, ...displayOptions },
  async run(context) {
    noExtraPositionals(context, 0);
    const input = requiredString(context, 'input');
    const targetsFile = requiredString(context, 'targets');
    const display = displayOption(context);
    if (!display) throw new CliError('--screen-mm, --resolution and --distance-mm are required: angles need the display geometry');
    const window = windowOption(context);
    const result = await asBadInput(async () => {
      try {
        const gaze = parseGazeTsv(await readFile(input, 'utf8'), input);
        const targets = parseTargetsTsv(await readFile(targetsFile, 'utf8'), targetsFile);
        return validationFromRows(gaze, targets, display, window, { gaze: input, targets: targetsFile });
      } catch (error) {
        if (error instanceof QualityFileError) throw new CliError(error.message);
        throw error;
      }
    });
    const points = result.points.map((p) => ({ x: p.x, y: p.y, accuracy_deg: p.accuracyDeg, precision_rms_s2s_deg: p.precisionRmsS2SDeg, precision_sd_deg: p.precisionSdDeg, data_loss_pct: p.dataLossPct, samples: p.samples }));
    const json = { points, mean_accuracy_deg: result.meanAccuracyDeg, max_accuracy_deg: result.maxAccuracyDeg, rate_hz: result.rateHz, window_ms: [window.fromMs, window.toMs] };
    const text = [
      `${points.length} targets, samples ${window.fromMs}-${window.toMs} ms after onset at ${result.rateHz.toFixed(1)} Hz: mean accuracy ${deg(result.meanAccuracyDeg)}, max ${deg(result.maxAccuracyDeg)}`,
      ...points.map((p, i) => `  ${i + 1}. (${p.x}, ${p.y}): accuracy ${deg(p.accuracy_deg)}, RMS-S2S ${deg(p.precision_rms_s2s_deg)}, SD ${deg(p.precision_sd_deg)}, data loss ${p.data_loss_pct.toFixed(1)} %, ${p.samples} valid samples`),
    ].join('\n');
    return { json, text };
  },
};
