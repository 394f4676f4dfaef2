import type { SessionQuality } from '../../../core/quality/session-quality';
import { archiveQuality } from '../../../host/quality/archive-quality';
import type { Command } from '../../command';
import { noExtraPositionals, requiredString, stringOption } from '../../options';
import { archiveBadInput } from '../archive/archive-errors';

const deg = (v: number | null): string => (v === null ? 'n/a' : `${v.toFixed(2)}°`);

function sessionLines(s: SessionQuality): string[] {
  const v = s.validations.at(-1);
  return [
    `${s.session} (participant ${s.participant}): ${s.flags.length ? `FLAGGED ${s.flags.join(', ')}` : 'no flags'}`,
    `  validations ${s.validations.length}${v ? `, latest at ${v.time_s?.toFixed(1) ?? 'n/a'} s: mean ${deg(v.mean_accuracy_deg)}, max ${deg(v.max_accuracy_deg)}, RMS-S2S ${deg(v.precision_rms_s2s_deg)}, SD ${deg(v.precision_sd_deg)}, ${v.accepted ? 'accepted' : 'not accepted'}` : ''}`,
    `  drift checks ${s.drift.length}${s.drift.length ? `: largest ${deg(Math.max(...s.drift.map((d) => d.offset_deg ?? 0)))}, rate ${s.drift_rate_deg_per_min === null ? 'n/a' : `${s.drift_rate_deg_per_min.toFixed(2)}°/min`}` : ''}`,
    `  data loss ${s.data_loss_pct === null ? 'n/a' : `${s.data_loss_pct.toFixed(1)} %`}, late frames ${s.late_frames_pct === null ? 'n/a' : `${s.late_frames_pct.toFixed(2)} %`}`,
  ];
}

export const qualityCommand: Command = {
  path: ['quality'],
  summary:
    'Data quality of the sessions in a lab archive (folder or .zip): each validation (accuracy, precision, data loss, accepted), each drift check (offset in degrees) with times from the session\'s first sample, the drift rate, and flags (validation_failed, no_validation, drift_exceeded, drift_rate_high, data_loss_high, late_frames_high)',
  usage: '--archive DIR [--session ID] [--json]',
  options: { archive: { type: 'string' }, session: { type: 'string' } },
  async run(context) {
    noExtraPositionals(context, 0);
    const path = requiredString(context, 'archive');
    const sessionId = stringOption(context, 'session');
    const { sessions, withoutRecording } = await archiveBadInput(() => archiveQuality(path, { sessionId }));
    for (const id of withoutRecording) context.warn(`session ${id}: the archive holds no recording, so its times and data loss are null`);
    const text = sessions.length === 0 ? `${path}: no sessions` : sessions.flatMap(sessionLines).join('\n');
    return { json: { sessions }, text };
  },
};
