import { appVersion } from '../host/version';
import { commands } from './commands/index';
import { runCli } from './run-cli';

process.exitCode = await runCli(process.argv.slice(2), commands, { stdout: process.stdout, stderr: process.stderr }, appVersion());
