/**
 * What the stage draws with: WebGL2 where the browser has it, Canvas 2D otherwise. Colours
 * are 0-255 sRGB triplets. Later drawing (events, targets) goes through the same surface.
 */
export type Rgb = readonly [number, number, number];

export interface StageSurface {
  readonly kind: 'webgl2' | 'canvas2d';
  readonly canvas: HTMLCanvasElement;
  resize(width: number, height: number): void;
  clear(colour: Rgb): void;
  fillRect(x: number, y: number, width: number, height: number, colour: Rgb): void;
}

export function createSurface(canvas: HTMLCanvasElement): StageSurface {
  // preserveDrawingBuffer lets tests and the photodiode check read back what was shown.
  const gl = canvas.getContext('webgl2', { alpha: false, antialias: false, preserveDrawingBuffer: true });
  return gl ? webglSurface(canvas, gl) : canvasSurface(canvas);
}

function webglSurface(canvas: HTMLCanvasElement, gl: WebGL2RenderingContext): StageSurface {
  return {
    kind: 'webgl2',
    canvas,
    resize(width, height) {
      canvas.width = width;
      canvas.height = height;
      gl.viewport(0, 0, width, height);
    },
    clear([r, g, b]) {
      gl.disable(gl.SCISSOR_TEST);
      gl.clearColor(r / 255, g / 255, b / 255, 1);
      gl.clear(gl.COLOR_BUFFER_BIT);
    },
    fillRect(x, y, width, height, [r, g, b]) {
      // Screen coordinates have y down; GL's scissor box has y up.
      gl.enable(gl.SCISSOR_TEST);
      gl.scissor(Math.round(x), Math.round(canvas.height - y - height), Math.round(width), Math.round(height));
      gl.clearColor(r / 255, g / 255, b / 255, 1);
      gl.clear(gl.COLOR_BUFFER_BIT);
      gl.disable(gl.SCISSOR_TEST);
    },
  };
}

function canvasSurface(canvas: HTMLCanvasElement): StageSurface {
  const context = canvas.getContext('2d', { alpha: false });
  if (!context) throw new Error('this browser offers neither WebGL2 nor Canvas 2D for the stage');
  const fill = (x: number, y: number, w: number, h: number, [r, g, b]: Rgb): void => {
    context.fillStyle = `rgb(${r} ${g} ${b})`;
    context.fillRect(x, y, w, h);
  };
  return {
    kind: 'canvas2d',
    canvas,
    resize(width, height) {
      canvas.width = width;
      canvas.height = height;
    },
    clear: (colour) => fill(0, 0, canvas.width, canvas.height, colour),
    fillRect: fill,
  };
}
