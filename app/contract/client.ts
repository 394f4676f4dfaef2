import type { ChannelMap, ClientApi, EventMap } from './define';
import { describeIssues } from './issue-path';
import { fail, isFailure, ok, type Result } from './result';

/** How the client reaches the host: Electron IPC through the preload, or the WebSocket. */
export interface ContractTransport {
  /** Resolves with the host's Result for this request (never rejects for expected failures). */
  request(channel: string, payload: unknown): Promise<unknown>;
  subscribe(eventName: string, listener: (payload: unknown) => void): () => void;
}

export interface ClientOptions {
  /** Called when the host sends an event the contract does not allow (dropped, not delivered). */
  onInvalidEvent?: (eventName: string, message: string) => void;
}

/**
 * The typed proxy the renderer uses. Requests are validated before they leave (a renderer
 * bug shows up here, with its path) and responses and events when they arrive.
 */
export function createContractClient<Ch extends ChannelMap, Ev extends EventMap>(
  contract: { channels: Ch; events: Ev },
  transport: ContractTransport,
  options: ClientOptions = {},
): ClientApi<Ch, Ev> {
  const api: Record<string, unknown> = {};
  for (const [name, def] of Object.entries(contract.channels)) {
    api[name] = async (request: unknown): Promise<Result<unknown>> => {
      const parsedRequest = def.request.safeParse(request);
      if (!parsedRequest.success) {
        const { message, path } = describeIssues('request', parsedRequest.error);
        return fail('invalid_request', `${name}: ${message}`, path);
      }
      let raw: unknown;
      try {
        raw = await transport.request(name, parsedRequest.data);
      } catch (error) {
        return fail('transport_closed', `${name}: ${(error as Error).message}`);
      }
      if (isFailure(raw)) return raw;
      const value = (raw as { value?: unknown } | null)?.value;
      const parsedResponse = def.response.safeParse(value);
      if (!parsedResponse.success) {
        const { message, path } = describeIssues('response', parsedResponse.error);
        return fail('invalid_response', `${name}: ${message}`, path);
      }
      return ok(parsedResponse.data);
    };
  }
  for (const [name, def] of Object.entries(contract.events)) {
    api[name] = (listener: (payload: unknown) => void) =>
      transport.subscribe(name, (payload) => {
        const parsed = def.payload.safeParse(payload);
        if (parsed.success) listener(parsed.data);
        else options.onInvalidEvent?.(name, describeIssues('event', parsed.error).message);
      });
  }
  return api as ClientApi<Ch, Ev>;
}
