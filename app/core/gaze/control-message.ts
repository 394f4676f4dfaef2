/**
 * Messages the host sends back to a tracker over a TCP or WebSocket gaze feed, so a bridge
 * can drive its tracker's own calibration and mark its recording. Positions are screen
 * pixels; times are host seconds on the session clock.
 */
export type ControlMessage =
  | { readonly type: 'target_shown'; readonly purpose: 'calibration' | 'validation' | 'drift_check'; readonly id: string; readonly x: number; readonly y: number; readonly hostTimeS: number }
  | { readonly type: 'target_removed'; readonly id: string; readonly hostTimeS: number }
  | { readonly type: 'clip_started'; readonly clip: string; readonly hostTimeS: number }
  | { readonly type: 'clip_ended'; readonly clip: string; readonly hostTimeS: number }
  | { readonly type: 'session_started' | 'session_ended'; readonly session: string; readonly hostTimeS: number };
