import type { Command } from '../command';
import { eventsConvertCommand } from './events/convert';
import { eventsCropCommand } from './events/crop';
import { eventsFilterCommand } from './events/filter';
import { eventsFlashCheckCommand } from './events/flash-check';
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
import { archiveInspectCommand } from './archive/inspect';
import { archiveVerifyCommand } from './archive/verify';
import { demoCommand } from './demo';
import { qualityCommand } from './quality/archive';
import { qualityValidationCommand } from './quality/validation';

/** Every subcommand; later capabilities add theirs here. */
export const commands: readonly Command[] = [
  infoCommand,
  eventsStatsCommand,
  eventsConvertCommand,
  eventsTrimCommand,
  eventsCropCommand,
  eventsFilterCommand,
  eventsSimulateCommand,
  eventsFlashCheckCommand,
  trackerSimulateCommand,
  feedCheckCommand,
  feedReplayCommand,
  recordCommand,
  recordingInspectCommand,
  recordingExportCommand,
  archiveInspectCommand,
  archiveVerifyCommand,
  demoCommand,
  qualityCommand,
  qualityValidationCommand,
];
