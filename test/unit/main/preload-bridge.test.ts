import { describe, expect, it, vi } from 'vitest';
import { channels, events } from '../../../app/contract';
import { buildBridge } from '../../../app/preload/bridge-api';

describe('the preload bridge', () => {
  const ipc = { invoke: vi.fn(async () => 'answer'), on: vi.fn(), removeListener: vi.fn() };
  const bridge = buildBridge(ipc as never, Object.keys(channels), Object.keys(events));

  it('exposes one function per channel and per event, and nothing else', () => {
    expect(Object.keys(bridge).sort()).toEqual([...Object.keys(channels), ...Object.keys(events)].sort());
    expect(Object.values(bridge).every((value) => typeof value === 'function')).toBe(true);
    expect(Object.isFrozen(bridge)).toBe(true);
    expect(bridge).not.toHaveProperty('invoke');
  });

  it('keeps the whole IPC surface visible in review', () => {
    // Any change to the contract's surface changes this list: review it on purpose.
    expect({ channels: Object.keys(channels), events: Object.keys(events) }).toMatchInlineSnapshot(`
      {
        "channels": [
          "getAppInfo",
          "ping",
          "listDisplays",
          "openStage",
          "reportStageStatus",
          "getStageStatus",
          "getFirstRunStatus",
          "listJobs",
          "listDirectory",
          "listStimuli",
          "getStimulusStats",
          "importStimulus",
          "operateOnStimulus",
          "updateStimulus",
          "removeStimulus",
          "restoreStimulus",
          "readStimulusEvents",
          "reportFrames",
          "reportPlayback",
          "reportMouseGaze",
          "startRecording",
          "stopRecording",
          "playClip",
          "playTestPattern",
          "pausePlayback",
          "resumePlayback",
          "stopPlayback",
          "getLiveStatus",
          "listRecoveredSessions",
          "resumeRecording",
          "showTarget",
          "hideTarget",
          "blankStage",
          "unblankStage",
          "backupLabArchive",
          "listLabBackups",
          "inspectLabArchive",
          "restoreLabArchive",
          "getDemoStudy",
          "runTargetProcedure",
          "cancelTargetProcedure",
          "setGazeCalibration",
          "getPreflight",
          "getSessionQuality",
        ],
        "events": [
          "onFirstRunProgress",
          "onStageStatus",
          "onJobProgress",
          "onStimuliChanged",
          "onStageCommand",
          "onStageEvents",
          "onLiveStatus",
        ],
      }
    `);
  });

  it('invokes the channel of the same name and unsubscribes events', async () => {
    expect(await bridge.ping!({ clientSentMs: 1 })).toBe('answer');
    expect(ipc.invoke).toHaveBeenCalledWith('ping', { clientSentMs: 1 });
    const stop = bridge.onStageStatus!(() => undefined) as () => void;
    expect(ipc.on).toHaveBeenCalledWith('onStageStatus', expect.any(Function));
    stop();
    expect(ipc.removeListener).toHaveBeenCalledWith('onStageStatus', ipc.on.mock.calls[0]![1]);
    expect(() => bridge.onStageStatus!('not a function')).toThrow(TypeError);
  });
});
