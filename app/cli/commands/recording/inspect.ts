import { inspectSession } from '../../../host/recording/inspect-session';
import type { Command } from '../../command';
import { noExtraPositionals, positional } from '../../options';
import { recordingBadInput } from './recording-errors';

const seconds = (v: number | null) => (v === null ? 'n/a' : `${v.toFixed(6)} s`);

export const recordingInspectCommand: Command = {
  path: ['recording', 'inspect'],
  summary: 'Check a session recording (recovering it first if it did not close): samples, first and last tracker timestamps, gaps, damaged chunks, torn tail cut, clean close',
  usage: 'DIR [--json]',
  options: {},
  async run(context) {
    const dir = positional(context, 0, 'DIR');
    noExtraPositionals(context, 1);
    const r = await recordingBadInput(() => inspectSession(dir));
    r.warnings.forEach(context.warn);
    const json = {
      samples: r.samples,
      first_timestamp: r.firstTimestampS,
      last_timestamp: r.lastTimestampS,
      gaps: r.gaps.map((g) => ({ start: g.start, end: g.end })),
      corrupt_chunks: r.corruptChunks,
      torn_tail_bytes: r.tornTailBytes,
      clean_close: r.cleanClose,
    };
    const recovered = r.recovery.streams;
    const text = [
      `${dir}: ${r.samples} samples, tracker time ${seconds(r.firstTimestampS)} .. ${seconds(r.lastTimestampS)}; ${recovered.frames.records} frames, ${recovered.messages.records} messages`,
      `${r.cleanClose ? 'closed cleanly' : 'not closed cleanly (recovered)'}; ${r.corruptChunks} damaged chunk(s); ${r.tornTailBytes} bytes of torn tail cut`,
      r.gaps.length === 0 ? 'no gaps' : `gaps (tracker time): ${r.gaps.map((g) => `${seconds(g.start)} .. ${seconds(g.end)}`).join(', ')}`,
    ].join('\n');
    return { json, text };
  },
};
