// What the web build gets for zod's `locales` namespace (see metro.config.js): English only, the one the app uses.
export { default as en } from 'zod/v4/locales/en.js';
