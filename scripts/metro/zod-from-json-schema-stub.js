// What the web build gets for zod's `fromJSONSchema` (see metro.config.js): the app never builds a schema from JSON
// Schema; the shared schemas are written in zod. About 12 KB of minified JavaScript less on every first screen.
export function fromJSONSchema() {
  throw new Error('z.fromJSONSchema is not in the web build (metro.config.js)');
}
