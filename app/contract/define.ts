import type { z } from 'zod';
import type { Failure, Result } from './result';

/** Which pages receive a host event: the operator console, the stage, or both. */
export type Audience = 'console' | 'stage' | 'all';

export interface ChannelDef<Req extends z.ZodType = z.ZodType, Res extends z.ZodType = z.ZodType> {
  readonly request: Req;
  readonly response: Res;
  readonly summary: string;
}

export interface EventDef<Payload extends z.ZodType = z.ZodType> {
  readonly payload: Payload;
  readonly audience: Audience;
  readonly summary: string;
  /**
   * Bulk data (a clip's events, tens of MB/s): a transport with a faster path for bulk
   * carries it there (browser mode: a streamed HTTP response beside the WebSocket, which
   * Chromium receives several times faster). It is validated like every other event.
   */
  readonly bulk?: boolean;
}

export function channel<Req extends z.ZodType, Res extends z.ZodType>(def: ChannelDef<Req, Res>): ChannelDef<Req, Res> {
  return def;
}

export function hostEvent<Payload extends z.ZodType>(def: EventDef<Payload>): EventDef<Payload> {
  return def;
}

export type ChannelMap = Record<string, ChannelDef>;
/** Event names start with `on` by convention (checked by the contract test). */
export type EventMap = Record<string, EventDef>;

export type RequestOf<C extends ChannelDef> = z.input<C['request']>;
export type ParsedRequestOf<C extends ChannelDef> = z.output<C['request']>;
export type ResponseOf<C extends ChannelDef> = z.output<C['response']>;
export type EventPayloadOf<E extends EventDef> = z.output<E['payload']>;

/** What the renderer sees: one function per channel, one `onX` subscription per event. */
export type ClientApi<Ch extends ChannelMap, Ev extends EventMap> = {
  readonly [K in keyof Ch]: (request: RequestOf<Ch[K]>) => Promise<Result<ResponseOf<Ch[K]>>>;
} & {
  readonly [K in keyof Ev]: (listener: (payload: EventPayloadOf<Ev[K]>) => void) => () => void;
};

/** Who is calling: the host uses it to route events and to refuse untrusted pages. */
export interface CallContext {
  readonly page: 'console' | 'stage';
  readonly connectionId: string;
}

/** What the host implements: one handler per channel, returning a value or a Failure. */
export type HostHandlers<Ch extends ChannelMap> = {
  readonly [K in keyof Ch]: (
    request: ParsedRequestOf<Ch[K]>,
    context: CallContext,
  ) => Promise<ResponseOf<Ch[K]> | Failure> | ResponseOf<Ch[K]> | Failure;
};
