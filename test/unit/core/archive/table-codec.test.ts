import { describe, expect, it } from 'vitest';
import { ArchiveFormatError, countRecords, decodeTable, encodeTable, parseManifest, sha256Hex } from '../../../../app/core/archive';
import { sampleTables } from './lab-records';

const catch_ = (work: () => unknown): ArchiveFormatError => {
  try {
    work();
  } catch (error) {
    return error as ArchiveFormatError;
  }
  throw new Error('expected an error');
};

describe('lab archive tables (NDJSON)', () => {
  it('writes one record per line with a newline after each, and reads them back unchanged', () => {
    const records = sampleTables().audit!;
    const text = encodeTable('audit', records);
    expect(text.split('\n')).toHaveLength(3);
    expect(text.endsWith('\n')).toBe(true);
    expect(countRecords(text)).toBe(2);
    expect(decodeTable('audit', text, 'tables/audit.ndjson')).toEqual(records);
    expect(encodeTable('audit', [])).toBe('');
    expect(decodeTable('audit', '', 'tables/audit.ndjson')).toEqual([]);
  });

  it('refuses to encode a record its schema rejects, naming the record and field', () => {
    const bad = { ...sampleTables().participants![0]!, enrolment: 0 };
    expect(() => encodeTable('participants', [bad])).toThrow(/^participants\[0\]: enrolment: /);
  });

  it('names file:line and the field path of a bad record', () => {
    const good = encodeTable('participants', sampleTables().participants!);
    const bad = good.replace('"visionCorrection":"glasses"', '"visionCorrection":"monocle"');
    const error = catch_(() => decodeTable('participants', `${good.replace('"p-1"', '"p-0"')}${bad}`, 'tables/participants.ndjson'));
    expect(error).toBeInstanceOf(ArchiveFormatError);
    expect(error.line).toBe(2);
    expect(error.message).toMatch(/^tables\/participants\.ndjson:2: demographics\.visionCorrection: /);
  });

  it('reports invalid JSON, blank lines and repeated ids by line', () => {
    const line = encodeTable('studies', sampleTables().studies!);
    expect(catch_(() => decodeTable('studies', `${line}{oops\n`, 'f')).message).toMatch(/^f:2: not valid JSON/);
    expect(catch_(() => decodeTable('studies', `${line}\n${line}`, 'f')).message).toBe('f:2: blank line (expected one JSON record per line)');
    expect(catch_(() => decodeTable('studies', `${line}${line}`, 'f')).message).toBe('f:2: id "study-1" appears again (first on line 1)');
  });

  it('accepts a last line without its newline (a hand-edited file)', () => {
    const text = encodeTable('audit', sampleTables().audit!).slice(0, -1);
    expect(decodeTable('audit', text, 'f')).toHaveLength(2);
    expect(countRecords(text)).toBe(2);
  });
});

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 examples (Appendix B.1 "abc", B.2 the 448-bit message)', async () => {
    expect(await sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(await sha256Hex(new TextEncoder().encode('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'))).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });
});

describe('manifest', () => {
  const manifest = { format: 'gazeloom-lab-archive', formatVersion: 1, appVersion: '0.1.0', createdAt: '2026-03-02T09:15:00.000Z', demo: false, tables: {}, recordings: {} };

  it('reads a valid manifest and refuses a newer format version by name', () => {
    expect(parseManifest(JSON.stringify(manifest)).formatVersion).toBe(1);
    expect(() => parseManifest(JSON.stringify({ ...manifest, formatVersion: 2 }))).toThrow('manifest.json: archive format version 2 is newer than this Gazeloom reads (1); update Gazeloom');
    expect(() => parseManifest('{"format":"something-else"}')).toThrow(/not a Gazeloom lab archive manifest/);
  });

  it('refuses unknown tables and paths that could leave the archive folder', () => {
    const sha256 = '0'.repeat(64);
    expect(() => parseManifest(JSON.stringify({ ...manifest, tables: { gossip: { file: 'tables/gossip.ndjson', records: 0, sha256 } } }))).toThrow(/tables\.gossip: unknown table "gossip"/);
    expect(() => parseManifest(JSON.stringify({ ...manifest, recordings: { s1: { files: { '../../etc/passwd': { bytes: 1, sha256 } } } } }))).toThrow(/recordings\.s1\.files/);
    expect(() => parseManifest(JSON.stringify({ ...manifest, recordings: { '..': { files: {} } } }))).toThrow(/recordings/);
  });
});
