import { existsSync } from 'node:fs';
import { mkdir, readFile, rm } from 'node:fs/promises';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { buildDemoStudy, MAX_DEMO_PARTICIPANTS } from '../../host/demo/build-demo-study';
import { parsePersonalDataTsv, passphraseFromFile, PersonalDataError } from '../../host/demo/personal-data-tsv';
import { temporarySibling } from '../../host/fs/durable';
import { writeLabArchive } from '../../host/archive/write-lab-archive';
import { CliError, type Command } from '../command';
import { asBadInput } from '../input-errors';
import { noExtraPositionals, numberOption, requiredString, stringOption } from '../options';

export const demoCommand: Command = {
  path: ['demo'],
  summary:
    'Simulate a small complete study of invented data (demo protocol, warehouse clips, participants with consent, sessions recorded from the simulated tracker in simulated time, one participant with heavy drift) and write it as a lab archive (a folder, or a .zip when DIR ends in .zip). --personal-data gives the participants names, e-mail, birth dates, consent notes and answers (TSV columns name, email, birth_date, consent_note, share, withdrawn; yes/no), sealed with the passphrase in --passphrase-file',
  usage: '--out DIR [--participants N] [--seed S] [--personal-data FILE.tsv --passphrase-file F] [--json]',
  options: { out: { type: 'string' }, participants: { type: 'string' }, seed: { type: 'string' }, 'personal-data': { type: 'string' }, 'passphrase-file': { type: 'string' } },
  async run(context) {
    noExtraPositionals(context, 0);
    const out = requiredString(context, 'out');
    if (existsSync(out)) throw new CliError(`${out}: already exists; choose a new name (an archive is never overwritten)`);
    const seed = numberOption(context, 'seed', { integer: true, min: 0, max: 0xffffffff }) ?? 1;
    const personalFile = stringOption(context, 'personal-data');
    const passphraseFile = stringOption(context, 'passphrase-file');
    if (personalFile && !passphraseFile) throw new CliError('--personal-data needs --passphrase-file: personal details are stored only encrypted');
    const { personalData, passphrase } = await asBadInput(async () => {
      try {
        return {
          personalData: personalFile ? parsePersonalDataTsv(await readFile(personalFile, 'utf8'), personalFile) : undefined,
          passphrase: passphraseFile ? passphraseFromFile(await readFile(passphraseFile, 'utf8'), passphraseFile) : undefined,
        };
      } catch (error) {
        if (error instanceof PersonalDataError) throw new CliError(error.message);
        throw error;
      }
    });
    const participants = numberOption(context, 'participants', { integer: true, min: 1, max: MAX_DEMO_PARTICIPANTS }) ?? personalData?.length ?? 6;
    if (personalData && personalData.length !== participants) throw new CliError(`${personalFile}: ${personalData.length} participant rows, but --participants is ${participants} (one row per participant)`);

    const work = temporarySibling(out);
    await mkdir(work, { recursive: true });
    try {
      const study = await buildDemoStudy({ participants, seed, recordingsDir: work, personalData, passphrase, onProgress: (f, label) => context.progress(f * 0.95, label) });
      const manifest = await asBadInput(async () => {
        try {
          return await writeLabArchive(out, { tables: study.tables, sessionDirs: study.sessionDirs, demo: true });
        } catch (error) {
          if (error instanceof ArchiveFormatError) throw new CliError(error.message);
          throw error;
        }
      });
      context.progress(1, 'writing the lab archive');
      const records = Object.values(manifest.tables).reduce((n, t) => n + t.records, 0);
      const json = {
        out,
        demo: true,
        participants: study.participants.map((p) => ({ code: p.code, session_id: p.sessionId, drift_deg_per_min: p.driftDegPerMin, samples: p.samples, max_drift_deg: p.maxDriftDeg, validation_mean_deg: p.meanValidationAccuracyDeg })),
        records,
        sessions: study.sessionDirs.length,
        passphrase: passphrase ? 'from --passphrase-file' : 'gazeloom-demo',
        recovery_key: study.recoveryKey,
      };
      const lines = study.participants.map((p) => `  ${p.code}  ${p.samples} samples, validation ${p.meanValidationAccuracyDeg?.toFixed(2) ?? 'n/a'}°, largest drift ${p.maxDriftDeg?.toFixed(2) ?? 'n/a'}°${p.driftDegPerMin >= 1 ? '  (heavy drift)' : ''}`);
      const text = [
        `${out}: demo study of ${participants} simulated participants (invented data), ${records} records, ${study.sessionDirs.length} session recordings`,
        ...lines,
        passphrase ? 'lab passphrase: the one in --passphrase-file' : 'lab passphrase: gazeloom-demo',
        ...(study.recoveryKey ? [`recovery key (write it down; it is shown only now): ${study.recoveryKey}`] : []),
      ].join('\n');
      return { json, text };
    } finally {
      await rm(work, { recursive: true, force: true });
    }
  },
};
