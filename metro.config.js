// Metro must not crawl the database cluster (owned by another user), uploads or test output.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const config = getDefaultConfig(__dirname);
const ignored = ['.pgdata', '.data', 'uploads', 'test-output', 'dist', '.bench', 'server', 'tests'].map(
  (dir) => new RegExp(`^${path.join(__dirname, dir).replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}\\/.*`),
);
config.resolver.blockList = ignored;
config.watchFolders = [__dirname];
module.exports = config;
