import { parseArgs } from 'node:util';
import { CliError, type Command, type CommandContext } from './command';

export interface CliIo {
  readonly stdout: { write(text: string): unknown };
  readonly stderr: { write(text: string): unknown; isTTY?: boolean };
}

const commonOptions = {
  json: { type: 'boolean', default: false },
  help: { type: 'boolean', short: 'h', default: false },
} as const;

function helpText(commands: readonly Command[], version: string): string {
  const lines = commands.map((c) => `  gazeloom ${[...c.path, c.usage].join(' ').trim()}\n      ${c.summary}`);
  return [
    `gazeloom ${version}: event-camera gaze datasets from the command line`,
    '',
    'Usage:',
    ...lines,
    '',
    'Every command takes --json: standard output then carries exactly one JSON document',
    '(warnings in its "warnings" array); progress goes to standard error when it is a terminal.',
    'Bad input exits with status 2 and a one-line message on standard error.',
    '',
  ].join('\n');
}

/** Finds the command whose path is the longest prefix of the arguments. */
function findCommand(commands: readonly Command[], argv: readonly string[]): Command | null {
  let best: Command | null = null;
  for (const command of commands) {
    if (command.path.every((word, i) => argv[i] === word) && command.path.length > (best?.path.length ?? -1)) best = command;
  }
  return best;
}

/** Runs one invocation and returns the exit status. */
export async function runCli(argv: readonly string[], commands: readonly Command[], io: CliIo, version: string): Promise<number> {
  if (argv.length === 0 || argv[0] === '--help' || argv[0] === '-h' || argv[0] === 'help') {
    io.stdout.write(helpText(commands, version));
    return 0;
  }
  if (argv[0] === '--version') {
    io.stdout.write(`${version}\n`);
    return 0;
  }
  const command = findCommand(commands, argv);
  const name = command ? `gazeloom ${command.path.join(' ')}` : 'gazeloom';
  const wantsJson = argv.includes('--json');
  try {
    if (!command) throw new CliError(`unknown command "${argv.filter((a) => !a.startsWith('-')).join(' ')}"; see gazeloom --help`);
    let parsed;
    try {
      parsed = parseArgs({ args: argv.slice(command.path.length), options: { ...command.options, ...commonOptions }, allowPositionals: true, strict: true });
    } catch (error) {
      throw new CliError((error as Error).message.split('\n')[0]!);
    }
    if (parsed.values.help) {
      io.stdout.write(`Usage: gazeloom ${[...command.path, command.usage].join(' ')}\n\n${command.summary}\n`);
      return 0;
    }
    const warnings: string[] = [];
    const showProgress = io.stderr.isTTY === true;
    const context: CommandContext = {
      values: parsed.values as CommandContext['values'],
      positionals: parsed.positionals,
      json: parsed.values.json === true,
      warn: (message) => {
        if (context.json) warnings.push(message);
        else io.stderr.write(`${name}: warning: ${message}\n`);
      },
      progress: (fraction, label) => {
        if (showProgress) io.stderr.write(`\r${label} ${(Math.min(1, Math.max(0, fraction)) * 100).toFixed(0).padStart(3)}%${fraction >= 1 ? '\n' : ''}`);
      },
    };
    const output = await command.run(context);
    if (context.json) io.stdout.write(`${JSON.stringify({ ...output.json, warnings })}\n`);
    else io.stdout.write(output.text.endsWith('\n') ? output.text : `${output.text}\n`);
    return 0;
  } catch (error) {
    const message = (error as Error).message.replace(/\s*\n\s*/g, ' ');
    io.stderr.write(`${name}: ${message}\n`);
    if (!(error instanceof CliError) && !wantsJson && process.env.GAZELOOM_DEBUG) io.stderr.write(`${(error as Error).stack}\n`);
    return error instanceof CliError ? 2 : 1;
  }
}
