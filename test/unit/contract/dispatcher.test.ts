import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { channel } from '../../../app/contract/define';
import { createDispatcher } from '../../../app/contract/dispatcher';
import { fail } from '../../../app/contract/result';

const channels = {
  addTrial: channel({
    request: z.object({ trials: z.array(z.object({ onset: z.number().refine(Number.isFinite) })) }),
    response: z.object({ count: z.number().int() }),
    summary: 'test',
  }),
  explode: channel({ request: z.object({}), response: z.object({}), summary: 'test' }),
  lie: channel({ request: z.object({}), response: z.object({ n: z.number() }), summary: 'test' }),
  refuse: channel({ request: z.object({}), response: z.object({}), summary: 'test' }),
};

function setup() {
  const log = { warn: vi.fn(), error: vi.fn() };
  const dispatch = createDispatcher(
    channels,
    {
      addTrial: ({ trials }) => ({ count: trials.length }),
      explode: () => {
        throw new Error('boom');
      },
      lie: () => ({ n: 'seven' }) as unknown as { n: number },
      refuse: () => fail('bad_input', 'clip.csv line 3: expected 4 fields'),
    },
    log,
  );
  const context = { page: 'console' as const, connectionId: 'console-1' };
  return { dispatch, log, context };
}

describe('the host dispatcher', () => {
  it('calls the handler with a valid request and validates its response', async () => {
    const { dispatch, context } = setup();
    expect(await dispatch('addTrial', { trials: [{ onset: 1 }, { onset: 2 }] }, context)).toEqual({ ok: true, value: { count: 2 } });
  });

  it('answers a malformed payload with a typed error naming the path, and logs it', async () => {
    const { dispatch, log, context } = setup();
    const result = await dispatch('addTrial', { trials: [{ onset: 1 }, { onset: 'soon' }] }, context);
    expect(result).toMatchObject({ ok: false, code: 'invalid_request', path: 'request.trials[1].onset' });
    expect(log.warn).toHaveBeenCalledWith('contract.invalid_request', expect.objectContaining({ channel: 'addTrial' }));
  });

  it('rejects NaN, which JSON would otherwise turn into null', async () => {
    const { dispatch, context } = setup();
    const result = await dispatch('addTrial', { trials: [{ onset: Number.NaN }] }, context);
    expect(result).toMatchObject({ ok: false, code: 'invalid_request' });
  });

  it('refuses unknown channels, including inherited property names', async () => {
    const { dispatch, context } = setup();
    expect(await dispatch('deleteEverything', {}, context)).toMatchObject({ ok: false, code: 'unknown_channel' });
    expect(await dispatch('toString', {}, context)).toMatchObject({ ok: false, code: 'unknown_channel' });
  });

  it('turns a throwing handler into an internal failure instead of crashing', async () => {
    const { dispatch, log, context } = setup();
    expect(await dispatch('explode', {}, context)).toMatchObject({ ok: false, code: 'internal', message: expect.stringContaining('boom') });
    expect(log.error).toHaveBeenCalled();
  });

  it('never lets an invalid response leave the host', async () => {
    const { dispatch, context } = setup();
    expect(await dispatch('lie', {}, context)).toMatchObject({ ok: false, code: 'invalid_response' });
  });

  it('passes expected failures through unchanged', async () => {
    const { dispatch, context } = setup();
    expect(await dispatch('refuse', {}, context)).toEqual({ ok: false, code: 'bad_input', message: 'clip.csv line 3: expected 4 fields' });
  });
});
