import type { Command } from '../command';
import { eventsConvertCommand } from './events/convert';
import { eventsCropCommand } from './events/crop';
import { eventsFilterCommand } from './events/filter';
import { eventsSimulateCommand } from './events/simulate';
import { eventsStatsCommand } from './events/stats';
import { eventsTrimCommand } from './events/trim';
import { feedCheckCommand } from './feed/check';
import { feedReplayCommand } from './feed/replay';
import { infoCommand } from './info';
import { recordCommand } from './record';
import { recordingExportCommand } from './recording/export';
import { recordingInspectCommand } from './recording/inspect';
import { trackerSimulateCommand } from './tracker/simulate';

/** Every subcommand; later capabilities add theirs here. */
export const commands: readonly Command[] = [
  infoCommand,
  eventsStatsCommand,
  eventsConvertCommand,
  eventsTrimCommand,
  eventsCropCommand,
  eventsFilterCommand,
  eventsSimulateCommand,
  trackerSimulateCommand,
  feedCheckCommand,
  feedReplayCommand,
  recordCommand,
  recordingInspectCommand,
  recordingExportCommand,
];
