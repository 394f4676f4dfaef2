import { describe, expect, it } from 'vitest';
import { encodeControl, parseControlLine } from '../../../../app/core/gaze/feed';
import type { ControlMessage } from '../../../../app/core/gaze/control-message';

// Host-to-tracker control lines, a protocol of our own (common practice, no source).
const messages: ControlMessage[] = [
  { type: 'target_shown', purpose: 'calibration', id: 'c1', x: 960, y: 540, hostTimeS: 12.5 },
  { type: 'target_shown', purpose: 'validation', id: 'v3', x: 192.5, y: 108, hostTimeS: 30 },
  { type: 'target_shown', purpose: 'drift_check', id: 'd1', x: 960, y: 540, hostTimeS: 31 },
  { type: 'target_removed', id: 'c1', hostTimeS: 13.75 },
  { type: 'clip_started', clip: 'forklift-crossing-01', hostTimeS: 40 },
  { type: 'clip_ended', clip: 'forklift-crossing-01', hostTimeS: 70.016 },
  { type: 'session_started', session: 'S007', hostTimeS: 1 },
  { type: 'session_ended', session: 'S007', hostTimeS: 900 },
];

describe('control lines', () => {
  it('round-trip every kind of control message', () => {
    for (const m of messages) expect(parseControlLine(encodeControl(m))).toEqual(m);
  });

  it('use the documented snake_case shape', () => {
    expect(encodeControl(messages[0]!)).toBe('{"gazeloom_control":1,"type":"target_shown","purpose":"calibration","id":"c1","x":960,"y":540,"host_time_s":12.5}');
    expect(encodeControl(messages[3]!)).toBe('{"gazeloom_control":1,"type":"target_removed","id":"c1","host_time_s":13.75}');
  });

  it.each([
    ['not json', 'not valid JSON'],
    ['5', 'expected "gazeloom_control": 1'],
    ['null', 'expected "gazeloom_control": 1'],
    ['{"gazeloom_control":2,"type":"clip_started","clip":"a","host_time_s":1}', 'expected "gazeloom_control": 1'],
    ['{"gazeloom_control":1,"type":"clip_started","clip":"a"}', '"host_time_s" must be a finite number'],
    ['{"gazeloom_control":1,"type":"target_shown","purpose":"focus","id":"a","x":1,"y":1,"host_time_s":1}', '"purpose" must be one of'],
    ['{"gazeloom_control":1,"type":"target_shown","purpose":"calibration","id":"a","x":1,"host_time_s":1}', 'target_shown needs'],
    ['{"gazeloom_control":1,"type":"target_removed","host_time_s":1}', 'target_removed needs "id"'],
    ['{"gazeloom_control":1,"type":"clip_ended","clip":3,"host_time_s":1}', 'clip_ended needs "clip"'],
    ['{"gazeloom_control":1,"type":"session_started","host_time_s":1}', 'session_started needs "session"'],
    ['{"gazeloom_control":1,"type":"reboot","host_time_s":1}', 'unknown "type" "reboot"'],
  ])('refuse %s', (line, reason) => {
    expect(parseControlLine(line)).toContain(reason);
  });
});
