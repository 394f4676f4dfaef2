import type { FeedHeader } from './feed-header';
import { garbage, type FeedItem } from './feed-item';
import { parseHello } from './parse-hello';
import { parseSampleObject } from './parse-sample-ndjson';
import { parseSampleTsv } from './parse-sample-tsv';

/** Longer than any sample or hello can sensibly be; reported with its length, not its text. */
const SHOWN_CHARS = 60;
const shown = (line: string): string => (line.length > SHOWN_CHARS ? `${JSON.stringify(line.slice(0, SHOWN_CHARS))}...` : JSON.stringify(line));

/**
 * Decodes one line (without its newline) given the hello in force, or null before any.
 * A line starting with "{" is JSON: a hello when it has "gazeloom_feed", else an NDJSON
 * sample. Any other line is a TSV sample. Samples before a hello are garbage.
 */
export function parseFeedLine(line: string, current: FeedHeader | null): FeedItem {
  if (line.trim() === '') return garbage('empty line');
  if (line.startsWith('{')) {
    let o: Record<string, unknown>; // a line starting with "{" parses to an object or not at all
    try {
      o = JSON.parse(line) as Record<string, unknown>;
    } catch {
      return garbage(`not valid JSON: ${shown(line)}`);
    }
    if ('gazeloom_feed' in o) {
      const header = parseHello(o);
      return typeof header === 'string' ? garbage(header) : { kind: 'hello', hello: header.hello, header };
    }
    if (current === null) return garbage('sample before any hello');
    if (!('t' in o)) return garbage(`JSON line is neither a hello (no "gazeloom_feed") nor a sample (no "t"): ${shown(line)}`);
    const sample = parseSampleObject(o, current);
    return typeof sample === 'string' ? garbage(sample) : { kind: 'sample', sample };
  }
  if (current === null) return garbage('sample before any hello');
  const sample = parseSampleTsv(line, current);
  return typeof sample === 'string' ? garbage(sample) : { kind: 'sample', sample };
}
