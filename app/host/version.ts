import pkg from '../../package.json' with { type: 'json' };

/** The version in package.json, bundled in at build time so every entry point agrees. */
export function appVersion(): string {
  return pkg.version;
}
