import { exportSession } from '../../../host/recording/export-session';
import type { Command } from '../../command';
import { noExtraPositionals, positional, requiredString } from '../../options';
import { recordingBadInput } from './recording-errors';

export const recordingExportCommand: Command = {
  path: ['recording', 'export'],
  summary:
    'Write a session\'s gaze as a tab-separated file: timestamp (session clock, s), x_coordinate, y_coordinate, pupil_size, tracker_timestamp; with --stimulus also clip, stimulus_time_us, sensor_x, sensor_y',
  usage: 'DIR --out GAZE.tsv [--stimulus] [--json]',
  options: { out: { type: 'string' }, stimulus: { type: 'boolean', default: false } },
  async run(context) {
    const dir = positional(context, 0, 'DIR');
    noExtraPositionals(context, 1);
    const out = requiredString(context, 'out');
    const stimulus = context.values.stimulus === true;
    const r = await recordingBadInput(() => exportSession(dir, out, { stimulus, onProgress: (f) => context.progress(f, 'exporting') }));
    r.warnings.forEach(context.warn);
    const runs = r.runs.map((f) => ({
      samples: f.samples,
      offset_s: f.mapping.offsetS,
      skew_ppm: f.mapping.skewFitted ? f.mapping.skew * 1e6 : null,
      uncertainty_ms: f.mapping.uncertaintyS * 1e3,
    }));
    const json = { out, samples: r.samples, ...(stimulus ? { in_clip: r.inClip } : {}), tracker_runs: runs };
    const text = [
      `${out}: ${r.samples} samples${stimulus ? `, ${r.inClip} during clips` : ''}`,
      ...runs.map((f, i) => `tracker run ${i + 1}: ${f.samples} samples, skew ${f.skew_ppm === null ? 'not fitted' : `${f.skew_ppm.toFixed(2)} ppm`}, uncertainty ${f.uncertainty_ms.toFixed(3)} ms`),
    ].join('\n');
    return { json, text };
  },
};
