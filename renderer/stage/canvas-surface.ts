import type { StageSurface } from './surface';

/** The fallback surface: Canvas 2D, with the event image scaled through an offscreen canvas. */
export function canvasSurface(canvas: HTMLCanvasElement): StageSurface {
  const context = canvas.getContext('2d', { alpha: false });
  if (!context) throw new Error('this browser offers neither WebGL2 nor Canvas 2D for the stage');
  const offscreen = document.createElement('canvas');
  const offscreenContext = offscreen.getContext('2d')!;
  let image: ImageData | null = null;
  const style = ([r, g, b]: readonly number[]) => `rgb(${r} ${g} ${b})`;
  return {
    kind: 'canvas2d',
    canvas,
    resize(width, height) {
      canvas.width = width;
      canvas.height = height;
    },
    clear(colour) {
      context.fillStyle = style(colour);
      context.fillRect(0, 0, canvas.width, canvas.height);
    },
    fillRect(x, y, w, h, colour) {
      context.fillStyle = style(colour);
      context.fillRect(x, y, w, h);
    },
    fillDisc(cx, cy, radius, colour) {
      context.fillStyle = style(colour);
      context.beginPath();
      context.arc(cx, cy, radius, 0, 2 * Math.PI);
      context.fill();
    },
    drawImage(rgba, w, h, into) {
      if (!image || image.width !== w || image.height !== h) {
        offscreen.width = w;
        offscreen.height = h;
        image = new ImageData(w, h);
      }
      image.data.set(rgba);
      offscreenContext.putImageData(image, 0, 0);
      context.imageSmoothingEnabled = false;
      context.drawImage(offscreen, into.left, into.top, into.width, into.height);
    },
  };
}
