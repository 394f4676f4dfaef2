import { readdirSync, readFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { dirname, join, relative, resolve } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

// The layer rules of DESIGN.md, read from the imports of every source file.
const root = resolve(__dirname, '../..');

function sourceFiles(dir: string): string[] {
  return readdirSync(join(root, dir), { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx|mts)$/.test(entry.name) && !entry.name.endsWith('.d.ts') ? [path] : [];
  });
}

/** Every module a source text names: static, type-only, side-effect and dynamic imports, re-exports and require (TypeScript's own scanner). */
const importsIn = (text: string): string[] => ts.preProcessFile(text, true, true).importedFiles.map((f) => f.fileName);
const importsOf = (file: string): string[] => importsIn(readFileSync(join(root, file), 'utf8'));

type Target = { kind: 'file'; path: string } | { kind: 'node' } | { kind: 'package'; name: string };

function classify(file: string, specifier: string): Target {
  if (specifier.startsWith('.')) return { kind: 'file', path: relative(root, resolve(root, dirname(file), specifier)) };
  if (specifier.startsWith('node:') || builtinModules.includes(specifier)) return { kind: 'node' };
  const parts = specifier.split('/');
  return { kind: 'package', name: specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0]! };
}

/** npm packages app/core may use: pure computation with no runtime API of their own. */
const purePackages = new Set<string>(['zod']);
/** The contract may use only zod besides app/core. */
const contractPackages = new Set(['zod']);

const inside = (path: string, folder: string) => path === folder || path.startsWith(`${folder}/`);
const isContract = (path: string) => path === 'app/contract' || path === 'app/contract.ts' || inside(path, 'app/contract');

const files = [...sourceFiles('app'), ...sourceFiles('renderer')];

describe('layer rules', () => {
  it('finds the source tree', () => {
    expect(files.length).toBeGreaterThan(20);
    expect(importsOf('app/contract.ts')).toContain('./contract/define');
  });

  it('app/core imports nothing outside app/core except pure npm packages', () => {
    const offences = files
      .filter((f) => inside(f, 'app/core'))
      .flatMap((f) =>
        importsOf(f)
          .map((s) => ({ s, t: classify(f, s) }))
          .filter(({ t }) => (t.kind === 'file' ? !inside(t.path, 'app/core') : t.kind === 'node' || !purePackages.has(t.name)))
          .map(({ s }) => `${f} imports ${s}`),
      );
    expect(offences).toEqual([]);
  });

  it('the contract imports only app/core, itself and zod', () => {
    const offences = files
      .filter(isContract)
      .flatMap((f) =>
        importsOf(f)
          .map((s) => ({ s, t: classify(f, s) }))
          .filter(({ t }) => (t.kind === 'file' ? !(inside(t.path, 'app/core') || isContract(t.path)) : t.kind === 'node' || !contractPackages.has(t.name)))
          .map(({ s }) => `${f} imports ${s}`),
      );
    expect(offences).toEqual([]);
  });

  it('renderer/ imports only renderer/, app/core and the contract from app/, and no Node modules', () => {
    const offences = files
      .filter((f) => inside(f, 'renderer'))
      .flatMap((f) =>
        importsOf(f)
          .map((s) => ({ s, t: classify(f, s) }))
          .filter(({ t }) => (t.kind === 'file' ? !(inside(t.path, 'renderer') || inside(t.path, 'app/core') || isContract(t.path)) : t.kind === 'node'))
          .map(({ s }) => `${f} imports ${s}`),
      );
    expect(offences).toEqual([]);
  });

  it('only app/main and app/preload import electron (type-only imports included)', () => {
    const offences = files
      .filter((f) => !inside(f, 'app/main') && !inside(f, 'app/preload'))
      .flatMap((f) => importsOf(f).filter((s) => s === 'electron' || s.startsWith('electron/')).map((s) => `${f} imports ${s}`));
    expect(offences).toEqual([]);
  });

  it('app/host never reaches into the renderer or the Electron shell', () => {
    const offences = files
      .filter((f) => inside(f, 'app/host') || inside(f, 'app/cli'))
      .flatMap((f) =>
        importsOf(f)
          .map((s) => ({ s, t: classify(f, s) }))
          .filter(({ t }) => t.kind === 'file' && (inside(t.path, 'renderer') || inside(t.path, 'app/main') || inside(t.path, 'app/preload')))
          .map(({ s }) => `${f} imports ${s}`),
      );
    expect(offences).toEqual([]);
  });

  it('the import reader sees every import form (so the rules above can fail)', () => {
    const sample = [
      "import a from './a';",
      "import { b } from '../b';",
      "import type { C } from 'electron';",
      "export * from './d';",
      "import './e.css';",
      "const f = await import('node:fs');",
      "const g = require('h');",
    ].join('\n');
    expect(importsIn(sample).sort()).toEqual(['../b', './a', './d', './e.css', 'electron', 'h', 'node:fs']);
  });
});
