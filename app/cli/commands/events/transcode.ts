import type { EventBatch, SensorSize } from '../../../core/events/event-batch';
import { openEventInput, type EventInput, type EventInputOptions } from '../../../host/events/event-input';
import { outputFormatOf, outputFormats, writeEventFile } from '../../../host/events/event-output';
import { CliError, type CommandContext, type CommandOutput } from '../../command';
import { asBadInput } from '../../input-errors';

export interface Transform {
  readonly sensor: SensorSize;
  readonly apply: (batch: EventBatch) => EventBatch;
  readonly describe: string;
}

/**
 * The shape every `events` command that writes a file shares: read IN (any format), pass
 * each batch through a transform, write OUT by its extension, all or nothing.
 */
export async function transcode(
  context: CommandContext,
  inPath: string,
  outPath: string,
  readOptions: EventInputOptions,
  makeTransform: (input: EventInput) => Promise<Transform> | Transform,
): Promise<CommandOutput> {
  if (outputFormatOf(outPath) === null) throw new CliError(`${outPath}: OUT must end in ${outputFormats.join(' or ')}`);
  return asBadInput(async () => {
    const input = await openEventInput(inPath, readOptions, (f) => context.progress(f, 'converting'));
    try {
      input.warnings.forEach(context.warn);
      const transform = await makeTransform(input);
      let kept = 0;
      let read = 0;
      async function* output(): AsyncGenerator<EventBatch> {
        for await (const batch of input.batches()) {
          read += batch.t.length;
          const out = transform.apply(batch);
          kept += out.t.length;
          if (out.t.length > 0) yield out;
        }
      }
      await writeEventFile(outPath, { sensor: transform.sensor, resolution: input.resolution }, output());
      const json = { input: inPath, output: outPath, events_read: read, events_written: kept, width: transform.sensor.width, height: transform.sensor.height, resolution: input.resolution };
      return { json, text: `${outPath}: ${kept.toLocaleString('en-GB')} of ${read.toLocaleString('en-GB')} events ${transform.describe} (${transform.sensor.width}x${transform.sensor.height})` };
    } finally {
      await input.close();
    }
  });
}
