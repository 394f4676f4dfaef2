import { groupCheckHolds, groupCheckSymbol } from './group-check';

/**
 * The recovery key as the lab writes it on paper: 32 secret bytes in Crockford's base 32
 * (Douglas Crockford, "Base 32", 2002: no I, L, O or U, and when read back O counts as 0 and
 * I or L as 1), in 13 groups of 4 symbols each followed by a check symbol (group-check.ts),
 * e.g. "7K2QM-…". A mistyped symbol or two swapped neighbours is reported with its group.
 */
export const RECOVERY_SECRET_BYTES = 32;
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
const DATA_PER_GROUP = 4;
const GROUP_LENGTH = DATA_PER_GROUP + 1;
const DATA_SYMBOLS = Math.ceil((RECOVERY_SECRET_BYTES * 8) / 5);
const GROUPS = DATA_SYMBOLS / DATA_PER_GROUP;
const READ_ALIASES: Record<string, string> = { O: '0', I: '1', L: '1' };

export type RecoveryKeyReading = { ok: true; secret: Uint8Array<ArrayBuffer> } | { ok: false; message: string };

export function formatRecoveryKey(secret: Uint8Array): string {
  if (secret.length !== RECOVERY_SECRET_BYTES) throw new RangeError(`secret: expected ${RECOVERY_SECRET_BYTES} bytes, got ${secret.length}`);
  const symbols = toSymbols(secret);
  const groups: string[] = [];
  for (let g = 0; g < GROUPS; g++) {
    const data = symbols.slice(g * DATA_PER_GROUP, (g + 1) * DATA_PER_GROUP);
    groups.push([...data, groupCheckSymbol(data)].map((s) => ALPHABET[s]).join(''));
  }
  return groups.join('-');
}

/** Reads a typed recovery key: case, spaces and hyphens do not matter. */
export function readRecoveryKey(text: string): RecoveryKeyReading {
  const compact = text.toUpperCase().replace(/[\s-]+/g, '');
  const symbols: number[] = [];
  for (const char of compact) {
    const value = ALPHABET.indexOf(READ_ALIASES[char] ?? char);
    if (value < 0) return { ok: false, message: `"${char}" is not used in recovery keys (they use 0-9 and A-Z without I, L, O and U)` };
    symbols.push(value);
  }
  if (symbols.length !== GROUPS * GROUP_LENGTH) {
    return { ok: false, message: `a recovery key has ${GROUPS} groups of ${GROUP_LENGTH} characters (${GROUPS * GROUP_LENGTH} in all), this has ${symbols.length}` };
  }
  const bad: number[] = [];
  const data: number[] = [];
  for (let g = 0; g < GROUPS; g++) {
    const group = symbols.slice(g * GROUP_LENGTH, (g + 1) * GROUP_LENGTH);
    if (!groupCheckHolds(group)) bad.push(g + 1);
    data.push(...group.slice(0, DATA_PER_GROUP));
  }
  if (bad.length > 0) return { ok: false, message: `typing error in group ${bad.join(', ')} of the recovery key (counting from 1)` };
  const secret = fromSymbols(data);
  if (secret === null) return { ok: false, message: `typing error in group ${GROUPS} of the recovery key (its last character cannot occur there)` };
  return { ok: true, secret };
}

/** 5 bits per symbol, most significant first; the last symbol is padded with zero bits. */
function toSymbols(bytes: Uint8Array): number[] {
  const symbols: number[] = [];
  let buffer = 0;
  let bits = 0;
  for (const byte of bytes) {
    buffer = ((buffer << 8) | byte) & 0xfff;
    bits += 8;
    for (; bits >= 5; bits -= 5) symbols.push((buffer >> (bits - 5)) & 31);
  }
  if (bits > 0) symbols.push((buffer << (5 - bits)) & 31);
  return symbols;
}

/** The inverse of toSymbols, or null when the padding bits are not zero. */
function fromSymbols(symbols: readonly number[]): Uint8Array<ArrayBuffer> | null {
  const bytes = new Uint8Array(RECOVERY_SECRET_BYTES);
  let buffer = 0;
  let bits = 0;
  let n = 0;
  for (const s of symbols) {
    buffer = ((buffer << 5) | s) & 0xfff;
    bits += 5;
    if (bits >= 8) {
      bits -= 8;
      bytes[n++] = (buffer >> bits) & 255;
    }
  }
  return (buffer & ((1 << bits) - 1)) === 0 ? bytes : null;
}
