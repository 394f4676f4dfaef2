import { createMonotonicClock } from '../../../app/host/monotonic-clock';
import { SessionRecorder } from '../../../app/host/recording/session-recorder';
import { FRAME_RATE_HZ, frameAt, GAZE_PER_MESSAGE, GAZE_RATE_HZ, gazeAt, messageAt } from './generated-records';

/**
 * The recording process of the crash test: opens (creates or reopens) a session and
 * appends generated records at 2000 Hz of gaze, 120 Hz of frames and a message every 50
 * samples, on schedule, until it is killed (or, with closeAfterMs, closes cleanly). Every
 * 5 ms it prints what it has appended so far and when, on the machine's monotonic clock:
 *   {"appended":{"gaze":N,"frames":N,"messages":N},"atNs":"…"}
 * Standard output is a pipe, which Node writes synchronously on Linux, so a line printed
 * before the kill reaches the test.
 */
interface Plan {
  readonly dir: string;
  readonly mode: 'create' | 'reopen';
  readonly next: { readonly gaze: number; readonly frames: number; readonly messages: number };
  readonly closeAfterMs: number | null;
}

const plan = JSON.parse(process.argv[2]!) as Plan;
const clock = createMonotonicClock();
const options = { clock, clockOriginNs: clock.originNs, flushIntervalMs: 50 };
const recorder = plan.mode === 'create' ? await SessionRecorder.create(plan.dir, { display: null, metadata: { purpose: 'crash test' } }, options) : await SessionRecorder.reopen(plan.dir, options);

const absoluteNs = () => (clock.originNs + BigInt(Math.round(clock.nowNs()))).toString();
let gaze = plan.next.gaze;
let frames = plan.next.frames;
let messages = plan.next.messages;
const startedNs = clock.nowNs();
process.stdout.write(`${JSON.stringify({ ready: true, originNs: clock.originNs.toString(), pid: process.pid })}\n`);

const generate = () => {
  const elapsedS = (clock.nowNs() - startedNs) / 1e9;
  while (gaze - plan.next.gaze <= elapsedS * GAZE_RATE_HZ) {
    recorder.appendGaze(gazeAt(gaze, clock.nowNs()));
    gaze++;
    if (gaze % GAZE_PER_MESSAGE === 0) recorder.appendMessage(messageAt(messages++));
  }
  const dueFrames = plan.next.frames + Math.floor(elapsedS * FRAME_RATE_HZ) + 1;
  const batch = [];
  while (frames < dueFrames) batch.push(frameAt(frames++));
  if (batch.length > 0) recorder.appendFrames(batch);
};
const generator = setInterval(generate, 1);
const reporter = setInterval(() => process.stdout.write(`${JSON.stringify({ appended: { gaze, frames, messages }, atNs: absoluteNs() })}\n`), 5);

if (plan.closeAfterMs !== null) {
  setTimeout(async () => {
    clearInterval(generator);
    clearInterval(reporter);
    await recorder.close();
    process.stdout.write(`${JSON.stringify({ closed: { gaze, frames, messages } })}\n`);
  }, plan.closeAfterMs);
}
