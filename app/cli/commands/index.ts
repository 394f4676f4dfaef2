import type { Command } from '../command';
import { eventsConvertCommand } from './events/convert';
import { eventsCropCommand } from './events/crop';
import { eventsFilterCommand } from './events/filter';
import { eventsSimulateCommand } from './events/simulate';
import { eventsStatsCommand } from './events/stats';
import { eventsTrimCommand } from './events/trim';
import { infoCommand } from './info';

/** Every subcommand; later capabilities add theirs here. */
export const commands: readonly Command[] = [
  infoCommand,
  eventsStatsCommand,
  eventsConvertCommand,
  eventsTrimCommand,
  eventsCropCommand,
  eventsFilterCommand,
  eventsSimulateCommand,
];
