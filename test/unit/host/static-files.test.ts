import { describe, expect, it } from 'vitest';
import { resolveInside } from '../../../app/host/browser-mode/static-files';
import { readCookie } from '../../../app/host/browser-mode/auth';

describe('the static-file path guard', () => {
  it.each([
    ['/console/index.html', '/srv/r/console/index.html'],
    ['/', '/srv/r'],
    ['/assets/a.js', '/srv/r/assets/a.js'],
  ])('keeps %s inside the renderer folder', (path, expected) => {
    expect(resolveInside('/srv/r', path)).toBe(expected);
  });

  it.each(['/../secret', '/console/../../secret', '/%2e%2e/secret', '/a%00b', '/%E0%A4%A'])('refuses %s', (path) => {
    expect(resolveInside('/srv/r', path)).toBeNull();
  });
});

describe('cookie reading', () => {
  it('finds the named cookie among others', () => {
    expect(readCookie('a=1; gazeloom_80=tok; b=2', 'gazeloom_80')).toBe('tok');
    expect(readCookie('gazeloom_800=other', 'gazeloom_80')).toBeNull();
    expect(readCookie(undefined, 'x')).toBeNull();
  });
});
