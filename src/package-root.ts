/**
 * The package root (where package.json, templates/ and schema/ sit), as a
 * file URL ending in '/'. This file is src/package-root.ts, dist/package-root.js
 * in the per-module build, and part of a chunk directly in dist/ in the bundled
 * command (scripts/bundle.js): all three sit one level below the root, so every
 * path to a shipped file is taken from here and not from the importing
 * module's own place, which bundling changes.
 */
export const PACKAGE_ROOT: URL = new URL('../', import.meta.url);
