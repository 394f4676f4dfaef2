import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { createContractClient, type ContractTransport } from '../../../app/contract/client';
import { channel, hostEvent } from '../../../app/contract/define';

const contract = {
  channels: { square: channel({ request: z.object({ n: z.number() }), response: z.object({ n2: z.number() }), summary: 'test' }) },
  events: { onTick: hostEvent({ payload: z.object({ at: z.number() }), audience: 'console', summary: 'test' }) },
};

function fakeTransport(reply: unknown) {
  const listeners = new Map<string, (payload: unknown) => void>();
  const transport: ContractTransport = {
    request: vi.fn(async () => reply),
    subscribe: (name, listener) => {
      listeners.set(name, listener);
      return () => listeners.delete(name);
    },
  };
  return { transport, fire: (name: string, payload: unknown) => listeners.get(name)?.(payload) };
}

describe('the renderer-side contract client', () => {
  it('validates the request before sending it', async () => {
    const { transport } = fakeTransport({ ok: true, value: { n2: 4 } });
    const api = createContractClient(contract, transport);
    const result = await api.square({ n: 'two' as unknown as number });
    expect(result).toMatchObject({ ok: false, code: 'invalid_request', path: 'request.n' });
    expect(transport.request).not.toHaveBeenCalled();
  });

  it('validates the response when it arrives', async () => {
    const good = createContractClient(contract, fakeTransport({ ok: true, value: { n2: 4 } }).transport);
    expect(await good.square({ n: 2 })).toEqual({ ok: true, value: { n2: 4 } });
    const bad = createContractClient(contract, fakeTransport({ ok: true, value: { n2: 'four' } }).transport);
    expect(await bad.square({ n: 2 })).toMatchObject({ ok: false, code: 'invalid_response', path: 'response.n2' });
  });

  it('delivers valid events and drops invalid ones with a report', () => {
    const { transport, fire } = fakeTransport(null);
    const onInvalidEvent = vi.fn();
    const api = createContractClient(contract, transport, { onInvalidEvent });
    const seen: number[] = [];
    const stop = api.onTick(({ at }) => seen.push(at));
    fire('onTick', { at: 1 });
    fire('onTick', { at: 'later' });
    stop();
    fire('onTick', { at: 3 });
    expect(seen).toEqual([1]);
    expect(onInvalidEvent).toHaveBeenCalledWith('onTick', expect.stringContaining('event.at'));
  });

  it('reports a transport that throws as transport_closed', async () => {
    const transport: ContractTransport = { request: async () => Promise.reject(new Error('socket gone')), subscribe: () => () => undefined };
    const api = createContractClient(contract, transport);
    expect(await api.square({ n: 1 })).toMatchObject({ ok: false, code: 'transport_closed' });
  });
});
