import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

// numpy.linalg.lstsq values made by test/fixtures/quality/correction_reference.py (Debian's python3-numpy).
const fixtureDir = join(__dirname, '../../../../fixtures/quality');
const script = join(fixtureDir, 'correction_reference.py');

export const hasNumpy = spawnSync('/usr/bin/python3', ['-c', 'import numpy'], { stdio: 'ignore' }).status === 0;

export interface MapSet {
  name: string;
  kind: 'affine' | 'polynomial2';
  from: [number, number][];
  to: [number, number][];
  centre: [number, number];
  scale: [number, number];
  ax: number[];
  ay: number[];
  rank: number;
  residuals_px: number[];
}

export interface MatrixSet {
  name: string;
  a: number[][];
  b: number[];
  x: number[];
  rank: number;
  residuals: number[];
}

export interface Reference {
  maps: MapSet[];
  matrices: MatrixSet[];
}

export const storedReference = (): Reference => JSON.parse(readFileSync(join(fixtureDir, 'correction_reference.json'), 'utf8')) as Reference;

/** Runs the script: on its own seeded sets, or on the sets given. */
export function numpyReference(sets?: { maps: Pick<MapSet, 'kind' | 'from' | 'to'>[]; matrices: Pick<MatrixSet, 'a' | 'b'>[] }): Reference {
  const args = sets ? [script, '--stdin'] : [script];
  return JSON.parse(execFileSync('/usr/bin/python3', args, { input: sets ? JSON.stringify(sets) : undefined, encoding: 'utf8' })) as Reference;
}
