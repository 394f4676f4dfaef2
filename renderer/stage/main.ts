import { connectToHost } from '../shared/host-api';
import { drawIdleScreen } from './idle-screen';
import { createSurface } from './surface';

const canvas = document.getElementById('stage') as HTMLCanvasElement;
const surface = createSurface(canvas);
// Each (re)connection is a new page to the host, so the status is reported again on open.
const api = connectToHost('stage', (state) => {
  if (state === 'open') queueMicrotask(reportStatus);
});

const fitToWindow = (): void => {
  const ratio = window.devicePixelRatio || 1;
  surface.resize(Math.round(window.innerWidth * ratio), Math.round(window.innerHeight * ratio));
  drawIdleScreen(surface);
};

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

fitToWindow();
document.body.dataset.renderer = surface.kind;
document.body.dataset.ready = 'true';
window.addEventListener('resize', () => {
  fitToWindow();
  reportStatus();
});
document.addEventListener('visibilitychange', reportStatus);
