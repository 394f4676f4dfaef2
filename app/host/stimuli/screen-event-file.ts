import type { LookName } from '../../core/render/look-settings';
import { ClipFlashScreen, type FlashAnalysis, type FlashSettings } from '../../core/safety';
import { openEventInput, type EventInputOptions } from '../events/event-input';

/** Lets the event loop breathe between batches, so the host keeps answering during a long screening. */
const breathe = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Screens an event file for flashing in one or more looks with one read of the file: every
 * batch goes to one screen per look. Reports progress as the fraction of the file read.
 */
export async function screenEventFile(
  path: string,
  looks: readonly LookName[],
  viewing: Omit<FlashSettings, 'look'>,
  report: (fraction: number) => void,
  readOptions: EventInputOptions = {},
): Promise<{ analyses: FlashAnalysis[]; warnings: readonly string[] }> {
  const input = await openEventInput(path, readOptions, report);
  try {
    const screens = looks.map((look) => new ClipFlashScreen(input.sensor, { ...viewing, look }));
    for await (const batch of input.batches()) {
      for (const screen of screens) screen.push(batch);
      await breathe();
    }
    return { analyses: screens.map((s) => s.finish()), warnings: input.warnings };
  } finally {
    await input.close();
  }
}
