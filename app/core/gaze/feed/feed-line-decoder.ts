import type { FeedHeader } from './feed-header';
import { garbage, type FeedItem } from './feed-item';
import { parseFeedLine } from './parse-feed-line';

const DEFAULT_MAX_LINE_CHARS = 65_536;

/**
 * Turns a feed's bytes or text into decoded lines, whatever the packet boundaries: a line
 * may be split across TCP segments, a UTF-8 character across chunks. It remembers the hello
 * in force, so a new hello (tracker restarted) changes how later lines are read.
 *
 * Datagrams and WebSocket frames hold whole lines, so their receivers call `flush()` after
 * each one; a stream calls it once, at its end. Blank lines and "\r\n" endings are accepted.
 * A line longer than `maxLineChars` is reported once and skipped up to its newline, so a
 * peer that never sends one cannot grow the buffer without bound.
 */
export class FeedLineDecoder {
  private header: FeedHeader | null = null;
  private pending = '';
  private skippingLongLine = false;
  private readonly text = new TextDecoder('utf-8');
  private readonly maxLineChars: number;

  constructor(options: { maxLineChars?: number } = {}) {
    this.maxLineChars = options.maxLineChars ?? DEFAULT_MAX_LINE_CHARS;
    if (!(Number.isInteger(this.maxLineChars) && this.maxLineChars >= 1)) throw new RangeError(`maxLineChars must be an integer of at least 1, got ${options.maxLineChars}`);
  }

  /** The hello in force, or null before the first. */
  get current(): FeedHeader | null {
    return this.header;
  }

  push(chunk: Uint8Array | string): FeedItem[] {
    const text = typeof chunk === 'string' ? chunk : this.text.decode(chunk, { stream: true });
    const out: FeedItem[] = [];
    let start = 0;
    for (let nl = text.indexOf('\n'); nl !== -1; nl = text.indexOf('\n', start)) {
      const piece = text.slice(start, nl);
      start = nl + 1;
      if (this.skippingLongLine) {
        this.skippingLongLine = false;
        this.pending = '';
        continue;
      }
      const line = this.pending === '' ? piece : this.pending + piece;
      this.pending = '';
      this.take(line, out);
    }
    if (!this.skippingLongLine) {
      this.pending += text.slice(start);
      if (this.pending.length > this.maxLineChars) {
        out.push(garbage(`line longer than ${this.maxLineChars} characters without a newline; skipped`));
        this.pending = '';
        this.skippingLongLine = true;
      }
    }
    return out;
  }

  /** Ends the current datagram, frame or stream: a last line without a newline is still a line. */
  flush(): FeedItem[] {
    const out = this.push(this.text.decode());
    const line = this.pending;
    this.pending = '';
    this.skippingLongLine = false;
    this.take(line, out);
    return out;
  }

  private take(raw: string, out: FeedItem[]): void {
    const line = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (line.trim() === '') return;
    if (line.length > this.maxLineChars) {
      out.push(garbage(`line longer than ${this.maxLineChars} characters; skipped`));
      return;
    }
    const item = parseFeedLine(line, this.header);
    if (item.kind === 'hello') this.header = item.header;
    out.push(item);
  }
}
