/**
 * The one typed contract between the renderer (console and stage pages) and the host.
 * Every request, response and host event is declared here with its schema; both ends
 * validate against it (app/contract/client.ts in the renderer, app/contract/dispatcher.ts
 * in the host). Channels are verbs the renderer calls; events are named `onSomething`.
 */
import { z } from 'zod';
import { channel, hostEvent, type ClientApi, type HostHandlers } from './contract/define';
import { empty } from './contract/schemas/common';
import * as app from './contract/schemas/app';
import * as archive from './contract/schemas/archive';
import * as files from './contract/schemas/files';
import * as gazeCalibration from './contract/schemas/gaze-calibration';
import * as jobs from './contract/schemas/jobs';
import * as live from './contract/schemas/live';
import * as preflight from './contract/schemas/preflight';
import * as quality from './contract/schemas/quality';
import * as safety from './contract/schemas/safety';
import * as stage from './contract/schemas/stage';
import * as stimuli from './contract/schemas/stimuli';
import * as targets from './contract/schemas/targets';

export const channels = {
  getAppInfo: channel({ request: empty, response: app.appInfo, summary: 'Version, mode and data folder of the running host' }),
  ping: channel({ request: app.pingRequest, response: app.pingResponse, summary: 'Clock exchange: host receive and send times' }),
  listDisplays: channel({ request: empty, response: app.displayList, summary: 'Displays the stage can be shown on' }),
  openStage: channel({ request: app.openStageRequest, response: app.openStageResponse, summary: 'Show the stage on a display' }),
  reportStageStatus: channel({ request: app.stageStatus.strict(), response: empty, summary: 'The stage says whether it is visible and how it draws' }),
  getStageStatus: channel({ request: empty, response: z.object({ stage: app.stageStatusEvent.nullable() }), summary: 'The stage page connected now, if any' }),
  getFirstRunStatus: channel({ request: empty, response: app.firstRunStatus, summary: 'Background first-run work and its progress' }),
  listJobs: channel({ request: empty, response: z.object({ jobs: z.array(jobs.jobStatus) }), summary: 'Long host work and its progress' }),
  listDirectory: channel({ request: files.listDirectoryRequest, response: files.directoryListing, summary: 'One folder of the host machine, for choosing files to import' }),
  listStimuli: channel({ request: empty, response: z.object({ stimuli: z.array(stimuli.stimulusMeta) }), summary: 'The stimulus library' }),
  getStimulusStats: channel({ request: stimuli.stimulusId, response: stimuli.eventStats, summary: 'Statistics of one stimulus' }),
  importStimulus: channel({ request: stimuli.importRequest, response: jobs.jobStarted, summary: 'Import an event file from the host into the library (a job)' }),
  operateOnStimulus: channel({ request: stimuli.operateRequest, response: jobs.jobStarted, summary: 'Trim, crop or filter a stimulus into a new one (a job)' }),
  updateStimulus: channel({ request: stimuli.updateStimulusRequest, response: stimuli.stimulusMeta, summary: 'Rename a stimulus or edit its notes' }),
  removeStimulus: channel({ request: stimuli.stimulusId, response: empty, summary: 'Move a stimulus to the library trash' }),
  restoreStimulus: channel({ request: stimuli.stimulusId, response: stimuli.stimulusMeta, summary: 'Bring a removed stimulus back' }),
  readStimulusEvents: channel({ request: stimuli.eventWindowRequest, response: stimuli.eventWindow, summary: 'Events of a stimulus in a time window, for previews' }),
  reportFrames: channel({ request: stage.reportFramesRequest, response: empty, summary: 'The stage sends its frame log and clock estimate' }),
  reportPlayback: channel({ request: stage.playbackReport, response: empty, summary: 'The stage says a clip started, paused, resumed or ended' }),
  reportMouseGaze: channel({ request: stage.mouseGazeRequest, response: empty, summary: 'Mouse positions on the stage, used as gaze for piloting' }),
  startRecording: channel({ request: live.startRecordingRequest, response: live.startRecordingResponse, summary: 'Start recording a session from a gaze source' }),
  stopRecording: channel({ request: empty, response: live.stopRecordingResponse, summary: 'Stop and close the recording' }),
  playClip: channel({ request: live.playClipRequest, response: z.object({ playbackId: z.string() }), summary: 'Play a stimulus on the stage at true timing' }),
  playTestPattern: channel({ request: live.playTestPatternRequest, response: z.object({ playbackId: z.string() }), summary: 'Play the stage capacity test pattern at a chosen event rate' }),
  pausePlayback: channel({ request: empty, response: empty, summary: 'Pause the clip on the stage' }),
  resumePlayback: channel({ request: empty, response: empty, summary: 'Resume the paused clip' }),
  stopPlayback: channel({ request: empty, response: empty, summary: 'Stop the clip and return the stage to grey' }),
  getLiveStatus: channel({ request: empty, response: live.liveStatus, summary: 'Live monitoring figures of the running recording' }),
  listRecoveredSessions: channel({ request: empty, response: z.object({ sessions: z.array(live.recoveredSession) }), summary: 'Recordings that did not close, recovered at start' }),
  resumeRecording: channel({ request: live.resumeRecordingRequest, response: live.startRecordingResponse, summary: 'Append to a recovered recording' }),
  showTarget: channel({ request: live.showTargetRequest, response: live.showTargetResponse, summary: 'Show a target on the stage (recorded; sent to the tracker bridge)' }),
  hideTarget: channel({ request: live.hideTargetRequest, response: empty, summary: 'Remove a target from the stage' }),
  blankStage: channel({ request: safety.blankStageRequest, response: safety.blankStageResponse, summary: 'Blank the stage to mid-grey and pause everything at once (recorded); from the console or the stage key' }),
  unblankStage: channel({ request: empty, response: safety.blankStageResponse, summary: 'End the blank (console only, recorded); the paused clip stays paused' }),
  backupLabArchive: channel({ request: archive.backupRequest, response: archive.backupResponse, summary: 'Write a lab archive (folder or .zip) of the given tables and session recordings' }),
  listLabBackups: channel({ request: empty, response: archive.backupList, summary: 'The lab archives in the backups folder of the data folder, newest first' }),
  inspectLabArchive: channel({ request: archive.archivePathRequest, response: z.object({ manifest: archive.archiveManifest }), summary: 'Read the manifest of a lab archive' }),
  restoreLabArchive: channel({ request: archive.archivePathRequest, response: archive.restoreResponse, summary: 'Verify a lab archive, copy its recordings into the data folder and return its tables' }),
  getDemoStudy: channel({ request: empty, response: archive.demoStudy, summary: 'The demo study built on first run (invented data), when it is ready' }),
  runTargetProcedure: channel({ request: targets.runTargetProcedureRequest, response: targets.runTargetProcedureResponse, summary: 'Show calibration, validation or drift-check targets one by one and measure the gaze at each (resolves when done)' }),
  cancelTargetProcedure: channel({ request: empty, response: empty, summary: 'End the running target procedure' }),
  setGazeCalibration: channel({ request: gazeCalibration.setGazeCalibrationRequest, response: gazeCalibration.setGazeCalibrationResponse, summary: "Map a raw-coordinate source's samples to screen px with Gazeloom's calibration (null stops), recorded in the session" }),
  getPreflight: channel({ request: preflight.preflightRequest, response: preflight.preflightResponse, summary: 'Free disk space for the recordings against what a session of that length needs' }),
  getSessionQuality: channel({ request: quality.sessionQualityRequest, response: quality.sessionQualityResponse, summary: 'Quality over time of a session recording: data loss and late frames per bin, and the gaze for plots when asked' }),
} as const;

export const events = {
  onFirstRunProgress: hostEvent({ payload: app.firstRunTask, audience: 'console', summary: 'A first-run task moved on' }),
  onStageStatus: hostEvent({ payload: app.stageStatusEvent, audience: 'console', summary: 'The stage connected, disconnected, or changed visibility' }),
  onJobProgress: hostEvent({ payload: jobs.jobStatus, audience: 'console', summary: 'A host job moved on, finished or failed' }),
  onStimuliChanged: hostEvent({ payload: z.object({ ids: z.array(z.string()) }), audience: 'console', summary: 'Stimuli were added, changed or removed' }),
  onStageCommand: hostEvent({ payload: stage.stageCommand, audience: 'stage', summary: 'Play, pause or stop a clip; show or hide a target; switch the photodiode patch' }),
  onStageEvents: hostEvent({ payload: stage.stageEventChunk, audience: 'stage', bulk: true, summary: 'The next events of the clip being played, ahead of need' }),
  onLiveStatus: hostEvent({ payload: live.liveStatus, audience: 'console', summary: 'Live monitoring, a few times a second' }),
} as const;

export const contract = { channels, events } as const;

export type Channels = typeof channels;
export type Events = typeof events;
export type GazeloomApi = ClientApi<Channels, Events>;
export type GazeloomHandlers = HostHandlers<Channels>;

export * from './contract/result';
export type { CallContext } from './contract/define';
export type { JobStatus } from './contract/schemas/jobs';
export type { LiveStatus, GazeSourceChoice } from './contract/schemas/live';
export type RecoveredSessionInfo = import('zod').infer<typeof live.recoveredSession>;
export type { StageCommand, StageEventChunk, FrameRecordWire } from './contract/schemas/stage';
export type { DirectoryListing } from './contract/schemas/files';
export type { PreflightReport } from './contract/schemas/preflight';
export type { StimulusMeta, EventStats, StimulusOperation, FlashScreening } from './contract/schemas/stimuli';
export type { AppInfo, DisplayInfo, StageStatus, StageStatusEvent, FirstRunTask } from './contract/schemas/app';
