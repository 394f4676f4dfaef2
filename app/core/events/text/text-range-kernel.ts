import type { EventBatch } from '../event-batch';
import type { TextFaultKind, TextRangeConfig, TextRangeState } from './text-range-types';

/**
 * Decodes the complete lines of bytes[from, to) (bytes[to - 1] must be '\n') into
 * out[outStart, outEnd), updating `state`. Returns the byte position where it stopped: `to`
 * when every line is done, earlier when `out` is full or a line has a fault (then recorded
 * in state.fault; the events before it are kept).
 *
 * This is the hot path, so it reads bytes directly: no strings, no per-field allocation,
 * every number accumulated digit by digit into exact integer ticks (never parseFloat).
 * Every scan stops at '\n', which is why the line must end in one: no bounds checks.
 * Each line first goes through a fast path that accepts only the plain shape (digits,
 * one separator, '\n' or '\r\n'); anything else (spaces around fields, signs, blank lines,
 * any fault) is parsed again by the careful parser below, which decides. The fast path
 * writes nothing until the line is known good, so the two always agree.
 *
 * The function refers to nothing outside itself, so host code can ship its source text to
 * a worker thread (app/host/events/text-worker.ts); keep it that way.
 */
export function decodeTextLines(bytes: Uint8Array, from: number, to: number, config: TextRangeConfig, state: TextRangeState, out: EventBatch, outStart: number, outEnd: number): number {
  if (to > from && bytes[to - 1] !== 10) throw new RangeError('to must follow a newline');
  const MINUS = 65536;
  const kinds: readonly TextFaultKind[] = ['malformed', 'malformed', 'malformed', 'not-a-number', 'negative-time', 'too-many-decimals', 'time-too-large', 'negative-coordinate', 'coordinate-too-large', 'outside-sensor', 'bad-polarity'];
  const comma = config.comma;
  const separator = comma ? 44 : 32;
  const separator2 = comma ? 44 : 9;
  const roles = config.roles;
  const identity = roles[0] === 0 && roles[1] === 1 && roles[2] === 2 && roles[3] === 3;
  const tAt = roles.indexOf(0);
  const xAt = roles.indexOf(1);
  const yAt = roles.indexOf(2);
  const pAt = roles.indexOf(3);
  const decimals = config.decimals;
  const tickLimit = config.tickLimit;
  const ticksPerUs = config.ticksPerUs;
  const width = config.width;
  const height = config.height;
  const checkOrder = config.checkOrder;
  const pow10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
  const scale = pow10[decimals]!;
  const slot = new Float64Array(7);
  const outT = out.t;
  const outX = out.x;
  const outY = out.y;
  const outP = out.p;

  /**
   * The careful parser: any spacing, signs and decimals, every fault named with its field.
   * Leaves ticks, x, y, p, the OFF code written and the end of the line in slot[0..5] and
   * the faulty field in slot[6]; returns 0 for an event, 1 for a blank line, else the index
   * of the fault in `kinds`. It takes everything as arguments, so that no variable of the
   * hot loop is captured (captured variables live on the heap, not in registers).
   */
  function careful(bytes: Uint8Array, at: number, slot: Float64Array, config: TextRangeConfig): number {
    const comma = config.comma;
    const roles = config.roles;
    const decimals = config.decimals;
    const tickLimit = config.tickLimit;
    const width = config.width;
    const height = config.height;
    const tAt = roles.indexOf(0);
    const xAt = roles.indexOf(1);
    const yAt = roles.indexOf(2);
    const pAt = roles.indexOf(3);
    const pow10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
    const value = [0, 0, 0, 0];
    const fraction = [-1, -1, -1, -1];
    const minus = [false, false, false, false];
    let i = at;
    let c = bytes[i]!;
    while (c === 32 || c === 9 || c === 13) c = bytes[++i]!;
    if (c === 10) {
      slot[5] = i + 1;
      return 1;
    }
    for (let k = 0; k < 4; k++) {
      slot[6] = k;
      if (k > 0 && c === 10) return 2; // too few fields
      if (k > 0 && comma) {
        c = bytes[++i]!; // the ',' checked below
        while (c === 32 || c === 9 || c === 13) c = bytes[++i]!;
      }
      const role = roles[k]!;
      minus[role] = c === 45;
      if (c === 45) c = bytes[++i]!;
      let digits = 0;
      let v = 0;
      while (c >= 48 && c <= 57) {
        v = v * 10 + (c - 48);
        digits++;
        c = bytes[++i]!;
      }
      if (c === 46) {
        c = bytes[++i]!;
        let decimalsHere = 0;
        while (c >= 48 && c <= 57) {
          v = v * 10 + (c - 48);
          decimalsHere++;
          c = bytes[++i]!;
        }
        fraction[role] = decimalsHere;
        digits += decimalsHere;
      }
      value[role] = v;
      if (digits === 0) return 3;
      const numberEnd = i;
      while (c === 32 || c === 9 || c === 13) c = bytes[++i]!;
      if (comma) {
        if (c !== 10 && c !== 44) return 3; // text after the number
        if (k === 3 && c === 44) return 2; // too many fields
      } else if (c !== 10 && i === numberEnd) return 3;
      else if (k === 3 && c !== 10) return 2;
    }
    slot[5] = i + 1;
    slot[6] = tAt;
    if (minus[0]) return 4;
    if (fraction[0]! > decimals) return 5;
    const ticks = value[0]! * pow10[fraction[0]! < 0 ? decimals : decimals - fraction[0]!]!;
    if (ticks > tickLimit) return 6;
    for (let role = 1; role < 3; role++) {
      slot[6] = role === 1 ? xAt : yAt;
      if (fraction[role]! >= 0) return 3;
      if (minus[role]) return 7;
      if (value[role]! > 65535) return 8;
      if (value[role]! >= (role === 1 ? width : height)) return 9;
    }
    slot[6] = pAt;
    const pv = value[3]!;
    if (fraction[3]! >= 0 || pv > 1 || (minus[3] && pv !== 1)) return 10;
    slot[0] = ticks;
    slot[1] = value[1]!;
    slot[2] = value[2]!;
    slot[3] = pv === 1 && !minus[3] ? 1 : 0;
    slot[4] = pv === 1 ? (minus[3] ? 2 : 0) : 1;
    return 0;
  }

  let line = state.lines;
  let firstLine = state.firstLine;
  let firstTicks = state.firstTicks;
  let lastTicks = state.lastTicks;
  let lastLine = state.lastLine;
  let offCode = state.offCode;
  let offLine = state.offLine;
  let maxX = state.maxX;
  let maxY = state.maxY;
  let n = outStart;
  let i = from;
  let lineStart = from;
  let fault: TextFaultKind | null = null;
  let faultField = -1;
  let ticks = 0;
  // Per position: its digits as a number, and q = 0 for a plain unsigned integer, else
  // (decimals after a '.') + 1, plus MINUS after a '-'.
  let v0 = 0;
  let v1 = 0;
  let v2 = 0;
  let v3 = 0;
  let q0 = 0;
  let q1 = 0;
  let q2 = 0;
  let q3 = 0;
  let v = 0;
  let start = 0;

  while (i < to && n < outEnd) {
    lineStart = i;
    line++;
    let x = 0;
    let y = 0;
    let p = 0;
    let offWritten = 0; // 1: this event is OFF written as 0, 2: as -1
    let c = bytes[i]!;
    // The positions are written out, not looped, so each has its own branches and the
    // predictor learns that t has, say, 7 digits and p has 1. Two digits a step halves
    // the multiply-add chain that bounds the digit loops.
    line: {
      fast: {
        if (c - 48 >>> 0 > 9 && c !== 45 && c !== 46) break fast;
        // Position 0.
        q0 = 0;
        if (c === 45) {
          q0 = MINUS;
          c = bytes[++i]!;
        }
        start = i;
        v = 0;
        for (;;) {
          const d0 = c - 48;
          if (d0 >>> 0 > 9) break;
          const d1 = bytes[i + 1]! - 48;
          if (d1 >>> 0 > 9) {
            v = v * 10 + d0;
            c = bytes[++i]!;
            break;
          }
          v = v * 100 + (d0 * 10 + d1);
          i += 2;
          c = bytes[i]!;
        }
        if (c === 46) {
          // Decimals only here: t is almost always first; elsewhere a '.' goes the careful way.
          c = bytes[++i]!;
          const fractionStart = i;
          for (;;) {
            const d0 = c - 48;
            if (d0 >>> 0 > 9) break;
            const d1 = bytes[i + 1]! - 48;
            if (d1 >>> 0 > 9) {
              v = v * 10 + d0;
              c = bytes[++i]!;
              break;
            }
            v = v * 100 + (d0 * 10 + d1);
            i += 2;
            c = bytes[i]!;
          }
          if (i === fractionStart && fractionStart === start + 1) break fast;
          q0 += i - fractionStart + 1;
        } else if (i === start) break fast;
        v0 = v;
        if (c !== separator && c !== separator2) break fast;
        c = bytes[++i]!;
        // Position 1.
        q1 = 0;
        if (c === 45) {
          q1 = MINUS;
          c = bytes[++i]!;
        }
        start = i;
        v = 0;
        for (;;) {
          const d0 = c - 48;
          if (d0 >>> 0 > 9) break;
          const d1 = bytes[i + 1]! - 48;
          if (d1 >>> 0 > 9) {
            v = v * 10 + d0;
            c = bytes[++i]!;
            break;
          }
          v = v * 100 + (d0 * 10 + d1);
          i += 2;
          c = bytes[i]!;
        }
        if (i === start) break fast;
        v1 = v;
        if (c !== separator && c !== separator2) break fast;
        c = bytes[++i]!;
        // Position 2.
        q2 = 0;
        if (c === 45) {
          q2 = MINUS;
          c = bytes[++i]!;
        }
        start = i;
        v = 0;
        for (;;) {
          const d0 = c - 48;
          if (d0 >>> 0 > 9) break;
          const d1 = bytes[i + 1]! - 48;
          if (d1 >>> 0 > 9) {
            v = v * 10 + d0;
            c = bytes[++i]!;
            break;
          }
          v = v * 100 + (d0 * 10 + d1);
          i += 2;
          c = bytes[i]!;
        }
        if (i === start) break fast;
        v2 = v;
        if (c !== separator && c !== separator2) break fast;
        c = bytes[++i]!;
        // Position 3.
        q3 = 0;
        if (c === 45) {
          q3 = MINUS;
          c = bytes[++i]!;
        }
        start = i;
        v = 0;
        for (;;) {
          const d0 = c - 48;
          if (d0 >>> 0 > 9) break;
          const d1 = bytes[i + 1]! - 48;
          if (d1 >>> 0 > 9) {
            v = v * 10 + d0;
            c = bytes[++i]!;
            break;
          }
          v = v * 100 + (d0 * 10 + d1);
          i += 2;
          c = bytes[i]!;
        }
        if (i === start) break fast;
        v3 = v;
        if (c === 13) c = bytes[++i]!;
        if (c !== 10) break fast;
        i++;
        let tv = v0;
        let tq = q0;
        let xv = v1;
        let xq = q1;
        let yv = v2;
        let yq = q2;
        let pv = v3;
        let pq = q3;
        if (!identity) {
          tv = tAt === 0 ? v0 : tAt === 1 ? v1 : tAt === 2 ? v2 : v3;
          tq = tAt === 0 ? q0 : tAt === 1 ? q1 : tAt === 2 ? q2 : q3;
          xv = xAt === 0 ? v0 : xAt === 1 ? v1 : xAt === 2 ? v2 : v3;
          xq = xAt === 0 ? q0 : xAt === 1 ? q1 : xAt === 2 ? q2 : q3;
          yv = yAt === 0 ? v0 : yAt === 1 ? v1 : yAt === 2 ? v2 : v3;
          yq = yAt === 0 ? q0 : yAt === 1 ? q1 : yAt === 2 ? q2 : q3;
          pv = pAt === 0 ? v0 : pAt === 1 ? v1 : pAt === 2 ? v2 : v3;
          pq = pAt === 0 ? q0 : pAt === 1 ? q1 : pAt === 2 ? q2 : q3;
        }
        if ((xq | yq) !== 0 || tq > decimals + 1 || (pq & (MINUS - 1)) !== 0 || xv >= width || yv >= height) break fast;
        ticks = tq === 0 ? tv * scale : tv * pow10[decimals + 1 - tq]!;
        if (ticks > tickLimit) break fast;
        if (pv === 1) {
          if (pq !== 0) offWritten = 2;
          else p = 1;
        } else if (pv === 0 && pq === 0) offWritten = 1;
        else break fast;
        x = xv;
        y = yv;
        break line;
      }
      const status = careful(bytes, lineStart, slot, config);
      if (status === 1) {
        i = slot[5]!;
        continue; // blank line
      }
      if (status > 1) {
        fault = kinds[status]!;
        faultField = slot[6]!;
        break;
      }
      ticks = slot[0]!;
      x = slot[1]!;
      y = slot[2]!;
      p = slot[3]!;
      offWritten = slot[4]!;
      i = slot[5]!;
    }
    if (offWritten !== offCode && offWritten !== 0) {
      if (offCode !== 0) {
        fault = 'mixed-polarity';
        faultField = pAt;
        break;
      }
      offCode = offWritten;
      offLine = line;
    }
    if (checkOrder && ticks < lastTicks) {
      fault = 'unsorted';
      faultField = tAt;
      break;
    }
    if (firstLine === 0) {
      firstLine = line;
      firstTicks = ticks;
    }
    lastTicks = ticks;
    lastLine = line;
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
    outT[n] = ticksPerUs === 1 ? ticks : ticks / ticksPerUs;
    outX[n] = x;
    outY[n] = y;
    outP[n] = p;
    n++;
  }

  if (fault !== null) {
    const unsorted = fault === 'unsorted';
    state.fault = {
      kind: fault,
      line,
      field: faultField,
      lineByte: lineStart,
      ticks: unsorted ? ticks : 0,
      earlierLine: unsorted ? lastLine : fault === 'mixed-polarity' ? offLine : 0,
      earlierTicks: unsorted ? lastTicks : 0,
      earlierOffCode: fault === 'mixed-polarity' ? offCode : 0,
    };
  }
  state.lines = line;
  state.events += n - outStart;
  state.firstLine = firstLine;
  state.firstTicks = firstTicks;
  state.lastTicks = lastTicks;
  state.lastLine = lastLine;
  state.offCode = offCode;
  state.offLine = offLine;
  state.maxX = maxX;
  state.maxY = maxY;
  return fault !== null ? lineStart : i;
}
