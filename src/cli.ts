#!/usr/bin/env node
/** Entry point of the `rootcast` command. */
import { setFlagsFromString } from 'node:v8';
import { main } from './cli/main.js';
import { JIT } from './plan/tuning.js';

// Before any planning: V8 optimises a function later, so fewer of the planner's
// functions are compiled and recompiled on the worker threads (src/plan/tuning.ts JIT).
setFlagsFromString(`--interrupt-budget=${JIT.interruptBudget}`);

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    // A bug, not a user error: say so in one line and exit 2 (no stack trace unless asked).
    const detail = e instanceof Error ? e.message : String(e);
    process.stderr.write(`rootcast: internal error: ${detail} (please report it; set ROOTCAST_DEBUG=1 for details)\n`);
    if (process.env['ROOTCAST_DEBUG']) process.stderr.write(`${e instanceof Error ? e.stack : ''}\n`);
    process.exitCode = 2;
  },
);
