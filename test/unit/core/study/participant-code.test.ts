import { describe, expect, it } from 'vitest';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { CODE_ALPHABET, checkParticipantCode, generateParticipantCode, normalizeParticipantCode } from '../../../../app/core/study/participant-code';

/**
 * The check character is a weighted sum modulo a prime larger than the alphabet, the idea of
 * ISO/IEC 7064:2003 ("Check character systems"): with non-zero weights that differ between
 * neighbours, every single substitution and every adjacent transposition changes the sum.
 * These tests try every such error, on many codes and on every position and symbol pair.
 */
const valid = (code: string): boolean => checkParticipantCode(code).ok;
const codes = (count: number, seed: number): string[] => {
  const g = new Xoshiro128(seed);
  return Array.from({ length: count }, () => generateParticipantCode(() => g.next()));
};
const withCharAt = (code: string, i: number, ch: string): string => code.slice(0, i) + ch + code.slice(i + 1);
const swapped = (code: string, i: number): string => code.slice(0, i) + code[i + 1] + code[i] + code.slice(i + 2);

/** The one valid code with this six-symbol payload, or null (check value 30 has no symbol). */
function complete(payload: string): string | null {
  const matches = [...CODE_ALPHABET].map((c) => payload + c).filter(valid);
  if (matches.length > 1) throw new Error(`payload ${payload} has ${matches.length} valid check characters`);
  return matches[0] ?? null;
}

/** A valid code with `a` at position i and `b` at i + 1 (the rest drawn at random). */
function codeWithPair(i: number, a: string, b: string, g: Xoshiro128): string {
  for (;;) {
    const payload = [...Array(6)].map(() => CODE_ALPHABET[g.nextInt(CODE_ALPHABET.length)]);
    payload[i] = a;
    if (i + 1 < 6) payload[i + 1] = b;
    const code = complete(payload.join(''));
    if (code && code[i] === a && code[i + 1] === b) return code;
  }
}

describe('participant code alphabet', () => {
  it('has 30 distinct symbols and none of the look-alikes 0 O 1 I L U', () => {
    expect(new Set(CODE_ALPHABET).size).toBe(30);
    for (const ch of '0O1ILU') expect(CODE_ALPHABET).not.toContain(ch);
  });
});

describe('participant code check character (ISO/IEC 7064:2003 weighted sum modulo a prime)', () => {
  it('matches a hand-worked example: K7M4XR + check', () => {
    // Values K=17 7=5 M=18 4=2 X=27 R=22; 7·17 + 6·5 + 5·18 + 4·2 + 3·27 + 2·22 = 372 = 12·31,
    // so the check value is 0, the symbol "2" (worked by hand, common practice, no source).
    expect(complete('K7M4XR')).toBe('K7M4XR2');
    expect(checkParticipantCode('K7M4XR2')).toEqual({ ok: true });
  });

  it('catches every single substitution and adjacent transposition of 2000 generated codes', () => {
    const seen = new Set<string>();
    const missed: string[] = [];
    let substitutions = 0;
    let transpositions = 0;
    for (const code of codes(2000, 11)) {
      if (!valid(code)) missed.push(`${code} generated but not valid`);
      for (let i = 0; i < code.length; i++) {
        seen.add(`${i}:${code[i]}`);
        for (const ch of CODE_ALPHABET) {
          if (ch === code[i]) continue;
          if (valid(withCharAt(code, i, ch))) missed.push(`${code} with ${ch} at ${i}`);
          substitutions++;
        }
      }
      for (let i = 0; i + 1 < code.length; i++) {
        if (code[i] === code[i + 1]) continue;
        if (valid(swapped(code, i))) missed.push(`${code} swapped at ${i}`);
        transpositions++;
      }
    }
    expect(missed).toEqual([]);
    // Every symbol occurred at every position, check position included, so no case was missed.
    expect(seen.size).toBe(7 * 30);
    expect(substitutions).toBe(2000 * 7 * 29);
    expect(transpositions).toBeGreaterThan(2000 * 6 * 0.9);
  });

  it('catches the substitution of every symbol by every other at every position', () => {
    const g = new Xoshiro128(5);
    const missed: string[] = [];
    let cases = 0;
    for (let i = 0; i < 7; i++) {
      for (const a of CODE_ALPHABET) {
        const code = i < 6 ? codeWithPair(i, a, CODE_ALPHABET[g.nextInt(30)], g) : codeWithPair(5, CODE_ALPHABET[g.nextInt(30)], a, g);
        expect(code[i]).toBe(a);
        for (const b of CODE_ALPHABET) {
          if (b === a) continue;
          if (valid(withCharAt(code, i, b))) missed.push(`${code} with ${b} at ${i}`);
          cases++;
        }
      }
    }
    expect(missed).toEqual([]);
    expect(cases).toBe(7 * 30 * 29);
  });

  it('catches the transposition of every ordered pair of distinct symbols at every adjacent position', () => {
    const g = new Xoshiro128(6);
    const missed: string[] = [];
    let pairs = 0;
    for (let i = 0; i < 6; i++) {
      for (const a of CODE_ALPHABET) {
        for (const b of CODE_ALPHABET) {
          if (a === b) continue;
          const code = codeWithPair(i, a, b, g);
          if (valid(swapped(code, i))) missed.push(`${code} swapped at ${i}`);
          pairs++;
        }
      }
    }
    expect(missed).toEqual([]);
    expect(pairs).toBe(6 * 30 * 29);
  });
});

describe('generateParticipantCode', () => {
  it('draws seven alphabet symbols, reproducibly from a seeded source', () => {
    const a = codes(50, 3);
    expect(codes(50, 3)).toEqual(a);
    for (const code of a) expect(code).toMatch(new RegExp(`^[${CODE_ALPHABET}]{7}$`));
    expect(new Set(a).size).toBe(50);
  });

  it('draws again when the payload has no check symbol or the code is taken', () => {
    // Worked by hand: payload 222222 (values 0) has weighted sum 0, check value 0 → "2222222";
    // payload 333333 (values 1) has sum 7+6+5+4+3+2 = 27, check value 4 → "3333336".
    const scripted = (values: number[]) => {
      let k = 0;
      return () => (values[k++ % values.length] + 0.5) / 30;
    };
    expect(generateParticipantCode(scripted([0, 0, 0, 0, 0, 0]))).toBe('2222222');
    expect(generateParticipantCode(scripted([0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1]), new Set(['2222222']))).toBe('3333336');
    // Payload 22222J (J = 16) has sum 2·16 = 32 ≡ 1, so its check value would be 30: redrawn.
    expect(generateParticipantCode(scripted([0, 0, 0, 0, 0, 16, 0, 0, 0, 0, 0, 0]))).toBe('2222222');
  });

  it('refuses a random source outside [0, 1) and one that never yields a free code', () => {
    expect(() => generateParticipantCode(() => 1)).toThrow(RangeError);
    expect(() => generateParticipantCode(() => Number.NaN)).toThrow(RangeError);
    expect(() => generateParticipantCode(() => 0, new Set(['2222222']))).toThrow(/no free participant code/);
  });
});

describe('checkParticipantCode and normalizeParticipantCode', () => {
  it('ignores case, spaces and dashes', () => {
    expect(normalizeParticipantCode(' k7m-4xr 2 ')).toBe('K7M4XR2');
    expect(checkParticipantCode('k7m-4xr2')).toEqual({ ok: true });
  });

  it('says what is wrong', () => {
    expect(checkParticipantCode('K7M4XR')).toEqual({ ok: false, reason: expect.stringMatching(/7 characters, "K7M4XR" has 6/) });
    expect(checkParticipantCode('K7M4XO2')).toEqual({ ok: false, reason: expect.stringMatching(/character 6 "O" is not used/) });
    expect(checkParticipantCode('K7M4XR3')).toEqual({ ok: false, reason: expect.stringMatching(/fails its check character/) });
  });
});
