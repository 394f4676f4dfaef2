import { describe, expect, it } from 'vitest';
import { formatRecoveryKey, readRecoveryKey, RECOVERY_SECRET_BYTES } from '../../../../app/core/crypto/recovery-key-text';
import { randomBytes } from './test-keys';

const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';

function secretOf(text: string): Uint8Array {
  const reading = readRecoveryKey(text);
  if (!reading.ok) throw new Error(reading.message);
  return reading.secret;
}

describe('formatRecoveryKey and readRecoveryKey', () => {
  it('write 13 hyphenated groups of 5 characters from the alphabet and read the secret back', () => {
    for (let n = 0; n < 50; n++) {
      const secret = randomBytes(RECOVERY_SECRET_BYTES);
      const text = formatRecoveryKey(secret);
      expect(text).toMatch(/^[0-9A-HJKMNP-TV-Z]{5}(-[0-9A-HJKMNP-TV-Z]{5}){12}$/);
      expect(secretOf(text)).toEqual(secret);
    }
    for (const fill of [0, 255]) expect(secretOf(formatRecoveryKey(new Uint8Array(32).fill(fill)))).toEqual(new Uint8Array(32).fill(fill));
  });

  it('carry the bits in Crockford base 32, most significant first', () => {
    // 0xF8 = 11111 000..., so the first symbol is 31 ("Z"); a secret of zeros is all "0" with check 0.
    const secret = new Uint8Array(32);
    secret[0] = 0xf8;
    expect(formatRecoveryKey(secret).slice(0, 4)).toBe('Z000');
    expect(formatRecoveryKey(new Uint8Array(32))).toBe(Array(13).fill('00000').join('-'));
  });

  it('ignore case, spaces, line breaks and hyphens, and read O as 0 and I or L as 1', () => {
    const secret = randomBytes(32);
    const text = formatRecoveryKey(secret);
    expect(secretOf(text.toLowerCase().replace(/-/g, ' '))).toEqual(secret);
    expect(secretOf(text.replace(/-/g, '').replace(/(.{25})/g, '$1\n'))).toEqual(secret);
    const lookAlike = text.replace(/0/g, 'O').replace(/1/g, () => (Math.random() < 0.5 ? 'I' : 'l'));
    expect(secretOf(lookAlike)).toEqual(secret);
  });

  it('report every single mistyped character with its group (exhaustive over 20 keys)', () => {
    for (let n = 0; n < 20; n++) {
      const chars = formatRecoveryKey(randomBytes(32)).replace(/-/g, '').split('');
      chars.forEach((original, i) => {
        for (const typo of ALPHABET) {
          if (typo === original) continue;
          const changed = chars.slice();
          changed[i] = typo;
          const reading = readRecoveryKey(changed.join(''));
          expect(reading.ok).toBe(false);
          if (!reading.ok) expect(reading.message).toContain(`group ${Math.floor(i / 5) + 1} `);
        }
      });
    }
  });

  it('report every swap of two different neighbouring characters, across groups too (exhaustive over 50 keys)', () => {
    for (let n = 0; n < 50; n++) {
      const chars = formatRecoveryKey(randomBytes(32)).replace(/-/g, '').split('');
      for (let i = 0; i + 1 < chars.length; i++) {
        if (chars[i] === chars[i + 1]) continue;
        const swapped = chars.slice();
        [swapped[i], swapped[i + 1]] = [swapped[i + 1]!, swapped[i]!];
        expect(readRecoveryKey(swapped.join('')).ok, `swap at ${i}`).toBe(false);
      }
    }
  });

  it('say what is wrong with a character outside the alphabet or a wrong length', () => {
    const text = formatRecoveryKey(randomBytes(32));
    expect(readRecoveryKey(`U${text.slice(1)}`)).toEqual({ ok: false, message: expect.stringContaining('"U" is not used') });
    expect(readRecoveryKey(text.slice(0, -1))).toEqual({ ok: false, message: expect.stringContaining('this has 64') });
    expect(readRecoveryKey('')).toEqual({ ok: false, message: expect.stringContaining('13 groups of 5') });
  });

  it('refuses a secret of the wrong size', () => {
    expect(() => formatRecoveryKey(new Uint8Array(31))).toThrow(RangeError);
  });
});
