import type { FrameRecord, GazeRecord, MessageRecord } from '../../../app/core/recording/records';

/**
 * The known content the crash test's recording process generates: every field but the
 * arrival time is a function of the record's number, so the test can rebuild exactly what
 * was appended and compare it with what recovery gives back.
 */
export const GAZE_RATE_HZ = 2000;
export const FRAME_RATE_HZ = 120;
export const GAZE_PER_MESSAGE = 50;

export function gazeAt(seq: number, arrivalNs: number): GazeRecord {
  const blink = seq % 97 < 3;
  const x = 960 + 700 * Math.sin(seq / 337) + (seq % 7) / 8;
  const y = 540 + 400 * Math.cos(seq / 211) - (seq % 5) / 16;
  return {
    seq,
    trackerTimeS: 5000 + seq / GAZE_RATE_HZ,
    arrivalNs,
    hostNs: seq * (1e9 / GAZE_RATE_HZ) + 0.125,
    left: blink ? { x: Number.NaN, y: Number.NaN, valid: false, pupil: null } : { x, y, valid: true, pupil: 3 + (seq % 11) / 10 },
    right: seq % 5 === 0 ? null : { x: x + 1.5, y: y - 0.25, valid: !blink, pupil: null },
  };
}

export function frameAt(frame: number): FrameRecord {
  const inClip = frame % 600 < 480; // 4 s clips with 1 s blanks between them
  return {
    frame,
    stageTimeMs: 12_345.5 + (frame * 1000) / FRAME_RATE_HZ,
    hostNs: frame * (1e9 / FRAME_RATE_HZ),
    clip: inClip ? `aisle-${Math.floor(frame / 600) % 3} forklift` : null,
    stimulusUs: inClip ? ((frame % 600) * 1e6) / FRAME_RATE_HZ : null,
    eventsDrawn: (frame * 7919) % 400_000,
    late: frame % 53 === 0,
    photodiode: inClip ? ((frame % 2) as 0 | 1) : 0,
  };
}

export function messageAt(k: number): MessageRecord {
  return { hostNs: k * GAZE_PER_MESSAGE * (1e9 / GAZE_RATE_HZ), kind: 'operator_mark', data: { mark: k, note: `parcel ${k} passed the beacon`, tags: ['crash-test', k % 2 === 0 ? 'even' : 'odd'] } };
}
