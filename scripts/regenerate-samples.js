// npm run samples: regenerate generated-samples/ from examples/ with the built CLI modules.
//
// For every examples/*.yaml, in sorted order, this writes exactly what
//     rootcast emit examples/<file> --target all --out generated-samples/<basename>
// writes (the same filesOfSpec -> writeFiles path),
// after clearing that folder, so a file the emitter no longer writes does not
// linger. Folders for examples that no longer exist are removed too, so
// generated-samples/ holds one folder per example and nothing else
// (test/examples/golden.test.ts checks both directions).
//
// The spec path handed to the planner is the relative `examples/<file>` (the
// script runs from the repository root whatever the current directory is),
// exactly as a user typing the emit command above would give it, so no
// absolute path or machine-specific directory can reach the emitted files.
import { mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { targetsOf } from '../dist/emit/outputs.js';
import { writeFiles } from '../dist/cli/files.js';
import { filesOfSpec } from '../dist/cli/spec-files.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(ROOT);

const EXAMPLES = 'examples';
const SAMPLES = 'generated-samples';

// The float examples, then the fixed32 ones (examples/fixed32/, emitted as `--target all` does: every target the fixed32 row allows).
const specs = [
  ...readdirSync(EXAMPLES)
    .filter((f) => f.endsWith('.yaml'))
    .sort(),
  ...readdirSync(`${EXAMPLES}/fixed32`)
    .filter((f) => f.endsWith('.yaml'))
    .sort()
    .map((f) => `fixed32/${f}`),
];
const wanted = new Set(specs.map((f) => basename(f, '.yaml')));

// Plan and emit everything in memory first: a refusal stops the script before
// anything under generated-samples/ is touched.
const outputs = specs.map((f) => {
  const spec = `${EXAMPLES}/${f}`;
  const files = filesOfSpec(spec, targetsOf('all'));
  return { spec, dir: `${SAMPLES}/${basename(f, '.yaml')}`, files };
});

mkdirSync(SAMPLES, { recursive: true });
for (const entry of readdirSync(SAMPLES, { withFileTypes: true })) {
  if (entry.isDirectory() && !wanted.has(entry.name)) {
    rmSync(join(SAMPLES, entry.name), { recursive: true, force: true });
    console.log(`removed ${SAMPLES}/${entry.name} (no examples/${entry.name}.yaml)`);
  }
}

for (const { spec, dir, files } of outputs) {
  if (statSync(dir, { throwIfNoEntry: false })) rmSync(dir, { recursive: true, force: true });
  writeFiles(dir, files);
  for (const f of files) console.log(`wrote ${dir}/${f.path} (from ${spec})`);
}
