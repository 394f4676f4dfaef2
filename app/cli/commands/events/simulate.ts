import type { EventBatch } from '../../../core/events/event-batch';
import { DEFAULT_OBJECT_GROUPS, formatTracksTsv, simulateEvents, WAREHOUSE_OBJECT_GROUPS, type TrackRow, type WarehouseObjectGroup } from '../../../core/sim';
import { outputFormatOf, outputFormats, writeEventFile } from '../../../host/events/event-output';
import { writeFileDurably } from '../../../host/fs/durable';
import { CliError, type Command } from '../../command';
import { asBadInput } from '../../input-errors';
import { noExtraPositionals, requiredNumber, requiredString, sensorOption, sensorOptions, stringOption } from '../../options';

export const eventsSimulateCommand: Command = {
  path: ['events', 'simulate'],
  summary:
    'Simulate an event camera on the procedural warehouse aisle (forklifts, conveyor parcels, a rotating beacon, a person walking; a flickering ceiling light when asked for) and write its events and ground-truth tracks',
  usage: '--scene warehouse --duration S --seed N --out FILE --tracks TRACKS.tsv [--width W --height H] [--objects forklift,conveyor,beacon,person,flickering-light] [--json]',
  options: { ...sensorOptions, scene: { type: 'string' }, duration: { type: 'string' }, seed: { type: 'string' }, out: { type: 'string' }, tracks: { type: 'string' }, objects: { type: 'string' } },
  async run(context) {
    noExtraPositionals(context, 0);
    const scene = requiredString(context, 'scene');
    if (scene !== 'warehouse') throw new CliError(`--scene must be "warehouse", got "${scene}"`);
    const durationS = requiredNumber(context, 'duration', { min: 0.001, max: 3600 });
    const seed = requiredNumber(context, 'seed', { integer: true, min: 0, max: 2 ** 32 - 1 });
    const out = requiredString(context, 'out');
    const tracksPath = requiredString(context, 'tracks');
    if (outputFormatOf(out) === null) throw new CliError(`${out}: --out must end in ${outputFormats.join(' or ')}`);
    const objectsText = stringOption(context, 'objects');
    const objects = objectsText?.split(',').map((o) => o.trim()) as WarehouseObjectGroup[] | undefined;
    const unknown = objects?.filter((o) => !(WAREHOUSE_OBJECT_GROUPS as readonly string[]).includes(o));
    if (unknown && unknown.length > 0) throw new CliError(`--objects: unknown "${unknown.join(', ')}"; choose from ${WAREHOUSE_OBJECT_GROUPS.join(', ')}`);
    const sensor = sensorOption(context) ?? { width: 640, height: 480 };
    return asBadInput(async () => {
      const tracks: TrackRow[] = [];
      const slices = simulateEvents({ scene: 'warehouse', sensor, durationS, seed, ...(objects ? { objects } : {}) });
      function* events(): Generator<EventBatch> {
        for (const slice of slices) {
          tracks.push(...slice.tracks);
          context.progress(slice.tEndUs / 1e6 / durationS, 'simulating');
          yield slice.events;
        }
      }
      const count = await writeEventFile(out, { sensor, resolution: 'us' }, events());
      await writeFileDurably(tracksPath, formatTracksTsv(tracks));
      const json = { out, tracks: tracksPath, events: count, track_rows: tracks.length, width: sensor.width, height: sensor.height, duration_s: durationS, seed, objects: objects ?? [...DEFAULT_OBJECT_GROUPS] };
      return { json, text: `${out}: ${count.toLocaleString('en-GB')} simulated events; ${tracksPath}: ${tracks.length.toLocaleString('en-GB')} track rows` };
    });
  },
};
