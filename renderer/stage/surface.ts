/**
 * What the stage draws with: WebGL2 where the browser has it, Canvas 2D otherwise. Colours
 * are 0-255 sRGB triplets; positions are canvas pixels with y down. The event image is an
 * RGBA buffer of the sensor's size, drawn scaled (nearest neighbour) into a rectangle.
 */
export type Rgb = readonly [number, number, number];

export interface Rect {
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
}

export interface StageSurface {
  readonly kind: 'webgl2' | 'canvas2d';
  readonly canvas: HTMLCanvasElement;
  resize(width: number, height: number): void;
  clear(colour: Rgb): void;
  fillRect(x: number, y: number, width: number, height: number, colour: Rgb): void;
  fillDisc(cx: number, cy: number, radius: number, colour: Rgb): void;
  drawImage(rgba: Uint8ClampedArray, imageWidth: number, imageHeight: number, into: Rect): void;
}

export { createSurface } from './surface-factory';
