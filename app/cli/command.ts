import type { ParseArgsConfig } from 'node:util';

export type OptionSpec = NonNullable<ParseArgsConfig['options']>;

/** What a subcommand gets: its parsed options, and ways to warn and to show progress. */
export interface CommandContext {
  readonly values: Record<string, string | boolean | string[] | boolean[] | undefined>;
  readonly positionals: readonly string[];
  readonly json: boolean;
  /** Goes into the JSON document's "warnings" array, or to standard error as a line. */
  warn(message: string): void;
  /** Shown on standard error, and only when it is a terminal. */
  progress(fraction: number, label: string): void;
}

/** A subcommand's result: the JSON document for --json and the text for people. */
export interface CommandOutput {
  readonly json: Record<string, unknown>;
  readonly text: string;
}

export interface Command {
  /** Words after `gazeloom`, e.g. ['events', 'stats']. */
  readonly path: readonly string[];
  readonly summary: string;
  /** Usage line after the command path, e.g. 'FILE [--width W --height H] [--json]'. */
  readonly usage: string;
  readonly options: OptionSpec;
  run(context: CommandContext): Promise<CommandOutput>;
}

/** Bad input from the user: reported as one line on standard error, exit code 2. */
export class CliError extends Error {
  override name = 'CliError';
}
