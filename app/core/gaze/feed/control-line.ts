import type { ControlMessage } from '../control-message';

/** The version of the host-to-tracker control lines, their "gazeloom_control" field. */
export const CONTROL_PROTOCOL_VERSION = 1;

/**
 * A control message as one NDJSON line (no newline), in the feed's snake_case:
 * {"gazeloom_control":1,"type":"target_shown","purpose":"calibration","id":"c1","x":960,"y":540,"host_time_s":12.5}
 */
export function encodeControl(message: ControlMessage): string {
  const { hostTimeS, ...rest } = message;
  return JSON.stringify({ gazeloom_control: CONTROL_PROTOCOL_VERSION, ...rest, host_time_s: hostTimeS });
}

const PURPOSES = ['calibration', 'validation', 'drift_check'] as const;
const isText = (v: unknown): v is string => typeof v === 'string';
const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Reads a control line on the tracker side; returns the reason when it is not one. */
export function parseControlLine(line: string): ControlMessage | string {
  let o: Record<string, unknown>;
  try {
    o = JSON.parse(line) as Record<string, unknown>;
  } catch {
    return 'control: not valid JSON';
  }
  if (typeof o !== 'object' || o === null || o.gazeloom_control !== CONTROL_PROTOCOL_VERSION) return `control: expected "gazeloom_control": ${CONTROL_PROTOCOL_VERSION}`;
  const hostTimeS = o.host_time_s;
  if (!isFiniteNumber(hostTimeS)) return 'control: "host_time_s" must be a finite number';
  switch (o.type) {
    case 'target_shown':
      if (!(PURPOSES as readonly unknown[]).includes(o.purpose)) return `control: "purpose" must be one of ${PURPOSES.join(', ')}`;
      if (!isText(o.id) || !isFiniteNumber(o.x) || !isFiniteNumber(o.y)) return 'control: target_shown needs "id" (string), "x" and "y" (screen px)';
      return { type: 'target_shown', purpose: o.purpose as (typeof PURPOSES)[number], id: o.id, x: o.x, y: o.y, hostTimeS };
    case 'target_removed':
      return isText(o.id) ? { type: 'target_removed', id: o.id, hostTimeS } : 'control: target_removed needs "id" (string)';
    case 'clip_started':
    case 'clip_ended':
      return isText(o.clip) ? { type: o.type, clip: o.clip, hostTimeS } : `control: ${o.type} needs "clip" (string)`;
    case 'session_started':
    case 'session_ended':
      return isText(o.session) ? { type: o.type, session: o.session, hostTimeS } : `control: ${o.type} needs "session" (string)`;
    default:
      return `control: unknown "type" ${JSON.stringify(o.type)}`;
  }
}
