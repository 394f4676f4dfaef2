import type { CallContext, ChannelMap, HostHandlers } from './define';
import { describeIssues } from './issue-path';
import { fail, isFailure, ok, type Result } from './result';

export interface DispatchLog {
  warn(event: string, fields: Record<string, unknown>): void;
  error(event: string, fields: Record<string, unknown>): void;
}

export type Dispatch = (channel: string, payload: unknown, context: CallContext) => Promise<Result<unknown>>;

/**
 * The host end of the contract: refuses unknown channels, validates every request before a
 * handler sees it and every response before it leaves, and turns a throwing handler into an
 * `internal` failure. Every refusal is logged; nothing a page sends can crash the host.
 */
export function createDispatcher<Ch extends ChannelMap>(
  channels: Ch,
  handlers: HostHandlers<Ch>,
  log: DispatchLog,
): Dispatch {
  return async (channel, payload, context) => {
    if (!Object.hasOwn(channels, channel)) {
      log.warn('contract.unknown_channel', { channel, page: context.page });
      return fail('unknown_channel', `no channel named "${channel}"`);
    }
    const def = channels[channel]!;
    const parsed = def.request.safeParse(payload);
    if (!parsed.success) {
      const { message, path } = describeIssues('request', parsed.error);
      log.warn('contract.invalid_request', { channel, page: context.page, message });
      return fail('invalid_request', `${channel}: ${message}`, path);
    }
    let result: unknown;
    try {
      const handler = handlers[channel as keyof Ch] as (req: unknown, ctx: CallContext) => unknown;
      result = await handler(parsed.data, context);
    } catch (error) {
      log.error('contract.handler_threw', { channel, message: (error as Error).message, stack: (error as Error).stack });
      return fail('internal', `${channel} failed inside the host: ${(error as Error).message}`);
    }
    if (isFailure(result)) return result;
    const checked = def.response.safeParse(result);
    if (!checked.success) {
      const { message } = describeIssues('response', checked.error);
      log.error('contract.invalid_response', { channel, message });
      return fail('invalid_response', `${channel}: the host produced an invalid response (${message})`);
    }
    return ok(checked.data);
  };
}
