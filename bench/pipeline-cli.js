// node bench/pipeline-cli.js [REPEATS]: whole-process times of the CLI as a
// build pipeline calls it, and the ratios issue 13 sets goals for:
//   emit --check on an up-to-date folder  vs  rootcast --version   (goal <= 2.5)
//   emit --target c                        vs  plan                 (goal <= 1.3)
// Each command runs REPEATS times (default 5) as `node dist/cli.js ...`; the
// median wall time is reported. Figures, not a timed test: a busy machine
// moves them, so read them with the load average printed beside them.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';

const REPEATS = Number(process.argv[2] ?? 5);
const CLI = 'dist/cli.js';
const out = mkdtempSync(join(tmpdir(), 'rootcast-bench-'));
const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

function timed(args) {
  const ms = [];
  for (let i = 0; i < REPEATS; i++) {
    const t = process.hrtime.bigint();
    const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8' });
    ms.push(Number(process.hrtime.bigint() - t) / 1e6);
    if (r.status !== 0) throw new Error(`rootcast ${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  }
  return median(ms);
}

console.log(`machine: ${cpus()[0]?.model ?? 'unknown cpu'}, ${cpus().length} cores; node ${process.version}; load ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
console.log(`median of ${REPEATS} runs, wall ms`);
console.log('example                 --version  check  ratio   plan   emit c  ratio');
const version = timed(['--version']);
for (const example of ['spring-scale', 'kiln-probe', 'lens-undistort', 'gas-wide']) {
  const spec = `examples/${example}.yaml`;
  const dir = join(out, example);
  spawnSync(process.execPath, [CLI, 'emit', spec, '--out', dir], { encoding: 'utf8' });
  const check = timed(['emit', spec, '--out', dir, '--check']);
  const plan = timed(['plan', spec]);
  const emitC = timed(['emit', spec, '--target', 'c', '--out', join(dir, 'c')]);
  console.log(
    `${example.padEnd(22)} ${version.toFixed(0).padStart(9)} ${check.toFixed(0).padStart(6)} ${(check / version).toFixed(2).padStart(6)} ${plan.toFixed(0).padStart(6)} ${emitC.toFixed(0).padStart(8)} ${(emitC / plan).toFixed(2).padStart(6)}`,
  );
}
rmSync(out, { recursive: true, force: true });
