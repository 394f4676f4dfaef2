/**
 * Coordinate spaces as distinct types, so a screen pixel can never be passed where a
 * sensor pixel or a degree is expected. Screen and sensor pixels have the origin at the
 * top-left with y down; degrees are visual angle seen from the eye.
 */
export type ScreenPx = number & { readonly __space: 'screen-px' };
export type SensorPx = number & { readonly __space: 'sensor-px' };
export type Deg = number & { readonly __space: 'deg' };
export type Mm = number & { readonly __space: 'mm' };

export interface ScreenPoint {
  readonly x: ScreenPx;
  readonly y: ScreenPx;
}

export interface SensorPoint {
  readonly x: SensorPx;
  readonly y: SensorPx;
}

export const screenPoint = (x: number, y: number): ScreenPoint => ({ x: x as ScreenPx, y: y as ScreenPx });
export const sensorPoint = (x: number, y: number): SensorPoint => ({ x: x as SensorPx, y: y as SensorPx });
export const deg = (value: number): Deg => value as Deg;
export const radToDeg = (radians: number): Deg => ((radians * 180) / Math.PI) as Deg;
export const degToRad = (degrees: number): number => (degrees * Math.PI) / 180;
