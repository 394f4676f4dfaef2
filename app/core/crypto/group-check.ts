/**
 * A check symbol for a group of base-32 symbols, computed in the field GF(32) (polynomial
 * x^5 + x^2 + 1, which is primitive, so x generates all 31 non-zero elements). The check c
 * makes c + Σ x^(k-i) a_i = 0 for a group a_0..a_(k-1). Because every weight is a distinct
 * non-zero field element, changing one symbol, or swapping two different neighbours
 * (check symbol included), always changes the sum: the same reasoning as the prime-modulus
 * checks of ISO/IEC 7064, here over a field of exactly the alphabet's size.
 * Common practice (error-detecting codes over finite fields), no single source.
 */
const REDUCER = 0b100101;

/** Product in GF(32) by shift and add (add is XOR in characteristic 2). */
function multiply(a: number, b: number): number {
  let product = 0;
  for (let x = a, y = b; y !== 0; y >>= 1) {
    if (y & 1) product ^= x;
    x <<= 1;
    if (x & 0b100000) x ^= REDUCER;
  }
  return product;
}

/** Σ x^(n-1-i) s_i over the symbols given (Horner's rule): 0 for a group ending in its check symbol. */
function weightedSum(symbols: readonly number[]): number {
  let sum = 0;
  for (const s of symbols) sum = multiply(sum, 0b10) ^ s;
  return sum;
}

/** The check symbol (0..31) to append to `symbols` (each 0..31). */
export function groupCheckSymbol(symbols: readonly number[]): number {
  if (symbols.length > 30) throw new RangeError(`symbols: at most 30 per group (the weights must differ), got ${symbols.length}`);
  return weightedSum([...symbols, 0]);
}

/** True when the last symbol is the check symbol of the ones before it. */
export function groupCheckHolds(groupWithCheck: readonly number[]): boolean {
  return weightedSum(groupWithCheck) === 0;
}
