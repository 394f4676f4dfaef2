import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { commandForKey, keyMapMarkdown, sessionKeyMap } from '../../../../renderer/console/session/key-map';

describe('the session key map', () => {
  it('gives every command its own keys', () => {
    const keys = sessionKeyMap.flatMap((b) => b.keys);
    expect(new Set(keys).size).toBe(keys.length);
    expect(new Set(sessionKeyMap.map((b) => b.command)).size).toBe(sessionKeyMap.length);
  });

  it('reads letters in either case and leaves text fields alone except for Escape', () => {
    expect(commandForKey('B', false)).toBe('markBad');
    expect(commandForKey('b', false)).toBe('markBad');
    expect(commandForKey(' ', false)).toBe('pause');
    expect(commandForKey('Enter', false)).toBe('continue');
    expect(commandForKey('b', true)).toBeNull();
    expect(commandForKey(' ', true)).toBeNull();
    expect(commandForKey('Escape', true)).toBe('close');
    expect(commandForKey('X', false)).toBe('blank');
    expect(commandForKey('z', false)).toBeNull();
  });

  it('is the table the README prints', () => {
    // The README's key table is made from this list (keyMapMarkdown); the two must agree.
    const readme = readFileSync(new URL('../../../../README.md', import.meta.url), 'utf8');
    expect(readme).toContain(keyMapMarkdown());
  });
});
