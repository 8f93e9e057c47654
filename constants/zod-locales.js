// Web bundle shim: zod re-exports all ~60 locales through `locales/index`, and Metro does not
// tree-shake `export * as`. Fieldfile speaks English only, so metro.config.js points that index
// here. The messages users see come from our own schemas anyway.
export { default as en } from 'zod/v4/locales/en.js';
