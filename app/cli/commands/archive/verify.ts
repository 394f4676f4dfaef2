import { verifyLabArchive } from '../../../host/archive/verify-lab-archive';
import type { Command } from '../../command';
import { noExtraPositionals, positional } from '../../options';
import { archiveBadInput } from './archive-errors';

/** Damage found: exit status 1 (not 2: the input is an archive, its contents are wrong). */
class ArchiveDamaged extends Error {
  override name = 'ArchiveDamaged';
}

export const archiveVerifyCommand: Command = {
  path: ['archive', 'verify'],
  summary: 'Check every file of a lab archive against its manifest (SHA-256, sizes, record counts, record schemas, nothing missing or unlisted); exit status 1 naming each file that does not match',
  usage: 'PATH [--json]',
  options: {},
  async run(context) {
    const path = positional(context, 0, 'PATH');
    noExtraPositionals(context, 1);
    const { manifest, problems } = await archiveBadInput(() => verifyLabArchive(path));
    if (problems.length > 0) throw new ArchiveDamaged(`${path}: ${problems.length} problem(s): ${problems.map((p) => `${p.file}: ${p.problem}`).join('; ')}`);
    const files = Object.keys(manifest.tables).length + Object.values(manifest.recordings).reduce((n, r) => n + Object.keys(r.files).length, 0);
    const records = Object.values(manifest.tables).reduce((n, t) => n + t.records, 0);
    const sessions = Object.keys(manifest.recordings).length;
    return {
      json: { path, ok: true, files, records, sessions },
      text: `${path}: intact: ${files} files match the manifest (${records} records in ${Object.keys(manifest.tables).length} tables, ${sessions} session recordings)`,
    };
  },
};
