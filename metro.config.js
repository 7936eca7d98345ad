// Metro must not crawl the database cluster (owned by another user), uploads or test output.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const config = getDefaultConfig(__dirname);
const ignored = ['.pgdata', '.data', 'uploads', 'test-output', 'dist', '.bench', 'server', 'tests'].map(
  (dir) => new RegExp(`^${path.join(__dirname, dir).replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}\\/.*`),
);
config.resolver.blockList = ignored;

// zod re-exports every one of its ~50 error-message locales as `z.locales` (about 250 KB before compression, loaded
// on the first screen since Metro keeps unused exports). The app uses English only, which zod registers itself, and
// never reads `z.locales`: the web build resolves that namespace to English alone.
const zodLocales = path.join(__dirname, 'scripts/metro/zod-locales-en.js');
const zodV4 = `${path.sep}node_modules${path.sep}zod${path.sep}v4${path.sep}`;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && context.originModulePath.includes(zodV4)) return { type: 'sourceFile', filePath: zodLocales };
  return context.resolveRequest(context, moduleName, platform);
};
config.watchFolders = [__dirname];
module.exports = config;
