import { describe, expect, it } from 'vitest';
import { concatBatches, type EventBatch } from '../../app/core/events/event-batch';
import { LIBRARY_SCREENING, screenClipFlashes } from '../../app/core/safety';
import { DEFAULT_SENSOR, FLICKER_HZ, flashingParts, simulateEvents } from '../../app/core/sim';
import { demoProtocol } from '../../app/host/demo/demo-protocol';
import { demoClipRecipes, type DemoClipRecipe } from '../../app/host/stimuli/demo-clips';
import { combineLooks } from '../../app/host/stimuli/flash-screening';

/*
 * Every demo recipe's "may flash" mark must be what the library's flash screening finds in
 * the clip (in every look, as the library screens it), so the marks cannot drift from the
 * analysis. The first 2 s of each clip are screened, since the whole recipes (6 to 8 s at
 * 640x480) take about a minute to simulate and screen: every object of a recipe is in view
 * and moving from t = 0, and the beacon (a turn in 0.67 s) and the flicker (a cycle in
 * 0.125 s) repeat many times within them.
 */
const SCREENED_S = 2;
const LOOKS = ['polarity', 'decay', 'grey'] as const;

function clipEvents(recipe: DemoClipRecipe): EventBatch {
  const slices = simulateEvents({ scene: 'warehouse', durationS: SCREENED_S, seed: recipe.seed, objects: recipe.objects });
  return concatBatches([...slices].map((s) => s.events));
}

const screen = (recipe: DemoClipRecipe) => {
  const events = clipEvents(recipe);
  return combineLooks(LOOKS.map((look) => screenClipFlashes(events, DEFAULT_SENSOR, { ...LIBRARY_SCREENING, look })), '2026-01-01T00:00:00Z');
};

describe('the demo clips flash marks', () => {
  it.each(demoClipRecipes.map((r) => [r.id, r] as const))('%s is marked "may flash" exactly when the screening fails it', (_id, recipe) => {
    expect(screen(recipe).pass).toBe(!recipe.mayFlash);
  }, 60_000);

  it('fails the flickering ceiling light as general flashing, 8 a second, over a large region where the light is', () => {
    const recipe = demoClipRecipes.find((r) => r.id === 'demo-flickering-light')!;
    const result = screen(recipe);
    expect(result.pass).toBe(false);
    // Where the simulator puts the light, in screen pixels: the 640x480 clip fitted to 1920x1080 is scaled 2.25 and centred, 240 px from the left.
    const light = flashingParts({ scene: 'warehouse', objects: recipe.objects }).find((p) => p.kind === 'flickering-light')!;
    expect(light.flashesPerSecond).toBe(FLICKER_HZ);
    const onScreen = { left: 240 + 2.25 * light.x0, top: 2.25 * light.y0, right: 240 + 2.25 * (light.x1 + 1), bottom: 2.25 * (light.y1 + 1) };
    for (const look of result.looks) {
      expect(look.failures, look.look).toHaveLength(1);
      const [failure] = look.failures;
      expect(failure!.kind).toBe('general');
      // The tube goes on and off 8 times a second: 8 flashes (pairs of opposing changes) in every second.
      expect(failure!.flashes_per_s).toBe(8);
      // It fails from the first window on, through the whole screened span.
      expect(failure!.start_s).toBeLessThan(0.25);
      expect(failure!.end_s).toBeGreaterThan(SCREENED_S - 0.1);
      // WCAG 2.2, success criterion 2.3.1 and its glossary entry "general flash and red flash thresholds"
      // (W3C, 2023): flashing fails above a combined area of 0.006 sr; this light's is well above it.
      const { region } = failure!;
      expect(region.solid_angle_sr).toBeGreaterThan(1.5 * 0.006);
      expect(region.x_px).toBeGreaterThanOrEqual(onScreen.left);
      expect(region.y_px).toBeGreaterThanOrEqual(onScreen.top);
      expect(region.x_px + region.width_px).toBeLessThanOrEqual(onScreen.right);
      expect(region.y_px + region.height_px).toBeLessThanOrEqual(onScreen.bottom);
    }
  }, 60_000);

  it('keeps the failing clip out of the demo protocol, which shows every clip that passes', () => {
    const block = demoProtocol('2026-01-01T00:00:00Z').steps.find((s) => s.kind === 'block');
    expect(block).toMatchObject({ stimulusIds: demoClipRecipes.filter((r) => !r.mayFlash).map((r) => r.id) });
    expect(block).toMatchObject({ stimulusIds: ['demo-forklift-crossing', 'demo-conveyor-parcels', 'demo-warning-beacon', 'demo-person-walking', 'demo-busy-aisle'] });
  });
});
