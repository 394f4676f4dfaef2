import { describe, expect, it } from 'vitest';
import { groupCheckHolds, groupCheckSymbol } from '../../../../app/core/crypto/group-check';

/** Every group of `length` symbols from 0..31 (32^length of them). */
function* allGroups(length: number): Generator<number[]> {
  const total = 32 ** length;
  for (let n = 0; n < total; n++) yield Array.from({ length }, (_, i) => Math.floor(n / 32 ** (length - 1 - i)) % 32);
}

describe('groupCheckSymbol', () => {
  it('catches every single substitution and every adjacent transposition in every group of 3 symbols (exhaustive)', () => {
    let substitutions = 0;
    let transpositions = 0;
    for (const data of allGroups(3)) {
      const group = [...data, groupCheckSymbol(data)];
      expect(groupCheckHolds(group)).toBe(true);
      for (let i = 0; i < group.length; i++) {
        for (let v = 0; v < 32; v++) {
          if (v === group[i]) continue;
          const changed = group.slice();
          changed[i] = v;
          if (groupCheckHolds(changed)) throw new Error(`substitution missed: ${group} at ${i} -> ${v}`);
          substitutions++;
        }
        if (i + 1 < group.length && group[i] !== group[i + 1]) {
          const swapped = group.slice();
          [swapped[i], swapped[i + 1]] = [swapped[i + 1]!, swapped[i]!];
          if (groupCheckHolds(swapped)) throw new Error(`transposition missed: ${group} at ${i}`);
          transpositions++;
        }
      }
    }
    expect(substitutions).toBe(32 ** 3 * 4 * 31);
    expect(transpositions).toBeGreaterThan(32 ** 3 * 2);
  });

  it('gives a check symbol in 0..31 that differs between groups differing in one place (groups of 4, sampled)', () => {
    for (let a = 0; a < 32; a++) {
      for (let b = 0; b < 32; b++) {
        const check = groupCheckSymbol([a, b, 7, 30]);
        expect(check).toBeGreaterThanOrEqual(0);
        expect(check).toBeLessThan(32);
        if (b > 0) expect(groupCheckSymbol([a, b - 1, 7, 30])).not.toBe(check);
      }
    }
  });

  it('refuses groups too long for distinct weights', () => {
    expect(() => groupCheckSymbol(new Array(31).fill(1))).toThrow(RangeError);
    expect(() => groupCheckSymbol(new Array(30).fill(1))).not.toThrow();
  });
});
