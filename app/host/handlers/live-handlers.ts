import type { GazeloomHandlers } from '../../contract';
import { fail } from '../../contract/result';
import type { LiveSession } from '../live/live-session';
import type { RecoveredSessions } from '../live/recovered-sessions';
import { TargetProcedures } from '../live/target-procedure';

type LiveChannels =
  | 'reportFrames'
  | 'reportPlayback'
  | 'reportMouseGaze'
  | 'startRecording'
  | 'stopRecording'
  | 'playClip'
  | 'pausePlayback'
  | 'resumePlayback'
  | 'stopPlayback'
  | 'getLiveStatus'
  | 'playTestPattern'
  | 'listRecoveredSessions'
  | 'resumeRecording'
  | 'showTarget'
  | 'hideTarget'
  | 'runTargetProcedure'
  | 'cancelTargetProcedure'
  | 'setGazeCalibration'
  | 'blankStage'
  | 'unblankStage';

const failure = (error: unknown) => fail('conflict', (error as Error).message);
const blanked = () => fail('conflict', 'the stage is blanked: unblank it first (the Unblank stage button)');

/** Recording, playback on the stage, and the stage's reports back to the host. */
export function liveHandlers(live: LiveSession, recovered: RecoveredSessions, targets = new TargetProcedures(live)): Pick<GazeloomHandlers, LiveChannels> {
  return {
    reportFrames: ({ frames, clock, received }) => {
      live.frames(frames, clock, received);
      return {};
    },
    reportPlayback: async (report) => {
      await live.playbackReport(report);
      return {};
    },
    reportMouseGaze: ({ samples }) => {
      live.mouseSamples(samples);
      return {};
    },
    startRecording: async ({ source, display, label }) => {
      try {
        return await live.startRecording(source, display, label);
      } catch (error) {
        return failure(error);
      }
    },
    stopRecording: async () => {
      try {
        return await live.stopRecording();
      } catch (error) {
        return failure(error);
      }
    },
    playClip: async ({ stimulusId, speed, look, placement, photodiode }) => {
      try {
        live.setPhotodiode(photodiode);
        return { playbackId: await live.play({ stimulusId, speed, look, placement }) };
      } catch (error) {
        return fail('bad_input', (error as Error).message);
      }
    },
    playTestPattern: async ({ eventsPerSecond, width, height, durationS, look, placement }) => {
      try {
        return { playbackId: await live.playTestPattern({ eventsPerSecond, sensor: { width, height }, durationS, speed: 1, look, placement }) };
      } catch (error) {
        return fail('bad_input', (error as Error).message);
      }
    },
    pausePlayback: () => {
      live.scheduler.pause();
      return {};
    },
    resumePlayback: () => {
      if (live.blank) return blanked();
      live.scheduler.resume();
      return {};
    },
    stopPlayback: async () => {
      await live.stopClip();
      return {};
    },
    getLiveStatus: () => live.status(),
    listRecoveredSessions: () => ({ sessions: recovered.list() }),
    resumeRecording: async ({ sessionId }) => {
      const session = recovered.list().find((s) => s.sessionId === sessionId);
      if (!session) return fail('not_found', `no recovered session "${sessionId}"`);
      if (!session.resumable) return fail('unavailable', `${sessionId} does not say which gaze source and display it used, so it cannot be resumed as it was`);
      try {
        const started = await live.resumeRecording(session.dir);
        recovered.forget(sessionId);
        return started;
      } catch (error) {
        return failure(error);
      }
    },
    showTarget: ({ x, y, purpose }) => (live.blank ? blanked() : { targetId: live.showTarget(x, y, purpose) }),
    hideTarget: ({ targetId }) => {
      live.hideTarget(targetId);
      return {};
    },
    runTargetProcedure: (request) => (live.blank ? blanked() : targets.run(request)),
    cancelTargetProcedure: () => {
      targets.cancel();
      return {};
    },
    // The stage key calls blankStage from the stage page; only the console ends a blank.
    blankStage: ({ reason }, context) => {
      const blank = live.blankStage(context.page === 'stage' ? 'stage_key' : 'console', reason);
      targets.cancel();
      return { blank };
    },
    unblankStage: (_request, context) => {
      if (context.page !== 'console') return fail('untrusted_sender', 'only the operator console can end a blank');
      live.unblankStage();
      return { blank: null };
    },
    setGazeCalibration: ({ params, calibrationId }) => {
      try {
        return live.setGazeCalibration(params, calibrationId);
      } catch (error) {
        return failure(error);
      }
    },
  };
}
