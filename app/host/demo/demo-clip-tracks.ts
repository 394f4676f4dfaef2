import { WarehouseScene, type TrackRow } from '../../core/sim';
import { TrackTable } from '../../core/tracker-sim';
import type { DemoClipRecipe } from '../stimuli/demo-clips';
import { DEMO_SENSOR } from './demo-protocol';

/** Track rows every 10 ms: the simulated eye follows objects smoothly at that spacing. */
const STEP_S = 0.01;

/**
 * Where each object of a demo clip is over the clip, straight from the warehouse scene
 * (the same rows the clip's TRACKS.tsv holds, without simulating the events), so the
 * simulated participants can look at the forklifts, parcels, beacon and walker.
 */
export function demoClipTracks(recipe: DemoClipRecipe): TrackTable {
  const scene = new WarehouseScene(DEMO_SENSOR, { objects: recipe.objects });
  const rows: TrackRow[] = [];
  for (let k = 0; k * STEP_S < recipe.durationS; k++) rows.push(...scene.objectsAt(k * STEP_S));
  return TrackTable.fromRows(rows);
}
