#!/usr/bin/env node
/**
 * The `rootcast` command as installed (dist/cli.js, bundled by
 * scripts/bundle.js): runs the bundled command line (dist/cli-bundle.cjs,
 * built from src/cli.ts) from V8's code cache when it fits
 * (src/cli/code-cache.ts). Without esbuild the build keeps tsc's per-module
 * dist/cli.js (src/cli.ts) instead, which does the same work uncached.
 */
import { runBundle } from './cli/code-cache.js';

runBundle(new URL('./', import.meta.url));
