// What the web build gets for zod's ahead-of-time compiler (`zod/v4/core/compile.js`, see metro.config.js): the app
// never calls z.compile, and zod's parser does not import it, so the web build keeps only its names. About 30 KB of
// minified JavaScript less on every first screen.
export const INVALID = Symbol.for('zod.compile.invalid');
export class ZodCompileAsyncError extends Error {}
export class ZodCompileUnsupportedError extends Error {}
const absent = () => {
  throw new Error('z.compile is not in the web build (metro.config.js)');
};
export const compile = absent;
export const compileFn = absent;
export const withParser = absent;
