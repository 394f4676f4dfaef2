import type { Audience, EventMap, EventPayloadOf } from './define';
import { describeIssues } from './issue-path';

export interface EventSink {
  readonly page: 'console' | 'stage';
  send(eventName: string, payload: unknown): void;
}

export interface EventHub<Ev extends EventMap> {
  emit<K extends keyof Ev & string>(eventName: K, payload: EventPayloadOf<Ev[K]>): void;
  addSink(sink: EventSink): () => void;
}

const reaches = (audience: Audience, page: EventSink['page']): boolean => audience === 'all' || audience === page;

/** Host-to-renderer events: validated once here, then delivered to every page in the audience. */
export function createEventHub<Ev extends EventMap>(events: Ev): EventHub<Ev> {
  const sinks = new Set<EventSink>();
  return {
    emit(eventName, payload) {
      const def = events[eventName];
      if (!def) throw new Error(`no host event named "${eventName}"`);
      const parsed = def.payload.safeParse(payload);
      if (!parsed.success) throw new Error(`${eventName}: ${describeIssues('event', parsed.error).message}`);
      for (const sink of sinks) if (reaches(def.audience, sink.page)) sink.send(eventName, parsed.data);
    },
    addSink(sink) {
      sinks.add(sink);
      return () => sinks.delete(sink);
    },
  };
}
