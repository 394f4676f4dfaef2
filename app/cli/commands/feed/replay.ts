import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { parseRecordedGazeTsv, replayHello } from '../../../core/gaze/feed';
import { connectFeedSender, createLiveDeadlineTimer, replayGaze } from '../../../host/gaze/feed';
import { createMonotonicClock } from '../../../host/monotonic-clock';
import { CliError, type Command } from '../../command';
import { asBadInput } from '../../input-errors';
import { noExtraPositionals, numberOption, positional, requiredString, stringOption } from '../../options';
import { feedBadInput } from './feed-errors';

export const feedReplayCommand: Command = {
  path: ['feed', 'replay'],
  summary: 'Send a recorded gaze TSV (as gazeloom recording export writes it) through a gaze feed at its recorded rate and spacing',
  usage: 'FILE --to udp://HOST:PORT|tcp://HOST:PORT|ws://HOST:PORT [--speed 1] [--format ndjson|tsv] [--json]',
  options: { to: { type: 'string' }, speed: { type: 'string' }, format: { type: 'string' } },
  async run(context) {
    const file = positional(context, 0, 'FILE');
    noExtraPositionals(context, 1);
    const to = requiredString(context, 'to');
    const speed = numberOption(context, 'speed', { min: 0.01, max: 100 }) ?? 1;
    const format = stringOption(context, 'format') ?? 'ndjson';
    if (format !== 'ndjson' && format !== 'tsv') throw new CliError(`--format must be ndjson or tsv, got "${format}"`);
    const text = await asBadInput(() => readFile(file, 'utf8'));
    let rows;
    let hello;
    try {
      rows = parseRecordedGazeTsv(text, file);
      hello = replayHello(rows, `gazeloom feed replay ${basename(file)}`);
    } catch (error) {
      feedBadInput(error, 'to', to);
    }
    const sender = await connectFeedSender(to).catch((error: unknown) => feedBadInput(error, 'to', to));
    try {
      const clock = createMonotonicClock();
      const result = await replayGaze(rows, { hello, send: (lines) => sender.send(lines), timer: createLiveDeadlineTimer(clock), speed, format, onProgress: (f) => context.progress(f, `replaying ${basename(file)}`) });
      const durationS = rows[rows.length - 1]!.trackerTimeS - rows[0]!.trackerTimeS;
      const json = { file, to, samples: result.samples, rate_hz: hello.rateHz, duration_s: durationS, speed, format, max_late_ms: result.maxLateMs };
      return { json, text: `${file}: ${result.samples} samples sent to ${to} at ${hello.rateHz.toFixed(3)} Hz x ${speed} (${(durationS / speed).toFixed(3)} s; latest send ${result.maxLateMs.toFixed(3)} ms after its deadline)` };
    } finally {
      await sender.close();
    }
  },
};
