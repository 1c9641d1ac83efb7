// npm run bench:plan-time: cold `rootcast plan` time over the examples and the
// seeded random corpus (bench/corpus/random, written by bench/corpus/generate.js)
// and the hand-written hard cases (bench/corpus/cases).
//
// Each spec is planned in a fresh process, `node dist/cli.js plan SPEC`, as a
// user runs it. Prints the wall-time and CPU-time distribution (median, 95th
// percentile, max), the slowest specs, and how many planned (exit 0), were
// refused (exit 2, one line) or failed otherwise (internal error, a refusal of
// more than one line, or killed at --timeout seconds). Figures, not a timed
// test: the machine's load is printed with them.
//
// With each spec, the planner's work units (src/plan/work.ts, all plans of the
// run) are read from a marker line, and the CPU nanoseconds per unit are
// printed as a distribution: the deterministic work limit bounds CPU only as
// far as that ratio stays in a narrow band.
//
// Each row also keeps a digest of the plan's output (stdout, sha-256), so two
// runs (two builds) can be compared spec by spec with --compare: a speed change
// that must not change any plan or refusal is checked over the whole corpus.
//
//   node bench/plan-time.js [--timeout S] [--only REGEX] [--slowest N] [--json FILE] [--compare FILE]
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';

const arg = (name, dflt) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : dflt;
};
if (process.argv.includes('--help')) {
  console.log(`node bench/plan-time.js [--timeout S] [--cpu-limit S] [--only REGEX] [--slowest N] [--json FILE] [--compare FILE]

Plans every spec of examples/, bench/corpus/cases/ and bench/corpus/random/ in a
fresh process and prints the wall and CPU time distribution, the CPU ns per
work unit, the outcomes and the slowest specs.

  --timeout S    kill a plan after S seconds of wall time (default 30)
  --cpu-limit S  also kill it after S seconds of its own CPU time (ulimit -t):
                 on a shared machine a wall-time limit kills early
  --only REGEX   only the spec paths matching REGEX
  --slowest N    list the N slowest specs (default 8)
  --json FILE    write every row (spec, outcome, wall, cpu, units, message,
                 digest of the plan's output) to FILE
  --compare FILE compare each spec's outcome, message, plan digest and work
                 units with the rows of an earlier --json FILE and list the
                 specs that differ (rows without a digest compare the rest)`);
  process.exit(0);
}
const timeoutS = Number(arg('--timeout', '30'));
const only = new RegExp(arg('--only', '.'));
const slowestN = Number(arg('--slowest', '8'));
const jsonOut = arg('--json', null);
const cpuLimit = arg('--cpu-limit', null);
const compareWith = arg('--compare', null);

const list = (dir) => readdirSync(dir).filter((f) => /\.ya?ml$/.test(f)).sort().map((f) => join(dir, f));
const specs = [...list('examples'), ...list('bench/corpus/cases'), ...list('bench/corpus/random')].filter((s) => only.test(s));

const q = (xs, p) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)] : NaN;
};

console.log(`machine: ${cpus()[0]?.model ?? 'unknown cpu'}, ${cpus().length} cores; node ${process.version}; load ${loadavg().map((l) => l.toFixed(1)).join(' ')}`);
const rows = [];
for (const spec of specs) {
  const t0 = process.hrtime.bigint();
  const argv = ['--import', './bench/cpu-note.js', 'dist/cli.js', 'plan', spec];
  const [cmd, args] = cpuLimit ? ['/bin/sh', ['-c', `ulimit -t ${Number(cpuLimit)}; exec "$0" "$@"`, process.execPath, ...argv]] : [process.execPath, argv];
  const r = spawnSync(cmd, args, {
    encoding: 'utf8',
    timeout: timeoutS * 1000,
    killSignal: 'SIGKILL',
  });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  const cpuLine = /@cpu-ms (\d+)/.exec(r.stderr ?? '');
  // Killed: by ulimit -t (SIGXCPU, or SIGKILL at the hard limit) before the wall timeout, it used the CPU limit.
  const cpuKilled = cpuLimit && r.signal && wall < timeoutS;
  const cpu = cpuLine ? Number(cpuLine[1]) / 1000 : cpuKilled ? Number(cpuLimit) : wall;
  const unitsLine = /@work-units (\d+)/.exec(r.stderr ?? '');
  const units = unitsLine ? Number(unitsLine[1]) : null;
  const message = (r.stderr ?? '').replace(/(\n?@work-units \d+)?\n?@cpu-ms \d+\n$/, '').trim();
  let outcome;
  if (r.status === 0) outcome = 'planned';
  else if (r.status === 2 && message.split('\n').length === 1 && !/internal error/.test(message)) outcome = 'refused';
  else if (r.status === null) outcome = 'timeout';
  else outcome = 'error';
  const digest = createHash('sha256').update(r.stdout ?? '').digest('hex').slice(0, 16);
  rows.push({ spec, outcome, wall, cpu, units, message: outcome === 'planned' ? '' : message.split('\n')[0], digest });
  if (process.stdout.isTTY) process.stdout.write(`\r${rows.length}/${specs.length} ${spec}      `);
}
if (process.stdout.isTTY) process.stdout.write('\n');

const count = (o) => rows.filter((r) => r.outcome === o).length;
console.log(`${rows.length} specs: ${count('planned')} planned, ${count('refused')} refused, ${count('error')} internal errors, ${count('timeout')} killed at ${timeoutS} s wall${cpuLimit ? ` or ${cpuLimit} s CPU` : ''}`);
for (const [label, key] of [['wall', 'wall'], ['cpu', 'cpu']]) {
  const xs = rows.map((r) => r[key]);
  console.log(`${label.padEnd(4)} s: median ${q(xs, 0.5).toFixed(2)}, p95 ${q(xs, 0.95).toFixed(2)}, max ${Math.max(...xs).toFixed(2)}; over 1 s ${xs.filter((x) => x > 1).length}, over 3 s ${xs.filter((x) => x > 3).length}, over 10 s ${xs.filter((x) => x > 10).length}`);
}
// CPU per unit, counting only specs with some work (a refusal by the reader plans nothing).
const perUnit = rows.filter((r) => r.units && r.units > 1e6 && r.outcome !== 'timeout').map((r) => (r.cpu * 1e9) / r.units);
if (perUnit.length) console.log(`cpu ns per work unit (${perUnit.length} specs over 1e6 units): min ${Math.min(...perUnit).toFixed(0)}, median ${q(perUnit, 0.5).toFixed(0)}, p95 ${q(perUnit, 0.95).toFixed(0)}, max ${Math.max(...perUnit).toFixed(0)}`);
const ex = rows.filter((r) => r.spec.startsWith('examples/'));
if (ex.length) console.log(`examples: ${ex.map((r) => `${r.spec.slice(9)} ${r.wall.toFixed(2)} s`).join(', ')}`);
console.log(`slowest ${slowestN} (wall s, cpu s, work units, outcome):`);
for (const r of [...rows].sort((a, b) => b.wall - a.wall).slice(0, slowestN)) {
  console.log(`  ${r.wall.toFixed(2).padStart(6)} ${r.cpu.toFixed(2).padStart(6)} ${r.units === null ? '     -' : (r.units / 1e6).toFixed(0).padStart(5) + 'M'}  ${r.outcome.padEnd(8)} ${r.spec}${r.message ? `  ${r.message.slice(0, 140)}` : ''}`);
}
for (const r of rows.filter((x) => x.outcome === 'error' || x.outcome === 'timeout')) console.log(`  ${r.outcome}: ${r.spec}: ${r.message.slice(0, 160)}`);
if (jsonOut) writeFileSync(jsonOut, JSON.stringify(rows, null, 1));
if (compareWith) {
  const before = new Map(JSON.parse(readFileSync(compareWith, 'utf8')).map((r) => [r.spec, r]));
  const fields = ['outcome', 'message', 'digest', 'units'];
  const differ = [];
  let compared = 0;
  for (const r of rows) {
    const b = before.get(r.spec);
    if (!b) continue;
    compared++;
    const what = fields.filter((f) => b[f] !== undefined && b[f] !== r[f]);
    if (what.length) differ.push(`  ${r.spec}: ${what.map((f) => `${f} ${JSON.stringify(b[f])} -> ${JSON.stringify(r[f])}`).join('; ')}`);
  }
  console.log(`compared with ${compareWith}: ${compared} specs, ${differ.length} differ (outcome, message, plan digest or work units)`);
  for (const d of differ) console.log(d.slice(0, 400));
}
