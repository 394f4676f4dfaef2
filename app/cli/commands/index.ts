import type { Command } from '../command';
import { infoCommand } from './info';

/** Every subcommand; later capabilities add theirs here. */
export const commands: readonly Command[] = [infoCommand];
