import { checkJsonValue } from './json-value-check';
import type { MessageRecord } from './records';

/**
 * A messages chunk's payload is UTF-8 JSON, one line per record, each ending in "\n":
 *   {"hostNs":123456789,"kind":"clip_start","data":{"clip":"aisle-3",...}}
 */
export function checkMessageRecord(r: MessageRecord): void {
  if (!(typeof r.hostNs === 'number' && Number.isFinite(r.hostNs))) throw new RangeError(`message record: hostNs must be a finite number, got ${r.hostNs}`);
  if (typeof r.kind !== 'string' || r.kind === '') throw new RangeError('message record: kind must be a non-empty string');
  if (typeof r.data !== 'object' || r.data === null || Array.isArray(r.data)) throw new RangeError(`message record "${r.kind}": data must be an object`);
  checkJsonValue(r.data, `message record "${r.kind}": data`);
}

export const encodeMessageLine = (r: MessageRecord): string => `${JSON.stringify({ hostNs: r.hostNs, kind: r.kind, data: r.data })}\n`;

const decoder = new TextDecoder('utf-8', { fatal: true });

export function decodeMessagePayload(payload: Uint8Array, count: number): MessageRecord[] {
  const lines = decoder.decode(payload).split('\n');
  if (lines.pop() !== '' || lines.length !== count) throw new Error(`messages payload holds ${lines.length} lines, expected ${count} each ending in a newline`);
  return lines.map((line, i) => {
    const o = JSON.parse(line) as MessageRecord;
    if (typeof o.hostNs !== 'number' || typeof o.kind !== 'string' || typeof o.data !== 'object' || o.data === null) throw new Error(`message ${i} lacks hostNs, kind or data`);
    return { hostNs: o.hostNs, kind: o.kind, data: o.data };
  });
}
