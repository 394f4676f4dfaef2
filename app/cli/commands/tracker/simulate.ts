import { readFile } from 'node:fs/promises';
import { hostNs, type HostClock } from '../../../core/clock/host-clock';
import { encodeHello, encodeSampleNdjson } from '../../../core/gaze/feed';
import { placeSensor } from '../../../core/geometry/placement';
import { parseTracksTsv, SimulatedTracker, type LookTarget } from '../../../core/tracker-sim';
import { connectFeedSender } from '../../../host/gaze/feed';
import { createLiveDeadlineTimer } from '../../../host/gaze/feed/deadline-timer';
import { CliError, type Command } from '../../command';
import { asBadInput } from '../../input-errors';
import { displayOption, displayOptions, noExtraPositionals, numberOption, requiredNumber, requiredString, sizeOption, stringOption } from '../../options';
import { feedBadInput } from '../feed/feed-errors';

/** The sending process's own process.hrtime: the clock the tracker's timestamps are built on. */
const hrtimeClock: HostClock = { nowNs: () => hostNs(Number(process.hrtime.bigint())) };

const defaultDisplay = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };

export const trackerSimulateCommand: Command = {
  path: ['tracker', 'simulate'],
  summary:
    'Run the simulated tracker as a separate process that speaks the gaze feed: fixations, main-sequence saccades, pursuit of a clip\'s tracked objects, blinks as invalid samples, noise, drift, latency, loss; seeded',
  usage:
    '--to udp://HOST:PORT --rate HZ --seconds N --seed S [--offset-s X] [--skew-ppm Y] [--loss-pct Z] [--noise-deg R] [--drift-deg-per-min D] [--accuracy-offset-deg A] [--latency-ms L] [--tracks TRACKS.tsv [--sensor WxH] --screen-mm WxH --resolution WxH --distance-mm D] [--json]',
  options: {
    to: { type: 'string' },
    rate: { type: 'string' },
    seconds: { type: 'string' },
    seed: { type: 'string' },
    'offset-s': { type: 'string' },
    'skew-ppm': { type: 'string' },
    'loss-pct': { type: 'string' },
    'noise-deg': { type: 'string' },
    'drift-deg-per-min': { type: 'string' },
    'accuracy-offset-deg': { type: 'string' },
    'latency-ms': { type: 'string' },
    tracks: { type: 'string' },
    sensor: { type: 'string' },
    ...displayOptions,
  },
  async run(context) {
    noExtraPositionals(context, 0);
    const to = requiredString(context, 'to');
    const rateHz = requiredNumber(context, 'rate', { min: 1, max: 10_000 });
    const seconds = requiredNumber(context, 'seconds', { min: 0.001 });
    const seed = requiredNumber(context, 'seed', { integer: true, min: 0, max: 2 ** 32 - 1 });
    const tracksPath = stringOption(context, 'tracks');
    const display = displayOption(context) ?? defaultDisplay;
    // The tracks are in sensor pixels; the clip is placed to fit the screen (the simulator's 640x480 by default).
    const sensor = sizeOption(context, 'sensor', true) ?? { width: 640, height: 480 };
    if (tracksPath && !displayOption(context)) throw new CliError('--tracks needs --screen-mm, --resolution and --distance-mm to place the clip on the screen');
    const optional = (name: string, check = {}) => numberOption(context, name, check);
    return asBadInput(async () => {
      const tracks = tracksPath ? parseTracksTsv(await readFile(tracksPath, 'utf8'), tracksPath) : null;
      const sender = await connectFeedSender(to).catch((error) => feedBadInput(error, 'to', to));
      const timer = createLiveDeadlineTimer(hrtimeClock);
      const startNs = hrtimeClock.nowNs();
      const tracker = new SimulatedTracker({
        rateHz,
        seed,
        display,
        startHostS: startNs / 1e9,
        offsetS: optional('offset-s'),
        skewPpm: optional('skew-ppm'),
        lossPct: optional('loss-pct', { min: 0, max: 100 }),
        noiseDeg: optional('noise-deg', { min: 0 }),
        driftDegPerMin: optional('drift-deg-per-min'),
        accuracyOffsetDeg: optional('accuracy-offset-deg', { min: 0 }),
        latencyMs: optional('latency-ms', { min: 0 }),
      });
      if (tracks) {
        // The clip's first tracked instant is shown at the first sample, at 1x, placed to fit.
        const look: LookTarget = { kind: 'clip', tracks, placement: placeSensor(sensor, display, 'fit'), clipStartHostS: startNs / 1e9 - tracks.startS, speed: 1 };
        tracker.setLook(look, startNs / 1e9);
      }
      await sender.send([encodeHello(tracker.hello())]);
      let sent = 0;
      let lost = 0;
      const endS = startNs / 1e9 + seconds;
      for (let tick = startNs / 1e9; tick < endS; ) {
        tick = Math.min(endS, tick + 0.01);
        for (const record of tracker.samplesUntil(tick)) {
          if (!record.delivered) {
            lost++;
            continue;
          }
          await timer.sleepUntilNs(record.dueHostS * 1e9);
          await sender.send([encodeSampleNdjson(record.sample)]);
          sent++;
        }
        context.progress((tick - startNs / 1e9) / seconds, 'sending');
      }
      await sender.close();
      return { json: { to, rate_hz: rateHz, seconds, seed, samples_sent: sent, samples_lost: lost }, text: `sent ${sent} samples to ${to} (${lost} dropped on purpose by --loss-pct)` };
    });
  },
};
