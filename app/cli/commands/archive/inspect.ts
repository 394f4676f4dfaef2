import { inspectLabArchive } from '../../../host/archive/inspect-lab-archive';
import type { Command } from '../../command';
import { noExtraPositionals, positional } from '../../options';
import { archiveBadInput } from './archive-errors';

export const archiveInspectCommand: Command = {
  path: ['archive', 'inspect'],
  summary: 'Show a lab archive (folder or .zip): format and app version, when it was made, whether it is demo data, each table with its record count, each session recording with its files and size',
  usage: 'PATH [--json]',
  options: {},
  async run(context) {
    const path = positional(context, 0, 'PATH');
    noExtraPositionals(context, 1);
    const m = await archiveBadInput(() => inspectLabArchive(path));
    const sessions = Object.entries(m.recordings).map(([id, { files }]) => ({ id, files: Object.keys(files).length, bytes: Object.values(files).reduce((n, f) => n + f.bytes, 0) }));
    const json = { path, manifest: m, sessions };
    const text = [
      `${path}: lab archive format ${m.formatVersion}, made by Gazeloom ${m.appVersion} at ${m.createdAt}${m.demo ? ' (DEMO DATA: invented by the simulator)' : ''}`,
      'tables:',
      ...Object.entries(m.tables).map(([name, t]) => `  ${name.padEnd(13)} ${String(t.records).padStart(7)} records`),
      sessions.length === 0 ? 'recordings: none' : 'recordings:',
      ...sessions.map((s) => `  ${s.id}: ${s.files} files, ${s.bytes} bytes`),
    ].join('\n');
    return { json, text };
  },
};
