import { concatBatches, emptyBatch, type EventBatch, type SensorSize, type TimeResolution } from '../event-batch';
import { EventFormatError } from '../event-format-error';
import { decodeTextLinesIntoBatch } from './decode-text-lines-into-batch';
import { checkTextDecoderOptions, type TextDecoderOptions } from './text-decoder-options';
import { lineTextAt, textFaultError } from './text-fault-error';
import { readTextLayout, type TextFormat, type TextLayout } from './text-layout';
import { textRangeConfig } from './text-range-config';
import { newTextRangeState, type TextRangeConfig } from './text-range-types';
import { TIME_UNITS } from './text-time-unit';

export type { TextDecoderOptions } from './text-decoder-options';
export type { TextTimeUnit } from './text-time-unit';

const NO_BYTES = new Uint8Array(0);
const NEWLINE = new Uint8Array([10]);

function join(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}

/**
 * Decodes a text event stream pushed in chunks of any size, split anywhere: CSV with a
 * header naming t, x, y, p (t in µs unless the header or options say otherwise), or
 * headerless `t x y p` lines with t in seconds, each optionally after a first line
 * `# width=W height=H`. Every problem is an EventFormatError naming the physical line.
 */
export class TextEventDecoder {
  readonly #options: TextDecoderOptions;
  #layout: TextLayout | null = null;
  #config: TextRangeConfig | null = null;
  /** Bytes seen before the layout is known. */
  #pending: Uint8Array = NO_BYTES;
  /** The start of a line whose newline has not arrived yet. */
  #carry: Uint8Array = NO_BYTES;
  readonly #state = newTextRangeState();
  #bytesRead = 0;
  #ended = false;
  #failure: EventFormatError | null = null;

  constructor(options: TextDecoderOptions) {
    checkTextDecoderOptions(options);
    this.#options = options;
  }

  get format(): TextFormat | null {
    return this.#layout?.format ?? null;
  }

  /** The time resolution of the stream (final once `format` is known). */
  get resolution(): TimeResolution {
    return TIME_UNITS[this.#layout?.unit ?? this.#options.timeUnit ?? 'us'].resolution;
  }

  get declaredSensor(): SensorSize | null {
    return this.#layout?.declaredSensor ?? null;
  }

  /** The smallest sensor that holds every event so far (max x + 1, max y + 1). */
  get extent(): SensorSize {
    return { width: this.#state.maxX + 1, height: this.#state.maxY + 1 };
  }

  get eventCount(): number {
    return this.#state.events;
  }

  /** Physical lines read so far, the header and comment included. */
  get lineCount(): number {
    return this.#state.lines;
  }

  get bytesRead(): number {
    return this.#bytesRead;
  }

  /** The events of the complete lines seen so far. */
  push(bytes: Uint8Array): EventBatch {
    this.#checkOpen();
    this.#bytesRead += bytes.length;
    return this.#guard(() => {
      if (this.#layout) return this.#decode(bytes, false);
      this.#pending = join(this.#pending, bytes);
      const body = this.#findLayout(false);
      return body ? this.#decode(body, false) : emptyBatch();
    });
  }

  /** The events of a last line without a newline; throws "no events" if the stream had none. */
  end(): EventBatch {
    this.#checkOpen();
    this.#ended = true;
    return this.#guard(() => {
      const batch = this.#layout ? this.#decode(NO_BYTES, true) : this.#decode(this.#findLayout(true) ?? NO_BYTES, true);
      if (this.#state.events === 0) throw new EventFormatError(this.#options.file, '', 'no events');
      return batch;
    });
  }

  #checkOpen(): void {
    if (this.#failure) throw this.#failure;
    if (this.#ended) throw new Error('TextEventDecoder: end() was already called');
  }

  #guard(work: () => EventBatch): EventBatch {
    try {
      return work();
    } catch (error) {
      if (error instanceof EventFormatError) this.#failure = error;
      throw error;
    }
  }

  /** Reads the layout from the pending bytes; returns the bytes of the event lines, or null while it needs more. */
  #findLayout(complete: boolean): Uint8Array | null {
    const found = readTextLayout(this.#pending, complete, this.#options);
    if (found === null) return null;
    if (found === 'empty') throw new EventFormatError(this.#options.file, '', 'no events');
    this.#layout = found;
    this.#config = textRangeConfig(found, this.#options.allowUnsorted ?? false);
    this.#state.lines = found.bodyLine;
    const body = this.#pending.subarray(found.bodyByte);
    this.#pending = NO_BYTES;
    return body;
  }

  /** Decodes the complete lines of carry + data; keeps the rest as the carry, or at the end decodes it too. */
  #decode(data: Uint8Array, final: boolean): EventBatch {
    const batches: EventBatch[] = [];
    let from = 0;
    if (this.#carry.length > 0) {
      const newline = data.indexOf(10);
      if (newline < 0 && !final) {
        this.#carry = join(this.#carry, data);
        return emptyBatch();
      }
      const headEnd = newline < 0 ? data.length : newline + 1;
      let line = join(this.#carry, data.subarray(0, headEnd));
      if (newline < 0) line = join(line, NEWLINE);
      this.#carry = NO_BYTES;
      batches.push(this.#run(line, 0, line.length));
      from = headEnd;
    }
    const last = data.lastIndexOf(10);
    const end = last >= from ? last + 1 : from;
    if (end > from) batches.push(this.#run(data, from, end));
    if (end < data.length) {
      if (final) {
        const line = join(data.subarray(end), NEWLINE);
        batches.push(this.#run(line, 0, line.length));
      } else {
        this.#carry = data.slice(end);
      }
    }
    return batches.length === 0 ? emptyBatch() : concatBatches(batches);
  }

  #run(bytes: Uint8Array, from: number, to: number): EventBatch {
    const batch = decodeTextLinesIntoBatch(bytes, from, to, this.#config!, this.#state);
    const fault = this.#state.fault;
    if (fault) throw textFaultError(this.#options.file, this.#layout!, fault, lineTextAt(bytes, fault.lineByte));
    return batch;
  }
}
