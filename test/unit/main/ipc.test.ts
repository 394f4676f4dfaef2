import { describe, expect, it, vi } from 'vitest';
import { channels } from '../../../app/contract';
import { registerContractIpc } from '../../../app/main/ipc';

function setup() {
  const handlers = new Map<string, (event: unknown, payload: unknown) => Promise<unknown>>();
  const ipcMain = { handle: (name: string, handler: never) => handlers.set(name, handler) };
  const dispatch = vi.fn(async () => ({ ok: true as const, value: {} }));
  const log = { info: vi.fn(), warn: vi.fn(), error: vi.fn() };
  registerContractIpc(ipcMain as never, Object.keys(channels), (id) => (id === 1 ? { id: 'console-1', dispatch, detach: vi.fn() } : undefined), log);
  return { handlers, dispatch, log };
}

describe('IPC registration', () => {
  it('registers exactly the contract channels and nothing else', () => {
    expect([...setup().handlers.keys()].sort()).toEqual(Object.keys(channels).sort());
  });

  it('forwards messages from the app’s own frame in a known window to the dispatcher', async () => {
    const { handlers, dispatch } = setup();
    await handlers.get('ping')!({ sender: { id: 1 }, senderFrame: { url: 'app://gazeloom/console/index.html' } }, { clientSentMs: 1 });
    expect(dispatch).toHaveBeenCalledWith('ping', { clientSentMs: 1 });
  });

  it('refuses and logs messages from a foreign frame', async () => {
    const { handlers, dispatch, log } = setup();
    const result = await handlers.get('ping')!({ sender: { id: 1 }, senderFrame: { url: 'https://example.org/' } }, { clientSentMs: 1 });
    expect(result).toMatchObject({ ok: false, code: 'untrusted_sender' });
    expect(dispatch).not.toHaveBeenCalled();
    expect(log.warn).toHaveBeenCalledWith('security.untrusted_sender', expect.objectContaining({ frameUrl: 'https://example.org/' }));
  });

  it('refuses messages from a window the host did not open', async () => {
    const { handlers, dispatch } = setup();
    const result = await handlers.get('ping')!({ sender: { id: 99 }, senderFrame: { url: 'app://gazeloom/console/index.html' } }, {});
    expect(result).toMatchObject({ ok: false, code: 'untrusted_sender' });
    expect(dispatch).not.toHaveBeenCalled();
  });
});
