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
// never reads `z.locales`: the web build resolves that namespace to English alone. Likewise zod's ahead-of-time
// compiler (`z.compile`) and `z.fromJSONSchema`, which only zod's barrel re-exports and the app never calls, resolve to
// stubs that keep their names (about 42 KB). The server and the tests use the real modules.
const zodV4 = `${path.sep}node_modules${path.sep}zod${path.sep}v4${path.sep}`;
const zodStubs = {
  '../locales/index.js': 'scripts/metro/zod-locales-en.js',
  './compile.js': 'scripts/metro/zod-compile-stub.js',
  './from-json-schema.js': 'scripts/metro/zod-from-json-schema-stub.js',
};
config.resolver.resolveRequest = (context, moduleName, platform) => {
  const stub = zodStubs[moduleName];
  if (stub && context.originModulePath.includes(zodV4)) return { type: 'sourceFile', filePath: path.join(__dirname, stub) };
  return context.resolveRequest(context, moduleName, platform);
};
config.watchFolders = [__dirname];
module.exports = config;
