// npm run bench:tight-bounds: how close the certified bound is to the measured
// error (bound / measured) on the examples, the tight-enclosure fixtures
// (test/fixtures/tight) and the multi-input specs of the seeded random corpus
// (bench/corpus/random), with the plan time of each.
//
// Each spec is planned and checked in a fresh process (the in-process check of
// src/verify/inprocess.ts: exact bisection at corners, a grid, seeded random
// points and the segment edges). `--dist DIR` runs another build (for example
// a build of main before a change) so that two builds can be compared on the
// same specs. Figures, not a timed test: the machine and its load are printed.
//
//   node bench/tight-bounds.js [--dist DIR] [--samples N] [--timeout S] [--only REGEX] [--max N] [--json FILE]
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const arg = (name, dflt) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : dflt;
};
const dist = resolve(arg('--dist', 'dist'));
const samples = Number(arg('--samples', '300'));

if (process.argv.includes('--one')) {
  // Child: plan one spec and measure it; print one JSON line.
  const spec = arg('--one');
  const load = (p) => import(pathToFileURL(join(dist, p)).href);
  const [{ readSpec }, { makePlan }, { emitInputOf }, { checkInProcess }] = await Promise.all([
    load('reader/read.js').catch(() => load('spec/read.js')),
    load('plan/plan.js'),
    load('cli/pipeline.js'),
    load('verify/inprocess.js'),
  ]);
  const t0 = process.hrtime.bigint();
  const c0 = process.cpuUsage();
  const cpuS = () => {
    const c = process.cpuUsage(c0);
    return (c.user + c.system) / 1e6;
  };
  let out;
  try {
    const plan = makePlan(readSpec(spec, readFileSync(spec, 'utf8')));
    const planS = Number(process.hrtime.bigint() - t0) / 1e9;
    const planCpuS = cpuS();
    const s = checkInProcess(emitInputOf(plan), { samples, seed: 1 });
    const ops = plan.ops;
    out = { spec, outcome: 'planned', planS, bound: s.bound, measured: s.worstError, target: s.targetAccuracy, ops: ops.add + ops.mul + ops.div, form: plan.form, order: plan.order, steps: plan.steps, planCpuS };
  } catch (e) {
    out = { spec, outcome: e?.name === 'RootcastError' ? 'refused' : 'error', planS: Number(process.hrtime.bigint() - t0) / 1e9, message: String(e?.message ?? e).split('\n')[0] };
  }
  process.stdout.write(JSON.stringify(out) + '\n');
  process.exit(0);
}

const timeoutS = Number(arg('--timeout', '120'));
const only = new RegExp(arg('--only', '.'));
const max = Number(arg('--max', '1000000'));
const jsonOut = arg('--json', null);

const list = (dir) => readdirSync(dir).filter((f) => /\.ya?ml$/.test(f)).sort().map((f) => join(dir, f));
/** Specs with two or more inputs (the ones the dependency problem hits). */
const multiInput = (file) => {
  const m = /\ninputs:\n((?: {2}.*\n)+)/.exec(readFileSync(file, 'utf8'));
  return m ? m[1].split('\n').filter((l) => /^ {2}\w+:/.test(l)).length >= 2 : false;
};
const corpus = list('bench/corpus/random').filter(multiInput).slice(0, max);
const specs = [...list('examples'), ...list('test/fixtures/tight'), ...corpus].filter((s) => only.test(s));

console.log(`machine: ${cpus()[0]?.model ?? 'unknown cpu'}, ${cpus().length} cores; node ${process.version}; load ${loadavg().map((l) => l.toFixed(1)).join(' ')}`);
console.log(`build: ${dist}; ${samples} sample points per spec (plus corners and segment edges)`);
const rows = [];
for (const spec of specs) {
  const r = spawnSync(process.execPath, [process.argv[1], '--one', spec, '--dist', dist, '--samples', String(samples)], {
    encoding: 'utf8',
    timeout: timeoutS * 1000,
    killSignal: 'SIGKILL',
  });
  const line = (r.stdout ?? '').trim().split('\n').pop();
  const row = r.status === 0 && line ? JSON.parse(line) : { spec, outcome: r.status === null ? 'timeout' : 'error', message: (r.stderr ?? '').split('\n')[0] };
  rows.push(row);
  const ratio = row.outcome === 'planned' ? (row.measured > 0 ? (row.bound / row.measured).toFixed(2) : 'inf') : row.outcome;
  const extra = row.outcome === 'planned' ? `bound ${row.bound.toExponential(2)} measured ${row.measured.toExponential(2)} ops ${row.ops} plan ${row.planS.toFixed(1)} s wall, ${row.planCpuS.toFixed(1)} s cpu` : (row.message ?? '');
  console.log(`${spec.padEnd(40)} ${String(ratio).padStart(8)}  ${extra}`);
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? (s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2) : NaN;
};
const ratios = (pred) => rows.filter((r) => r.outcome === 'planned' && r.measured > 0 && pred(r.spec)).map((r) => r.bound / r.measured);
for (const [label, pred] of [
  ['examples', (s) => s.startsWith('examples/')],
  ['tight fixtures', (s) => s.startsWith('test/fixtures/tight/')],
  ['corpus (multi-input)', (s) => s.startsWith('bench/corpus/')],
]) {
  const r = ratios(pred);
  const n = rows.filter((x) => pred(x.spec)).length;
  console.log(`${label}: ${r.length} of ${n} planned; median bound/measured ${median(r).toFixed(2)}, max ${r.length ? Math.max(...r).toFixed(2) : '-'}`);
}
if (jsonOut) writeFileSync(jsonOut, JSON.stringify(rows, null, 2) + '\n');
