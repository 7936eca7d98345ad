// The bare app resolves every package from Carbwright's own node_modules (same versions), and, like the app's own
// metro.config.js, keeps Metro out of the database cluster, uploads, build output and the app's sources.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const repo = path.resolve(__dirname, '../../..');
const config = getDefaultConfig(__dirname);
const escape = (p) => p.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
config.watchFolders = [repo];
config.resolver.nodeModulesPaths = [path.join(repo, 'node_modules')];
config.resolver.blockList = ['.pgdata', '.data', 'uploads', 'test-output', 'dist', '.bench', 'tests', 'app', 'components', 'shared']
  .map((dir) => new RegExp(`^${escape(path.join(repo, dir))}\\/.*`));
module.exports = config;
