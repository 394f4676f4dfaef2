import type { TextFault, TextRangeConfig, TextRangeState } from './text-range-types';

export interface MergedTextRanges {
  /** The first fault in file order, its line counted from the start of the file. */
  readonly fault: TextFault | null;
  /** The range whose own lines hold the fault (null for a fault at a range boundary, which needs no line text). */
  readonly faultRange: number | null;
  readonly lines: number;
  readonly events: number;
  readonly maxX: number;
  readonly maxY: number;
}

/**
 * Joins the states of consecutive byte ranges decoded on their own, each counting lines
 * from 0: it numbers their lines from `startLine` and applies the checks that span ranges
 * (time order, one OFF code). A range that ends in a fault ends the merge there, since
 * its line count is short and nothing after its fault matters.
 */
export function mergeTextRanges(states: readonly TextRangeState[], startLine: number, config: TextRangeConfig): MergedTextRanges {
  let offset = startLine;
  let events = 0;
  let maxX = -1;
  let maxY = -1;
  let last: { ticks: number; line: number } | null = null;
  let off: { code: number; line: number } | null = null;
  const tAt = config.roles.indexOf(0);
  const pAt = config.roles.indexOf(3);
  for (const [index, state] of states.entries()) {
    const candidates: { fault: TextFault; range: number | null }[] = [];
    if (state.offCode !== 0 && off && state.offCode !== off.code) {
      const fault = boundaryFault('mixed-polarity', offset + state.offLine, pAt, { earlierLine: off.line, earlierOffCode: off.code });
      candidates.push({ fault, range: null });
    }
    if (config.checkOrder && state.firstLine > 0 && last && state.firstTicks < last.ticks) {
      const fault = boundaryFault('unsorted', offset + state.firstLine, tAt, { ticks: state.firstTicks, earlierLine: last.line, earlierTicks: last.ticks });
      candidates.push({ fault, range: null });
    }
    if (state.fault) {
      const f = state.fault;
      // A range's own OFF clash names its first OFF line; the file's first may come earlier.
      const earlierLine = f.kind === 'mixed-polarity' && off ? off.line : f.earlierLine > 0 ? offset + f.earlierLine : 0;
      candidates.push({ fault: { ...f, line: offset + f.line, earlierLine }, range: index });
    }
    if (candidates.length > 0) {
      // Stable: at one line the polarity check comes before the time check, as in the hot loop.
      const first = candidates.reduce((a, b) => (b.fault.line < a.fault.line ? b : a));
      return { fault: first.fault, faultRange: first.range, lines: offset + state.lines, events: events + state.events, maxX, maxY };
    }
    if (state.firstLine > 0) last = { ticks: state.lastTicks, line: offset + state.lastLine };
    if (!off && state.offCode !== 0) off = { code: state.offCode, line: offset + state.offLine };
    offset += state.lines;
    events += state.events;
    maxX = Math.max(maxX, state.maxX);
    maxY = Math.max(maxY, state.maxY);
  }
  return { fault: null, faultRange: null, lines: offset, events, maxX, maxY };
}

function boundaryFault(kind: TextFault['kind'], line: number, field: number, facts: Partial<TextFault>): TextFault {
  return { kind, line, field, lineByte: -1, ticks: 0, earlierLine: 0, earlierTicks: 0, earlierOffCode: 0, ...facts };
}
