/**
 * Pseudonymous participant codes: six symbols and a check character, e.g. "K7M4XR2".
 *
 * The alphabet leaves out the look-alikes 0 O 1 I L U, so a code read off paper or a screen
 * is not misread. The check character follows the weighted-sum, modulo-a-prime idea
 * of ISO/IEC 7064:2003: with symbol values v0..v6 and weights 7, 6, ..., 1, a valid code has
 *   7·v0 + 6·v1 + 5·v2 + 4·v3 + 3·v4 + 2·v5 + 1·v6 ≡ 0 (mod 31).
 * 31 is a prime larger than the alphabet, every weight is non-zero modulo 31 and adjacent
 * weights differ by 1, so a single substitution changes the sum by w·(b − a) and an adjacent
 * transposition by (b − a); neither is a multiple of 31, so both are always detected.
 * A payload whose check value would be 30 (no symbol for it) is drawn again.
 */
export const CODE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTVWXYZ';

const MODULUS = 31;
const PAYLOAD_LENGTH = 6;
const CODE_LENGTH = PAYLOAD_LENGTH + 1;
const MAX_DRAWS = 10_000;

const weightAt = (position: number): number => CODE_LENGTH - position;

/** The value the check character must have for this payload (0..30; 30 has no symbol). */
function checkValue(payload: readonly number[]): number {
  let sum = 0;
  payload.forEach((v, i) => (sum += weightAt(i) * v));
  return (MODULUS - (sum % MODULUS)) % MODULUS;
}

/** Upper case, without spaces and dashes: the form codes are stored and compared in. */
export function normalizeParticipantCode(code: string): string {
  return code.replace(/[\s-]+/g, '').toUpperCase();
}

/**
 * A new code drawn with `random` (uniform in [0, 1)), never one of `taken` (normalized codes).
 * Pass a cryptographic source in the console; a seeded one makes demo studies reproducible.
 */
export function generateParticipantCode(random: () => number, taken: ReadonlySet<string> = new Set()): string {
  for (let draw = 0; draw < MAX_DRAWS; draw++) {
    const payload = Array.from({ length: PAYLOAD_LENGTH }, () => {
      const u = random();
      if (!(u >= 0 && u < 1)) throw new RangeError(`random must return a number in [0, 1), got ${u}`);
      return Math.floor(u * CODE_ALPHABET.length);
    });
    const check = checkValue(payload);
    if (check >= CODE_ALPHABET.length) continue;
    const code = [...payload, check].map((v) => CODE_ALPHABET[v]).join('');
    if (!taken.has(code)) return code;
  }
  throw new Error(`no free participant code after ${MAX_DRAWS} draws: the random source repeats itself`);
}

/** Whether a typed code is well formed and its check character matches (case, spaces and dashes ignored). */
export function checkParticipantCode(code: string): { ok: true } | { ok: false; reason: string } {
  const normalized = normalizeParticipantCode(code);
  if (normalized.length !== CODE_LENGTH) {
    return { ok: false, reason: `a participant code has ${CODE_LENGTH} characters, "${code}" has ${normalized.length}` };
  }
  const values: number[] = [];
  for (let i = 0; i < normalized.length; i++) {
    const ch = normalized[i];
    const v = CODE_ALPHABET.indexOf(ch);
    if (v < 0) {
      return { ok: false, reason: `character ${i + 1} "${ch}" is not used in participant codes (they use ${CODE_ALPHABET})` };
    }
    values.push(v);
  }
  if (checkValue(values.slice(0, PAYLOAD_LENGTH)) !== values[PAYLOAD_LENGTH]) {
    return { ok: false, reason: `"${code}" fails its check character: a character is mistyped or two are swapped` };
  }
  return { ok: true };
}
