// npm run bench, second part: the emitted function against what a developer
// would write by hand (closed form with libm, fixed-step Newton, bisection),
// one C program per example compiled at -O2 (bench/driver.c plus
// bench/alternatives/<example>.c). For each method: worst error over the same
// sample points against the exact reference, median ns per call, the spread of
// executed instructions per call (callgrind), conditional branches and calls
// (objdump), and the time ratio to the emitted function. Writes bench/RESULTS.md.
//
// Reference roots: src/verify/measure.ts makeMeasurer (exact bisection on the
// polynomial of the inputs as received), passed to C as double-double.
// Newton: the smallest step count whose worst error over the points is no
// larger than the emitted function's measured worst error; start: the root
// at the box centre (the best fixed start a developer could pick).
// Bisection: until the bracket is narrower than twice that same error.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { emitInputOf, planSpec } from '../dist/cli/pipeline.js';
import { cFunction } from '../dist/emit/c/function.js';
import { evaluate } from '../dist/ir/evaluate.js';
import { roundNumber } from '../dist/family/arithmetic.js';
import { countBranches } from '../dist/verify/branches.js';
import { fractionOfNumber, subFractions, toRational } from '../dist/verify/fraction.js';
import { makeMeasurer } from '../dist/verify/measure.js';
import { inputBox, samplePoints } from '../dist/verify/samples.js';

const POINTS = Number(process.env.ROOTCAST_BENCH_POINTS ?? 1000);
const CALLS = 1e6;
const work = mkdtempSync(join(tmpdir(), 'rootcast-bench-'));
const d17 = (x) => (Object.is(x, -0) ? '-0' : x.toPrecision(17));
const sh = (cmd, args, opts = {}) => execFileSync(cmd, args, { encoding: 'utf8', maxBuffer: 1 << 28, ...opts });

function machine() {
  const cpu = /model name\s*:\s*(.*)/.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1] ?? 'unknown cpu';
  const cores = sh('nproc', []).trim();
  const gcc = sh('gcc', ['--version']).split('\n')[0];
  const load = readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
  return { cpu, cores, gcc, load, date: new Date().toISOString().slice(0, 10) };
}

function prepare(spec) {
  const input = emitInputOf(planSpec(spec));
  const { family, program, claims } = input;
  const header = cFunction(input);
  const box = inputBox(family);
  const points = samplePoints(box, POINTS, 1, program.arithmetic);
  const measure = makeMeasurer(family, claims.absoluteBound);
  const relative = claims.bound.kind === 'relative';
  let worst = 0;
  let minRoot = Infinity;
  const lines = points.map((p) => {
    const m = measure(evaluate(program, p), p);
    if (m.kind !== 'measured') throw new Error(`${spec}: the reference failed at ${p.join(', ')} (${m.kind})`);
    const hi = toRational(m.reference).toNumber();
    const lo = toRational(subFractions(m.reference, fractionOfNumber(hi))).toNumber();
    worst = Math.max(worst, relative ? m.relative : m.absolute);
    minRoot = Math.min(minRoot, Math.abs(hi));
    return [...p.map(d17), d17(hi), d17(lo)].join(' ');
  });
  const centre = box.map((b) => roundNumber((b.lo + b.hi) / 2, program.arithmetic));
  return {
    spec,
    name: family.functionName,
    family,
    program,
    header,
    lines,
    relative,
    worst,
    tolerance: relative ? worst * minRoot : worst,
    start: evaluate(program, centre),
  };
}

function compile(ex, dir, newtonSteps) {
  const defines = [
    `-DRC_ALTERNATIVES="${alternativesFile(ex.spec)}"`,
    `-DRC_HEADER="${join(dir, ex.header.path)}"`,
    `-DRC_START=${d17(ex.start)}`,
    `-DNEWTON_STEPS=${newtonSteps}`,
    `-DBISECT_TOL=${d17(ex.tolerance)}`,
    ...Object.entries(ex.family.constants).map(([k, v]) => `-DRC_CONST_${k}=${v}`),
    ...(ex.family.bracket ? [`-DRC_BRACKET_LO=${ex.family.bracket[0]}`, `-DRC_BRACKET_HI=${ex.family.bracket[1]}`] : []),
  ];
  const exe = join(dir, 'bench');
  sh('gcc', ['-std=c99', '-O2', '-Wall', '-Wextra', ...defines, '-o', exe, resolve('bench/driver.c'), '-lm']);
  return exe;
}

function errors(exe, data) {
  const out = sh(exe, ['errors', data]);
  const methods = new Map([...out.matchAll(/^method (\w+) (\S+)$/gm)].map((m) => [m[1], Number(m[2])]));
  const steps = [...out.matchAll(/^newton_steps (\d+) (\S+)$/gm)].map((m) => [Number(m[1]), Number(m[2])]);
  return { methods, steps };
}

function perCallInstructions(exe, data, method, dir) {
  const out = join(dir, `cg.${method}`);
  const fn = `m_${method}`;
  spawnSync('valgrind', ['--tool=callgrind', '--dump-instr=no', '--collect-atstart=no', `--toggle-collect=${fn}`, `--dump-after=${fn}`, '--combine-dumps=yes', `--callgrind-out-file=${out}`, exe, 'calls', data, method], { encoding: 'utf8' });
  const totals = [...readFileSync(out, 'utf8').matchAll(/^totals: (\d+)$/gm)].map((m) => Number(m[1]));
  totals.pop(); // the part after the last call (program exit) is empty
  return { min: Math.min(...totals), max: Math.max(...totals), calls: totals.length };
}

function alternativesFile(spec) {
  return resolve('bench/alternatives', `${spec.split('/').pop().replace(/\.yaml$/, '')}.c`);
}

function benchExample(spec) {
  const ex = prepare(spec);
  const dir = join(work, ex.name);
  sh('mkdir', ['-p', dir]);
  writeFileSync(join(dir, ex.header.path), ex.header.text);
  const data = join(dir, 'points.txt');
  writeFileSync(data, ex.lines.join('\n') + '\n');
  const search = errors(compile(ex, dir, 1), data);
  const enough = search.steps.find(([, e]) => e <= ex.worst);
  const best = search.steps.reduce((a, b) => (b[1] < a[1] ? b : a));
  const newtonSteps = enough ? enough[0] : best[0];
  const exe = compile(ex, dir, newtonSteps);
  const final = errors(exe, data);
  const reps = Math.ceil(CALLS / ex.lines.length);
  const times = new Map(
    [...sh(exe, ['time', data, String(reps)]).matchAll(/^time (\w+) (\S+) (\S+) (\d+)$/gm)].map((m) => [m[1], { ns: Number(m[2]), latency: Number(m[3]), calls: Number(m[4]) }]),
  );
  const dump = sh('objdump', ['-d', '--no-show-raw-insn', exe]);
  const rows = [...final.methods.keys()].map((method) => ({
    method,
    error: final.methods.get(method),
    ns: times.get(method).ns,
    latency: times.get(method).latency,
    calls: times.get(method).calls,
    instructions: perCallInstructions(exe, data, method, dir),
    branches: countBranches(dump, `m_${method}`, 'x86-64'),
  }));
  return { ex, rows, newtonSteps, newtonReached: Boolean(enough), inProcessWorst: ex.worst };
}

const LABEL = { emitted: 'emitted (rootcast)', closed_form: 'closed form, libm', newton: 'Newton, fixed steps', bisection: 'bisection' };
const sci = (x) => (x === 0 ? '0' : x.toExponential(1));

function table(result) {
  const { ex, rows, newtonSteps } = result;
  const emitted = rows.find((r) => r.method === 'emitted');
  const out = [
    `### ${ex.spec} (${ex.name}: degree ${ex.family.degree}, ${ex.family.inputs.length} input${ex.family.inputs.length > 1 ? 's' : ''}, ${ex.program.arithmetic}, ${ex.relative ? 'relative' : 'absolute'} error)`,
    '',
    '| method | worst error | ns per call | time / emitted | ns per dependent call | time / emitted | instructions per call (min-max) | conditional branches | calls |',
    '|---|---|---|---|---|---|---|---|---|',
  ];
  for (const r of rows) {
    const name = r.method === 'newton' ? `${LABEL.newton} (${newtonSteps})` : r.method === 'bisection' ? `${LABEL.bisection} (tol ${sci(ex.tolerance)})` : LABEL[r.method];
    const spread = r.instructions.min === r.instructions.max ? `${r.instructions.min} (no spread)` : `${r.instructions.min}-${r.instructions.max}`;
    out.push(`| ${name} | ${sci(r.error)} | ${r.ns.toFixed(2)} | ${(r.ns / emitted.ns).toFixed(2)} | ${r.latency.toFixed(2)} | ${(r.latency / emitted.latency).toFixed(2)} | ${spread} | ${r.branches.conditionalBranches} | ${r.branches.calls} |`);
  }
  if (!rows.some((r) => r.method === 'closed_form')) out.push('', 'No closed form: a general quintic has no solution in radicals (Abel-Ruffini), so only Newton and bisection are compared.');
  if (!result.newtonReached) out.push('', `Newton never reached the emitted function's worst error ${sci(ex.worst)} within 40 steps; the row shows the step count with its smallest worst error.`);
  return out.join('\n');
}

const m = machine();
const specs = readdirSync('examples').filter((f) => f.endsWith('.yaml')).sort().map((f) => `examples/${f}`);
const results = [];
const skipped = [];
try {
  for (const spec of specs) {
    if (!existsSync(alternativesFile(spec))) {
      skipped.push(spec);
      console.log(`${spec}: no hand-written alternatives in bench/alternatives/ yet; skipped`);
      continue;
    }
    const r = benchExample(spec);
    results.push(r);
    console.log(table(r));
    console.log('');
  }
} finally {
  rmSync(work, { recursive: true, force: true });
}
const intro = [
  '# Benchmark: the emitted function against the usual alternatives',
  '',
  `Machine: ${m.cpu}, ${m.cores} cores (load average ${m.load} when the run started); compiler: ${m.gcc}; date: ${m.date}.`,
  `Written by \`npm run bench\` (bench/alternatives.js, bench/driver.c, bench/alternatives/*.c). ${POINTS} sample points per example`,
  '(src/verify/samples.ts: every corner, a grid over the box, seeded random points; seed 1), the same points for every method.',
  '',
  'How each column is measured:',
  '- worst error: against the exact reference root of each point (src/verify/measure.ts, exact bisection), in the spec\'s kind;',
  '- ns per call: gcc -std=c99 -O2, each method an extern noinline function called through a volatile function pointer',
  `  (no inlining, no vectorisation); thread CPU time, median of 11 runs of >= ${CALLS.toExponential(0)} calls each;`,
  '  "ns per call": independent calls (throughput; the processor overlaps them); "ns per dependent call": each input waits',
  '  for the previous result (latency, as in a control loop); both include the same call and loop overhead for every method;',
  '- instructions per call: valgrind --tool=callgrind --collect-atstart=no --toggle-collect=FN --dump-after=FN --combine-dumps=yes,',
  '  one count per call on every sample point (callees such as libm included), min and max;',
  '- conditional branches and calls: objdump -d of the function itself (src/verify/branches.ts), libm internals not included;',
  '- Newton: fixed step count, the smallest whose worst error is no larger than the emitted function\'s, from a fixed start',
  '  (the root at the box centre); bisection: on the spec\'s bracket until narrower than twice that error.',
  '',
];
// The goals of issue 5, computed from this run: on degree <= 3, the emitted function at most
// 0.5x the closed form's time and at most 0.7x fixed-step Newton's.
function goals() {
  const out = ['## Goals on degree <= 3 (from this run)', ''];
  out.push('| example | emitted / closed form (independent, dependent calls) | goal <= 0.5 | emitted / Newton (independent, dependent) | goal <= 0.7 |');
  out.push('|---|---|---|---|---|');
  for (const { ex, rows, newtonReached } of results.filter((r) => r.ex.family.degree <= 3)) {
    const e = rows.find((r) => r.method === 'emitted');
    const c = rows.find((r) => r.method === 'closed_form');
    const n = rows.find((r) => r.method === 'newton');
    const pair = (o) => (o ? [e.ns / o.ns, e.latency / o.latency] : null);
    const pc = pair(c);
    const pn = pair(n);
    const text = (p) => (p ? `${p[0].toFixed(2)}, ${p[1].toFixed(2)}` : 'n/a');
    const met = (p, g) => (p ? (p[0] <= g && p[1] <= g ? 'met' : p[0] <= g || p[1] <= g ? 'met for one of the two' : 'missed') : 'n/a');
    const newtonGoal = newtonReached ? met(pn, 0.7) : 'n/a: Newton from a fixed start never reaches the error';
    out.push(`| ${ex.spec} | ${text(pc)} | ${met(pc, 0.5)} | ${text(pn)} | ${newtonGoal} |`);
  }
  out.push('');
  return out;
}

const skippedNote = skipped.length === 0 ? [] : [`Not benchmarked (no hand-written alternatives in bench/alternatives/ yet): ${skipped.join(', ')}.`, ''];
writeFileSync('bench/RESULTS.md', [...intro, ...results.map(table).flatMap((t) => [t, '']), ...goals(), ...skippedNote].join('\n'));
console.log('wrote bench/RESULTS.md');
