// Writes .expo/types/router.d.ts (typed hrefs) from app/ without starting the dev server, using the same generator
// `expo start` runs. `npm run typecheck` calls it first, so typed routes are checked offline and in CI.
const path = require('node:path');

const root = path.resolve(__dirname, '..');
process.env.EXPO_ROUTER_APP_ROOT = path.join(root, 'app');
const cli = path.dirname(require.resolve('@expo/cli/package.json', { paths: [path.dirname(require.resolve('expo/package.json'))] }));
const generator = require(require.resolve('@expo/router-server/build/typed-routes', { paths: [cli] }));
const out = path.join(root, '.expo', 'types');
require('node:fs').mkdirSync(out, { recursive: true });
generator.regenerateDeclarations(out, {});
