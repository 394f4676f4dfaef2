import { defaultDataDir } from '../../host/data-dir';
import { appVersion } from '../../host/version';
import type { Command } from '../command';

export const infoCommand: Command = {
  path: ['info'],
  summary: 'Version, Node version and the data folder this machine uses',
  usage: '[--json]',
  options: {},
  async run() {
    const facts = { version: appVersion(), node: process.versions.node, platform: process.platform, data_dir: defaultDataDir() };
    return {
      json: facts,
      text: [`Gazeloom ${facts.version}`, `Node ${facts.node} on ${facts.platform}`, `data folder: ${facts.data_dir}`].join('\n'),
    };
  },
};
