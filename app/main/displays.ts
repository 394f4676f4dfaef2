import type { Display, Screen } from 'electron';
import type { DisplayInfo } from '../contract';

/** Electron's displays in the contract's terms; the label says where each one sits. */
export function describeDisplays(screen: Pick<Screen, 'getAllDisplays' | 'getPrimaryDisplay'>): DisplayInfo[] {
  const primaryId = screen.getPrimaryDisplay().id;
  return screen.getAllDisplays().map((display: Display, index: number) => ({
    id: String(display.id),
    label: display.label || `Display ${index + 1}`,
    bounds: { ...display.bounds },
    scaleFactor: display.scaleFactor,
    refreshHz: display.displayFrequency > 0 ? display.displayFrequency : null,
    primary: display.id === primaryId,
  }));
}
