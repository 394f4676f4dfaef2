import { describe, expect, it } from 'vitest';
import { requestPersistentStorage } from '../../../../renderer/db/persistent-storage';

// The StorageManager contract (WHATWG Storage Standard, §4 "API"): persist() resolves true when granted.
describe('asking for persistent storage', () => {
  it('reports granted, refused or unsupported', async () => {
    let asked = 0;
    const ask = (answer: boolean, already = false) => ({ persisted: async () => already, persist: async () => (asked++, answer) });
    expect(await requestPersistentStorage(ask(true))).toBe('granted');
    expect(await requestPersistentStorage(ask(false))).toBe('refused');
    expect(asked).toBe(2);
    expect(await requestPersistentStorage(ask(false, true))).toBe('granted'); // already persistent: not asked again
    expect(asked).toBe(2);
    expect(await requestPersistentStorage({ persisted: async () => false, persist: () => Promise.reject(new Error('not allowed')) })).toBe('refused');
    expect(await requestPersistentStorage(undefined)).toBe('unsupported');
  });
});
