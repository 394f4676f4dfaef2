// The plain data that crosses between the text decoder's hot loop, its callers and worker
// threads (structured-clonable: numbers, strings and arrays only).

/** What went wrong on a line; text-fault-error.ts turns it into a message for a person. */
export type TextFaultKind =
  | 'malformed' // wrong number of fields
  | 'not-a-number'
  | 'negative-time'
  | 'too-many-decimals'
  | 'time-too-large'
  | 'negative-coordinate'
  | 'coordinate-too-large'
  | 'outside-sensor'
  | 'bad-polarity'
  | 'mixed-polarity'
  | 'unsorted';

export interface TextFault {
  readonly kind: TextFaultKind;
  /** Physical line, counted like TextRangeState.lines. */
  readonly line: number;
  /** 0-based position on the line of the offending field (for a wrong field count, where the count went wrong). */
  readonly field: number;
  /** Byte offset where the line starts in the decoded bytes. */
  readonly lineByte: number;
  /** unsorted: this event's ticks. */
  readonly ticks: number;
  /** unsorted: the line and ticks of the later-stamped event before it; mixed-polarity: the line that fixed the OFF code. */
  readonly earlierLine: number;
  readonly earlierTicks: number;
  /** mixed-polarity: how that earlier line wrote OFF (1: as 0, 2: as -1). */
  readonly earlierOffCode: number;
}

export interface TextRangeConfig {
  /** ',' between fields (CSV) or runs of spaces and tabs. */
  readonly comma: boolean;
  /** The role of each of the four fields: 0 t, 1 x, 2 y, 3 p. */
  readonly roles: readonly number[];
  /** Decimals allowed in t; ticks = t * 10^decimals. */
  readonly decimals: number;
  readonly tickLimit: number;
  /** Output t (µs) = ticks / ticksPerUs. */
  readonly ticksPerUs: number;
  /** Sensor size; 65536 when unknown (the coordinate columns hold 16 bits). */
  readonly width: number;
  readonly height: number;
  readonly checkOrder: boolean;
}

/** Running facts of a decode, carried from one call to the next (and across a worker boundary). */
export interface TextRangeState {
  lines: number;
  events: number;
  firstTicks: number;
  firstLine: number;
  lastTicks: number;
  lastLine: number;
  /** 0 none seen yet, 1 OFF written as 0, 2 OFF written as -1. */
  offCode: number;
  offLine: number;
  maxX: number;
  maxY: number;
  fault: TextFault | null;
}

export const newTextRangeState = (lines = 0): TextRangeState => ({
  lines,
  events: 0,
  firstTicks: -1,
  firstLine: 0,
  lastTicks: -1,
  lastLine: 0,
  offCode: 0,
  offLine: 0,
  maxX: -1,
  maxY: -1,
  fault: null,
});

