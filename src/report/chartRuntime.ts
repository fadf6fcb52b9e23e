/**
 * vega and vega-lite, in one module so that the build puts them in one chunk of their own
 * (scripts/build.mjs: code splitting). renderPage.ts loads it with `import()` only when a chart is
 * written, and the CLI starts loading it while a sweep computes (src/commands.ts).
 */
export { compile } from 'vega-lite';
export { parse, View } from 'vega';
