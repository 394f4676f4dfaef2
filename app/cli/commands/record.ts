import { recordFeed } from '../../host/recording/record-feed';
import { createHostLog } from '../../host/log';
import { createMonotonicClock } from '../../host/monotonic-clock';
import type { Command } from '../command';
import { noExtraPositionals, requiredNumber, requiredString } from '../options';
import { feedBadInput } from './feed/feed-errors';
import { displayOption, displayOptions } from '../options';
import { recordingBadInput } from './recording/recording-errors';

export const recordCommand: Command = {
  path: ['record'],
  summary: 'Record a gaze feed into a new session folder (created if missing, or empty) with the same recorder as the app, without the UI; Ctrl-C ends it early and still closes it cleanly',
  usage: '--listen udp://HOST:PORT|tcp://HOST:PORT|ws://HOST:PORT --seconds N --out DIR [--screen-mm WxH --resolution WxH --distance-mm D] [--json]',
  options: { listen: { type: 'string' }, seconds: { type: 'string' }, out: { type: 'string' }, ...displayOptions },
  async run(context) {
    noExtraPositionals(context, 0);
    const url = requiredString(context, 'listen');
    const seconds = requiredNumber(context, 'seconds', { min: 0.1, max: 86_400 });
    const dir = requiredString(context, 'out');
    const display = displayOption(context) ?? null;
    const clock = createMonotonicClock();
    const log = createHostLog({ file: null, echo: false, sink: (r) => r.level !== 'info' && r.event !== 'feed.garbage' && context.warn(`${r.event} ${JSON.stringify(r.fields)}`) });
    const stop = new AbortController();
    const interrupt = () => stop.abort();
    process.once('SIGINT', interrupt);
    try {
      const r = await recordingBadInput(async () => {
        try {
          return await recordFeed({ url, dir, seconds, display, clock, clockOriginNs: clock.originNs, log, signal: stop.signal, onProgress: (f) => context.progress(f, `recording ${url}`) });
        } catch (error) {
          return feedBadInput(error, 'listen', url);
        }
      });
      if (r.samples === 0) context.warn(`no samples arrived on ${url}`);
      if (r.garbageLines > 0) context.warn(`${r.garbageLines} garbage lines were ignored`);
      const json = {
        out: dir,
        session_id: r.sessionId,
        seconds: r.seconds,
        samples: r.samples,
        messages: r.messages,
        garbage_lines: r.garbageLines,
        disconnects: r.disconnects,
        interrupted: r.interrupted,
        clean_close: true,
      };
      const text = `${dir}: ${r.samples} samples and ${r.messages} messages recorded from ${url} in ${r.seconds.toFixed(1)} s${r.interrupted ? ' (interrupted)' : ''}; ${r.disconnects} disconnection(s); closed cleanly`;
      return { json, text };
    } finally {
      process.off('SIGINT', interrupt);
    }
  },
};
