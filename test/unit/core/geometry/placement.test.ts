import { describe, expect, it } from 'vitest';
import { onSensor, placeSensor, screenToSensor, sensorPoint, sensorToScreen, screenPoint } from '../../../../app/core/geometry';

// Placement arithmetic, checked by hand (common practice, no source).
describe('placing the sensor image on the screen', () => {
  const sensor = { width: 640, height: 480 };
  const screen = { widthPx: 1920, heightPx: 1080 };

  it('fits with letterbox: the largest uniform scale, centred', () => {
    const p = placeSensor(sensor, screen, 'fit');
    expect(p.scale).toBe(2.25); // 1080 / 480
    expect(p.left).toBe(240); // (1920 - 1440) / 2
    expect(p.top).toBe(0);
  });

  it('places 1:1 pixels centred, and integer scale at the largest whole factor', () => {
    expect(placeSensor(sensor, screen, '1:1')).toMatchObject({ scale: 1, left: 640, top: 300 });
    expect(placeSensor(sensor, screen, 'integer')).toMatchObject({ scale: 2, left: 320, top: 60 });
    expect(placeSensor({ width: 4000, height: 3000 }, screen, 'integer').scale).toBe(1);
  });

  it('maps sensor pixel centres to the screen and back', () => {
    const p = placeSensor(sensor, screen, 'fit');
    expect(sensorToScreen(p, sensorPoint(0, 0))).toEqual({ x: 240 + 1.125, y: 1.125 });
    const back = screenToSensor(p, sensorToScreen(p, sensorPoint(321.5, 17)));
    expect(back.x).toBeCloseTo(321.5, 12);
    expect(back.y).toBeCloseTo(17, 12);
    expect(onSensor(p, screenToSensor(p, screenPoint(100, 500)))).toBe(false); // in the left letterbox
    expect(onSensor(p, screenToSensor(p, screenPoint(960, 540)))).toBe(true);
  });
});
