import { describe, expect, it } from 'vitest';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { TextEventDecoder } from '../../../../app/core/events/text/text-event-decoder';
import type { TextTimeUnit } from '../../../../app/core/events/text/text-time-unit';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// Random files in every shape the format allows, written from known events: the decode
// must give the events back exactly. Plain lines take the hot loop's fast path; lines with
// extra spaces, signs or odd decimals take its careful path, so both are checked against
// the events that were written (common practice, no source).

interface Written {
  readonly text: string;
  readonly events: number[][]; // t in µs, x, y, p
  readonly unit: TextTimeUnit;
}

const DECIMALS: Record<TextTimeUnit, number> = { us: 0, ms: 3, ns: 0, s: 9 };

/** ticks (of the unit's resolution) as text in the unit, with `shown` decimals (trailing zeros allowed). */
function timeText(ticks: number, unit: TextTimeUnit, shown: number): string {
  const decimals = DECIMALS[unit];
  if (decimals === 0) return String(ticks);
  const whole = Math.floor(ticks / 10 ** decimals);
  const fraction = String(ticks % 10 ** decimals).padStart(decimals, '0');
  const cut = fraction.slice(0, shown);
  if (fraction.slice(shown).replace(/0/g, '') !== '') return `${whole}.${fraction}`; // cannot shorten
  return shown === 0 ? String(whole) : `${whole}.${cut}`;
}

function writeFile(seed: number, csv: boolean, odd: number): Written {
  const rng = new Xoshiro128(seed);
  const units: TextTimeUnit[] = ['us', 'ms', 'ns', 's'];
  const unit = csv ? units[rng.nextInt(4)]! : 's';
  const roles = csv ? [0, 1, 2, 3].sort(() => rng.nextInt(3) - 1) : [0, 1, 2, 3];
  const names = ['t', 'x', 'y', 'p'];
  const minusOne = rng.nextInt(2) === 0;
  const perUs = unit === 'ns' || unit === 's' ? 1000 : 1;
  const lines: string[] = [];
  if (csv) lines.push(roles.map((r) => (r === 0 ? `t_${unit}` : names[r])).join(','));
  const events: number[][] = [];
  let ticks = rng.nextInt(1000);
  for (let k = 0; k < 400; k++) {
    ticks += rng.nextInt(3) === 0 ? 0 : rng.nextInt(5000);
    const x = rng.nextInt(rng.nextInt(2) ? 700 : 65536);
    const y = rng.nextInt(500);
    const p = rng.nextInt(2);
    events.push([ticks / perUs, x, y, p]);
    const shaped = rng.nextInt(100) < odd;
    const pad = () => (shaped ? [' ', '\t', '  ', ''][rng.nextInt(4)]! : '');
    const zeros = () => (shaped && rng.nextInt(3) === 0 ? '00' : '');
    const fields = roles.map((role) => {
      if (role === 0) return timeText(ticks, unit, shaped ? rng.nextInt(DECIMALS[unit] + 1) : DECIMALS[unit]);
      if (role === 3) return p === 1 ? '1' : minusOne ? '-1' : '0';
      return zeros() + String(role === 1 ? x : y);
    });
    const separator = csv ? ',' : shaped ? ['\t', '  ', ' \t '][rng.nextInt(3)]! : ' ';
    lines.push(pad() + fields.map((f) => (csv ? pad() + f + pad() : f)).join(separator) + pad() + (rng.nextInt(5) === 0 ? '\r' : ''));
    if (shaped && rng.nextInt(4) === 0) lines.push(['', ' ', '\r', '\t \r'][rng.nextInt(4)]!);
  }
  return { text: lines.join('\n') + (rng.nextInt(2) ? '\n' : ''), events, unit };
}

function decode(text: string, chunk: number): number[][] | EventFormatError {
  const decoder = new TextEventDecoder({ file: 'aisle.csv' });
  const bytes = new TextEncoder().encode(text);
  const events: number[][] = [];
  const take = (b: { t: Float64Array; x: Uint16Array; y: Uint16Array; p: Uint8Array }) => b.t.forEach((t, i) => events.push([t, b.x[i]!, b.y[i]!, b.p[i]!]));
  try {
    for (let at = 0; at < bytes.length; at += chunk) take(decoder.push(bytes.subarray(at, at + chunk)));
    take(decoder.end());
  } catch (error) {
    if (error instanceof EventFormatError) return error;
    throw error;
  }
  return events;
}

describe('the text hot loop on random files', () => {
  it.each([0, 10, 100])('gives back the written CSV events (%d%% of lines in odd shapes)', (odd) => {
    for (let seed = 1; seed <= 12; seed++) {
      const file = writeFile(seed, true, odd);
      expect(decode(file.text, 1 + (seed * 997) % 5000), `seed ${seed}, t in ${file.unit}`).toEqual(file.events);
    }
  });

  it.each([0, 10, 100])('gives back the written headerless events (%d%% of lines in odd shapes)', (odd) => {
    for (let seed = 1; seed <= 12; seed++) {
      const file = writeFile(100 + seed, false, odd);
      expect(decode(file.text, 1 + (seed * 613) % 3000), `seed ${seed}`).toEqual(file.events);
    }
  });

  it('finds a bad line wherever it is, on either path', () => {
    const rng = new Xoshiro128(77);
    for (let round = 0; round < 40; round++) {
      const file = writeFile(200 + round, round % 2 === 0, round % 3 === 0 ? 50 : 0);
      const lines = file.text.split('\n');
      const at = 1 + rng.nextInt(lines.length - 2);
      const bad = [' 1,,2,3', '1 2 3 x', '-1 -1 -1 -1', '1\t2\t3', '1,2,3,1,1,1', '5 5 5 5 5'][rng.nextInt(6)]!;
      lines.splice(at, 0, bad);
      const result = decode(lines.join('\n'), 1 + rng.nextInt(4000));
      expect(result, `round ${round}: '${bad}' at line ${at + 1}`).toBeInstanceOf(EventFormatError);
      expect((result as EventFormatError).location).toBe(`line ${at + 1}`);
    }
  });
});
