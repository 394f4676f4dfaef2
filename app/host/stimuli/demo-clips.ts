import recipes from '../../../resources/demo-stimuli.json' with { type: 'json' };
import type { EventBatch } from '../../core/events/event-batch';
import { formatTracksTsv, simulateEvents, type TrackRow, type WarehouseObjectGroup } from '../../core/sim';
import type { FirstRunJob } from '../first-run';
import type { StimulusStore } from './stimulus-store';
import { writeStimulus } from './stimulus-writer';

export interface DemoClipRecipe {
  readonly id: string;
  readonly name: string;
  readonly objects: readonly WarehouseObjectGroup[];
  readonly durationS: number;
  readonly seed: number;
  readonly mayFlash: boolean;
}

export const demoRecipeVersion: number = recipes.recipeVersion;
export const demoClipRecipes = recipes.clips as readonly DemoClipRecipe[];

/** Lets the event loop breathe between slices, so the host keeps answering while it simulates. */
const breathe = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Simulates one recipe into the library, with its ground-truth tracks. */
export async function makeDemoClip(store: StimulusStore, recipe: DemoClipRecipe, report: (fraction: number) => void): Promise<void> {
  const tracks: TrackRow[] = [];
  async function* events(): AsyncGenerator<EventBatch> {
    for (const slice of simulateEvents({ scene: 'warehouse', durationS: recipe.durationS, seed: recipe.seed, objects: recipe.objects })) {
      tracks.push(...slice.tracks);
      report(slice.tEndUs / 1e6 / recipe.durationS);
      yield slice.events;
      await breathe();
    }
  }
  await writeStimulus(
    store,
    {
      id: recipe.id,
      name: recipe.name,
      notes: 'Simulated event camera on a procedurally rendered warehouse aisle. Demo data, not a recording.',
      source: { kind: 'simulation', scene: 'warehouse', seed: recipe.seed, objects: [...recipe.objects], recipeVersion: demoRecipeVersion },
      sensor: { width: 640, height: 480 },
      resolution: 'us',
      mayFlash: recipe.mayFlash,
      demo: true,
      warnings: [],
      tracksTsv: () => formatTracksTsv(tracks),
    },
    events(),
  );
}

/**
 * The first-run job that fills the library with demo clips, once per host: clips already
 * made from the same recipe version are kept (the data folder is the cache).
 */
export function demoClipsJob(store: StimulusStore, changed: (ids: string[]) => void, recipeList: readonly DemoClipRecipe[] = demoClipRecipes): FirstRunJob {
  return {
    id: 'demo-clips',
    label: 'Make the demo clips',
    async run(report) {
      let made = 0;
      for (const [index, recipe] of recipeList.entries()) {
        const existing = await store.get(recipe.id);
        if (existing?.source.kind === 'simulation' && existing.source.recipeVersion === demoRecipeVersion) continue;
        if (existing) await store.remove(recipe.id);
        await makeDemoClip(store, recipe, (f) => report((index + f) / recipeList.length, `simulating ${recipe.name}`));
        changed([recipe.id]);
        made++;
      }
      return made === 0 ? `${recipeList.length} demo clips already in the library` : `made ${made} demo clips`;
    },
  };
}
