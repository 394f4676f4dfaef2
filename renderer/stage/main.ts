import type { StageCommand, StageEventChunk } from '../../app/contract';
import { connectToHost } from '../shared/host-api';
import { ClipPlayer } from './clip-player';
import { FrameLog } from './frame-log';
import { drawIdleScreen, restingGrey } from './idle-screen';
import { MouseGaze } from './mouse-gaze';
import { PhotodiodePatch } from './photodiode';
import { StageBlank } from './stage-blank';
import { StageClock } from './stage-clock';
import { createSurface } from './surface';
import { TargetLayer } from './targets';

const canvas = document.getElementById('stage') as HTMLCanvasElement;
const surface = createSurface(canvas, new URLSearchParams(location.search).get('renderer') === 'canvas2d' ? 'canvas2d' : 'webgl2');
// Each (re)connection is a new page to the host, so the status is reported again on open.
const api = connectToHost('stage', (state) => {
  if (state === 'open') queueMicrotask(() => {
    reportStatus();
    blank.reconnected();
  });
});
const clock = new StageClock(api);
const frameLog = new FrameLog(
  api,
  () => clock.estimate(),
  () => (player ? { playbackId: player.playbackId, lastUs: player.receivedUs } : null),
);
const targets = new TargetLayer();
const photodiode = new PhotodiodePatch();
const mouse = new MouseGaze(api, canvas);
let player: ClipPlayer | null = null;
let hasPlayed = false;
const blank = new StageBlank(api, () => {
  const nowHost = clock.toHostNs(performance.now()) ?? 0;
  if (player && !player.paused) {
    player.pause(nowHost);
    report('paused', nowHost, null);
  }
});
// Events and commands travel on different paths in browser mode, so a clip's first events
// may come before its prepareClip command: they wait here for it. Events of a clip that was
// stopped may still be on their way; they are dropped.
const early = new Map<string, StageEventChunk[]>();
const finished = new Set<string>();

function fitToWindow(): void {
  const ratio = window.devicePixelRatio || 1;
  surface.resize(Math.round(window.innerWidth * ratio), Math.round(window.innerHeight * ratio));
}

// Chromium throttles hidden pages, so the console must know when the stage is not visible.
function reportStatus(): void {
  void api.reportStageStatus({
    visible: document.visibilityState === 'visible',
    width: canvas.width,
    height: canvas.height,
    devicePixelRatio: window.devicePixelRatio || 1,
    renderer: surface.kind,
  });
}

function report(state: 'started' | 'paused' | 'resumed' | 'ended' | 'stopped', hostNs: number, stimulusUs: number | null, message?: string): void {
  if (!player) return;
  void api.reportPlayback({ playbackId: player.playbackId, state, hostNs, stimulusUs, ...(message ? { message } : {}) });
}

function onCommand(command: StageCommand): void {
  const nowHost = clock.toHostNs(performance.now()) ?? 0;
  switch (command.type) {
    case 'prepareClip':
      player = new ClipPlayer(command);
      hasPlayed = true;
      for (const chunk of early.get(command.playbackId) ?? []) player.addChunk(chunk);
      early.clear();
      break;
    case 'pauseClip':
    case 'resumeClip':
    case 'stopClip':
      if (player?.playbackId !== command.playbackId) return;
      if (command.type === 'stopClip') {
        report('stopped', nowHost, null);
        finished.add(player.playbackId);
        player = null;
      } else if (command.type === 'pauseClip') {
        if (player.paused) return; // the stage key paused it already
        player.pause(nowHost);
        report('paused', nowHost, null);
      } else {
        if (!player.paused) return;
        player.resume(nowHost);
        report('resumed', nowHost, null);
      }
      break;
    case 'showTarget':
      targets.show(command, performance.now());
      break;
    case 'hideTarget':
      targets.hide(command.id);
      break;
    case 'setPhotodiode':
      photodiode.enabled = command.enabled;
      break;
    case 'setMouseGaze':
      mouse.setEnabled(command.enabled);
      break;
    case 'setBlank':
      blank.set(command.blanked);
      break;
  }
}

api.onStageCommand(onCommand);
api.onStageEvents((chunk) => {
  if (player?.playbackId === chunk.playbackId) return player.addChunk(chunk);
  if (finished.has(chunk.playbackId)) return;
  const waiting = early.get(chunk.playbackId) ?? [];
  if (waiting.length < 64) waiting.push(chunk); // the host sends only a little ahead before the stage reports
  early.set(chunk.playbackId, waiting);
});

/** One animation frame: its timestamp is the best presentation-time estimate a browser gives. */
function draw(stageTimeMs: number): void {
  const drawStart = performance.now();
  const hostNs = clock.toHostNs(stageTimeMs);
  surface.clear(restingGrey);
  let shown = null;
  // Blanked: mid-grey and nothing else, not even the photodiode patch.
  if (blank.blanked) {
    if (hostNs !== null) frameLog.add({ stageTimeMs, hostNs, clip: null, stimulusUs: null, eventsDrawn: 0, photodiode: null, drawMs: performance.now() - drawStart });
    requestAnimationFrame(draw);
    return;
  }
  if (player && hostNs !== null) {
    shown = player.frame(hostNs, { widthPx: canvas.width, heightPx: canvas.height });
    if (shown) {
      const { placement } = shown;
      surface.drawImage(shown.rgba, placement.sensor.width, placement.sensor.height, {
        left: placement.left,
        top: placement.top,
        width: placement.sensor.width * placement.scale,
        height: placement.sensor.height * placement.scale,
      });
      if (shown.started) report('started', hostNs, shown.stimulusUs);
    }
  } else if (!hasPlayed && targets.count === 0) {
    drawIdleScreen(surface);
  }
  targets.draw(surface, stageTimeMs);
  const playing = shown !== null && !player!.paused;
  const photodiodeState = photodiode.draw(surface, playing);
  if (hostNs !== null) {
    frameLog.add({
      stageTimeMs,
      hostNs,
      clip: shown?.clip ?? null,
      stimulusUs: shown?.stimulusUs ?? null,
      eventsDrawn: shown?.eventsDrawn ?? 0,
      photodiode: photodiodeState,
      drawMs: performance.now() - drawStart,
    });
  }
  if (shown?.ended && player) {
    report('ended', hostNs!, shown.stimulusUs, player.starvedFrames > 0 ? `${player.starvedFrames} frames waited for events` : undefined);
    finished.add(player.playbackId);
    player = null;
  }
  requestAnimationFrame(draw);
}

fitToWindow();
clock.start();
document.body.dataset.renderer = surface.kind;
document.body.dataset.ready = 'true';
window.addEventListener('resize', () => {
  fitToWindow();
  reportStatus();
});
document.addEventListener('visibilitychange', reportStatus);
blank.listen(window);
document.body.dataset.blanked = 'false';
requestAnimationFrame(draw);
