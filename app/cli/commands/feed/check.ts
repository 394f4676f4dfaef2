import { runFeedCheck, type FeedCheckResult } from '../../../host/gaze/feed';
import { createHostLog } from '../../../host/log';
import { createMonotonicClock } from '../../../host/monotonic-clock';
import type { Command } from '../../command';
import { noExtraPositionals, requiredNumber, requiredString } from '../../options';
import { feedBadInput } from './feed-errors';

/** A measured rate further than this from the nominal one is worth a warning (common practice, no source). */
const RATE_WARNING_FRACTION = 0.01;

function warningsOf(r: FeedCheckResult, seconds: number): string[] {
  const q = r.quality;
  const w: string[] = [];
  if (q.samples === 0) w.push(`no samples arrived in ${seconds} s on ${r.url}${q.hellos === 0 ? ' (and no hello)' : ''}`);
  if (q.lossFrom === 'timestamps') w.push('the samples carry no sequence numbers: lost and out_of_order are estimated from timestamp gaps against the nominal rate');
  if (q.garbageLines > 0) w.push(`${q.garbageLines} garbage lines; ${q.garbageReasons.map((g) => `${g.count} x ${g.reason}`).join('; ')}`);
  if (q.hellos > 1) w.push(`${q.hellos} hellos arrived (the tracker or its bridge restarted); the clock figures are for the samples after the last one`);
  if (r.peers.length > 1) w.push(`${r.peers.length} senders fed this address (${r.peers.join(', ')}); all are counted together`);
  if (r.disconnections > 0) w.push(`the tracker disconnected ${r.disconnections} time(s) during the check`);
  if (q.measuredRateHz !== null && q.nominalRateHz !== null && Math.abs(q.measuredRateHz / q.nominalRateHz - 1) > RATE_WARNING_FRACTION) {
    w.push(`the measured rate ${q.measuredRateHz.toFixed(2)} Hz is more than ${RATE_WARNING_FRACTION * 100} % away from the hello's ${q.nominalRateHz} Hz`);
  }
  if (r.clock && r.clock.skewPpm === null) w.push('too short a stretch of samples to fit the clock skew (it needs 4 fit windows); clock_skew_ppm is null');
  return w;
}

const fixed = (v: number | null, digits: number, unit: string) => (v === null ? 'n/a' : `${v.toFixed(digits)}${unit}`);

export const feedCheckCommand: Command = {
  path: ['feed', 'check'],
  summary: 'Listen to a gaze feed for a while and report samples, losses, garbage lines, measured rate, arrival jitter and the tracker clock offset and skew, for setting up a tracker bridge',
  usage: '--listen udp://HOST:PORT|tcp://HOST:PORT|ws://HOST:PORT --seconds N [--json]',
  options: { listen: { type: 'string' }, seconds: { type: 'string' } },
  async run(context) {
    noExtraPositionals(context, 0);
    const url = requiredString(context, 'listen');
    const seconds = requiredNumber(context, 'seconds', { min: 0.1, max: 86_400 });
    const clock = createMonotonicClock();
    // Socket trouble is reported as warnings; garbage lines are summarised once at the end.
    const log = createHostLog({ file: null, echo: false, sink: (r) => r.level !== 'info' && r.event !== 'feed.garbage' && context.warn(`${r.event} ${JSON.stringify(r.fields)}`) });
    let r: FeedCheckResult;
    try {
      r = await runFeedCheck(url, { seconds, clock, clockEpochS: Number(clock.originNs) / 1e9, log, onProgress: (f) => context.progress(f, `listening on ${url}`) });
    } catch (error) {
      feedBadInput(error, 'listen', url);
    }
    warningsOf(r, seconds).forEach(context.warn);
    const q = r.quality;
    const json = {
      samples: q.samples,
      lost: q.lost,
      out_of_order: q.outOfOrder,
      garbage_lines: q.garbageLines,
      nominal_rate_hz: q.nominalRateHz,
      measured_rate_hz: q.measuredRateHz,
      jitter_ms_p99: q.jitterMsP99,
      clock_offset_s: r.clock?.offsetS ?? null,
      clock_skew_ppm: r.clock?.skewPpm ?? null,
    };
    const text = [
      `${r.url} for ${seconds} s: ${q.samples} samples, ${q.lost} lost, ${q.outOfOrder} out of order, ${q.garbageLines} garbage lines`,
      `rate: nominal ${fixed(q.nominalRateHz, 3, ' Hz')}, measured ${fixed(q.measuredRateHz, 3, ' Hz')}; arrival jitter p99 ${fixed(q.jitterMsP99, 3, ' ms')}`,
      r.clock
        ? `tracker clock: ${r.clock.offsetS >= 0 ? '+' : ''}${r.clock.offsetS.toFixed(6)} s from process.hrtime at the first sample, skew ${fixed(r.clock.skewPpm, 2, ' ppm')} (uncertainty ${(r.clock.uncertaintyS * 1e3).toFixed(3)} ms)`
        : 'tracker clock: no samples to fit',
      ...(r.receiveBufferBytes !== null ? [`UDP receive buffer granted: ${r.receiveBufferBytes} bytes`] : []),
    ].join('\n');
    return { json, text };
  },
};
