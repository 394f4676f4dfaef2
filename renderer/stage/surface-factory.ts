import { canvasSurface } from './canvas-surface';
import type { StageSurface } from './surface';
import { webglSurface } from './webgl-surface';

export function createSurface(canvas: HTMLCanvasElement, prefer: 'webgl2' | 'canvas2d' = 'webgl2'): StageSurface {
  // preserveDrawingBuffer lets tests and the photodiode check read back what was shown.
  const gl = prefer === 'webgl2' ? canvas.getContext('webgl2', { alpha: false, antialias: false, preserveDrawingBuffer: true }) : null;
  return gl ? webglSurface(canvas, gl) : canvasSurface(canvas);
}
