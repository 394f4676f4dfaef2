import type { RecordOf, ProtocolRecord, StudyRecord } from '../../core/study/records';
import { demoClipRecipes, type DemoClipRecipe } from '../stimuli/demo-clips';
import { DEFAULT_THRESHOLDS } from '../../core/study/protocol-defaults';

export const DEMO_STUDY_ID = 'demo-study';
export const DEMO_PROTOCOL_ID = 'demo-protocol';
export const DEMO_OPERATOR_ID = 'demo-operator';
export { DEMO_PASSPHRASE } from '../../core/study/demo-passphrase';
export const DEMO_SENSOR = { width: 640, height: 480 } as const;
/** A 24-inch 1080p monitor at 65 cm, a common lab set-up. */
export const DEMO_DISPLAY = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 } as const;

export function demoStudy(createdAt: string): StudyRecord {
  return {
    id: DEMO_STUDY_ID,
    name: 'Demo: warehouse aisle saliency',
    description: 'Invented data made by the simulator: simulated participants watching simulated event-camera clips of a warehouse aisle. Not a real study; start your own for real participants.',
    createdAt,
    demo: true,
  };
}

/** The study's stimuli: the demo clips the host's library makes on first launch (same ids). */
export function demoStimuli(addedAt: string, recipes: readonly DemoClipRecipe[] = demoClipRecipes): RecordOf<'stimuli'>[] {
  return recipes.map((r) => ({ id: r.id, studyId: DEMO_STUDY_ID, name: r.name, durationS: r.durationS, sensor: { ...DEMO_SENSOR }, mayFlash: r.mayFlash, addedAt }));
}

/**
 * Calibrate, validate, the clips that pass the flash screening in a counterbalanced block
 * with a drift check every 2 clips, a rest, a closing message. The flickering-light clip
 * stays out: it is in the study to show a failing screening, not to be watched.
 */
export function demoProtocol(createdAt: string, recipes: readonly DemoClipRecipe[] = demoClipRecipes): ProtocolRecord {
  return {
    id: DEMO_PROTOCOL_ID,
    studyId: DEMO_STUDY_ID,
    name: 'Demo protocol: warehouse clips',
    version: 1,
    steps: [
      { kind: 'message', text: 'Please keep your head still and look at the screen. The session takes about two minutes.' },
      { kind: 'calibrate' },
      { kind: 'validate' },
      { kind: 'block', name: 'warehouse clips', stimulusIds: recipes.filter((r) => !r.mayFlash).map((r) => r.id) },
      { kind: 'drift_check' },
      { kind: 'rest', seconds: 10 },
      { kind: 'message', text: 'Thank you: the session is over.' },
    ],
    counterbalancing: { kind: 'latin-square' },
    driftCheckEvery: 2,
    validationLayout: 9,
    thresholds: { ...DEFAULT_THRESHOLDS },
    look: 'decay',
    speed: 1,
    createdAt,
    updatedAt: createdAt,
  };
}
