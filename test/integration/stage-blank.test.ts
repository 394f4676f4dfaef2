import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { channels, type StageCommand } from '../../app/contract';
import { createDispatcher } from '../../app/contract/dispatcher';
import { ManualClock, hostNs } from '../../app/core/clock/host-clock';
import type { DisplayGeometry } from '../../app/core/geometry';
import { validationLayout } from '../../app/core/quality';
import type { MessageRecord } from '../../app/core/recording/records';
import { liveHandlers } from '../../app/host/handlers/live-handlers';
import { LiveSession } from '../../app/host/live/live-session';
import { RecoveredSessions } from '../../app/host/live/recovered-sessions';
import { TargetProcedures } from '../../app/host/live/target-procedure';
import { createHostLog } from '../../app/host/log';
import { readSession } from '../../app/host/recording/read-session';
import { SessionRecorder } from '../../app/host/recording/session-recorder';
import { StimulusStore } from '../../app/host/stimuli/stimulus-store';

// The stage blank through the host's dispatcher, as the console and the stage page call it,
// with a real recorder: what is recorded is read back from the session folder.
const DISPLAY: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const log = createHostLog({ file: null, echo: false });
const console1 = { page: 'console', connectionId: 'console-1' } as const;
const stagePage = { page: 'stage', connectionId: 'stage-1' } as const;

function host() {
  const dataDir = mkdtempSync(join(tmpdir(), 'gz-blank-'));
  const clock = new ManualClock(20e9);
  const stage: StageCommand[] = [];
  const live = new LiveSession({
    clock,
    log,
    store: new StimulusStore(dataDir, log),
    recordingsDir: join(dataDir, 'recordings'),
    openRecorder: (dir, meta) => SessionRecorder.create(dir, { sessionId: String(meta.sessionId), display: meta.display as never, metadata: meta }, { clock, syncEveryFlushes: 0 }),
    reopenRecorder: () => Promise.reject(new Error('not used')),
    toStage: { command: (c) => stage.push(c), events: () => {} },
    publish: () => {},
    simulatedDrive: 'manual',
  });
  const advance = (ms: number) => {
    for (let t = 0; t < ms; t += 20) {
      clock.advanceMs(20);
      live.advanceSimulatedTracker(hostNs(clock.nowNs()));
    }
  };
  const sleep = async (ms: number, signal: AbortSignal) => {
    for (let t = 0; t < ms && !signal.aborted; t += 100) {
      advance(100);
      await new Promise((resolve) => setImmediate(resolve));
    }
  };
  const targets = new TargetProcedures(live, { sleep });
  const { blankStage, unblankStage, playTestPattern, resumePlayback, runTargetProcedure, getLiveStatus } = channels;
  const used = { blankStage, unblankStage, playTestPattern, resumePlayback, runTargetProcedure, getLiveStatus };
  const dispatch = createDispatcher(used, liveHandlers(live, new RecoveredSessions(join(dataDir, 'recordings')), targets), log);
  const call = (channel: keyof typeof used, payload: unknown, context: typeof console1 | typeof stagePage = console1) => dispatch(channel, payload, context);
  return { live, clock, stage, call, advance };
}

async function messagesOf(dir: string): Promise<MessageRecord[]> {
  const out: MessageRecord[] = [];
  for await (const m of (await readSession(dir)).messages()) out.push(m);
  return out;
}

let cleanup: (() => Promise<void>) | null = null;
afterEach(async () => {
  await cleanup?.();
  cleanup = null;
});

describe('blanking the stage through the host', () => {
  it('the stage key blanks to grey and pauses the clip at once; the console ends it; both are recorded', async () => {
    const h = host();
    cleanup = () => h.live.dispose();
    const { dir } = await h.live.startRecording({ kind: 'simulated', seed: 3, rateHz: 250 }, DISPLAY);
    const played = await h.call('playTestPattern', { eventsPerSecond: 1000, width: 64, height: 48, durationS: 5, look: 'polarity', placement: 'fit' });
    expect(played.ok).toBe(true);
    const playbackId = (played as { value: { playbackId: string } }).value.playbackId;
    h.advance(200);
    await h.live.playbackReport({ playbackId, state: 'started', hostNs: h.clock.nowNs(), stimulusUs: 0 });
    h.advance(500);

    const before = h.stage.length;
    const blanked = await h.call('blankStage', { reason: 'stage key X' }, stagePage);
    expect(blanked).toMatchObject({ ok: true, value: { blank: { by: 'stage_key', reason: 'stage key X' } } });
    // Grey first, then the clip's pause, in the same call.
    expect(h.stage.slice(before).map((c) => c.type)).toEqual(['setBlank', 'pauseClip']);
    expect(h.stage[before]).toEqual({ type: 'setBlank', blanked: true });
    expect(await h.call('getLiveStatus', {})).toMatchObject({ ok: true, value: { blank: { by: 'stage_key' } } });

    // While blanked nothing new reaches the participant, and the stage cannot end the blank.
    expect(await h.call('resumePlayback', {})).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/blanked/) });
    expect(await h.call('playTestPattern', { eventsPerSecond: 1000, width: 64, height: 48, durationS: 5, look: 'polarity', placement: 'fit' })).toMatchObject({ ok: false, message: expect.stringMatching(/blanked/) });
    expect(await h.call('runTargetProcedure', { purpose: 'validation', points: validationLayout(5, DISPLAY), order: 'as_given' })).toMatchObject({ ok: false, code: 'conflict' });
    expect(await h.call('unblankStage', {}, stagePage)).toMatchObject({ ok: false, code: 'untrusted_sender' });
    // A second blank (the console button) keeps the first one's record.
    expect(await h.call('blankStage', { reason: 'operator button' })).toMatchObject({ ok: true, value: { blank: { by: 'stage_key' } } });

    h.advance(3000);
    expect(await h.call('unblankStage', {})).toEqual({ ok: true, value: { blank: null } });
    expect(h.stage.at(-1)).toEqual({ type: 'setBlank', blanked: false });
    expect(h.live.status().blank).toBeNull();
    await h.live.stopRecording();

    const messages = await messagesOf(dir);
    const blanks = messages.filter((m) => m.kind === 'stage_blanked' || m.kind === 'stage_unblanked');
    expect(blanks.map((m) => m.kind)).toEqual(['stage_blanked', 'stage_unblanked']);
    expect(blanks[0]!.data).toMatchObject({ by: 'stage_key', reason: 'stage key X', clip: 'test-pattern-1000' });
    expect(blanks[1]!.data).toMatchObject({ blankedBy: 'stage_key' });
    expect(blanks[1]!.data.blankedForS).toBeCloseTo(3, 1);
  });

  it('the console button cancels a running target procedure', async () => {
    const h = host();
    cleanup = () => h.live.dispose();
    const { dir } = await h.live.startRecording({ kind: 'simulated', seed: 4, rateHz: 250 }, DISPLAY);
    h.advance(300);
    const procedure = h.call('runTargetProcedure', { purpose: 'validation', points: validationLayout(9, DISPLAY), order: 'as_given' });
    await new Promise((resolve) => setImmediate(resolve));
    const blanked = await h.call('blankStage', { reason: 'participant unwell' });
    expect(blanked).toMatchObject({ ok: true, value: { blank: { by: 'console', reason: 'participant unwell' } } });
    expect(await procedure).toMatchObject({ ok: false, code: 'conflict' });
    // Fewer than the 9 targets were shown: the procedure stopped at the blank.
    const shown = h.stage.filter((c) => c.type === 'showTarget').length;
    expect(shown).toBeGreaterThan(0);
    expect(shown).toBeLessThan(9);
    await h.live.stopRecording();
    const blank = (await messagesOf(dir)).find((m) => m.kind === 'stage_blanked');
    expect(blank?.data).toMatchObject({ by: 'console', reason: 'participant unwell', clip: null });
  });
});
