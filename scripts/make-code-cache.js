// Run by scripts/bundle.js (the last step of `npm run build`) in a child
// process, with the command's arguments: runs the bundled command line
// (dist/cli-bundle.cjs) compiled from source, and when the process exits
// writes V8's code cache of every function compiled by then to
// dist/cli-bundle.v8cache (src/cli/code-cache.ts runBundle).
import { runBundle } from '../dist/cli/code-cache.js';

runBundle(new URL('../dist/', import.meta.url), true);
