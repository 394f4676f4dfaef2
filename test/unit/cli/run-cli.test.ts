import { describe, expect, it } from 'vitest';
import { CliError, type Command } from '../../../app/cli/command';
import { runCli } from '../../../app/cli/run-cli';

const echo: Command = {
  path: ['clip', 'echo'],
  summary: 'Echoes its argument',
  usage: 'TEXT [--loud] [--json]',
  options: { loud: { type: 'boolean', default: false } },
  async run(context) {
    const text = context.positionals[0];
    if (!text) throw new CliError('expected TEXT');
    context.warn('echoes are not stored');
    context.progress(0.5, 'echoing');
    return { json: { text }, text: context.values.loud ? text.toUpperCase() : text };
  },
};

function capture(isTTY = false) {
  let stdout = '';
  let stderr = '';
  return {
    io: { stdout: { write: (t: string) => (stdout += t) }, stderr: { write: (t: string) => (stderr += t), isTTY } },
    out: () => stdout,
    err: () => stderr,
  };
}

describe('the command-line runner', () => {
  it('prints exactly one JSON document with warnings inside it under --json', async () => {
    const c = capture();
    expect(await runCli(['clip', 'echo', 'forklift', '--json'], [echo], c.io, '1.0.0')).toBe(0);
    expect(JSON.parse(c.out())).toEqual({ text: 'forklift', warnings: ['echoes are not stored'] });
    expect(c.out().trim().split('\n')).toHaveLength(1);
    expect(c.err()).toBe('');
  });

  it('shows progress on standard error only when it is a terminal', async () => {
    const tty = capture(true);
    await runCli(['clip', 'echo', 'beacon'], [echo], tty.io, '1.0.0');
    expect(tty.err()).toContain('echoing');
    expect(tty.out()).toBe('beacon\n');
  });

  it('exits 2 with a one-line message on bad input', async () => {
    for (const argv of [['clip', 'echo'], ['clip', 'echo', 'x', '--volume', '3'], ['nothing']]) {
      const c = capture();
      expect(await runCli(argv, [echo], c.io, '1.0.0')).toBe(2);
      expect(c.err().trim().split('\n')).toHaveLength(1);
      expect(c.out()).toBe('');
    }
  });

  it('lists every command in --help', async () => {
    const c = capture();
    expect(await runCli(['--help'], [echo], c.io, '1.0.0')).toBe(0);
    expect(c.out()).toContain('gazeloom clip echo TEXT [--loud] [--json]');
  });
});
