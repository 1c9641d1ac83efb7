// The seeded random-spec corpus: node bench/corpus/generate.js [--seed S] [--count N]
//
// Writes bench/corpus/random/NNN.yaml, the specs a planner meets in the field
// rather than the ones it was tuned on: degrees 2 to 6, one to three inputs,
// float32 and float64, absolute and relative accuracy, narrow, wide, tiny,
// huge and subnormal input ranges, targets from loose to just above the
// rounding floor, with and without root.bracket. The parameters are drawn
// with fast-check's seeded sampler, so the same seed and fast-check version
// give the same files; the files are committed so the benchmark
// (bench/plan-time.js) and the property test read a fixed corpus.
//
// Every family is invented. Its shape: the unknown s solves
//     c0 + c1 s + c2 s^2 + ... + cn s^n = 0,
// with c0 = -x (x the first input), c1 near a positive number and the higher
// coefficients scaled to the root scale S so that the nonlinearity over the
// range is a chosen strength; the other inputs perturb c1 and the higher
// coefficients. A bracket, when there is one, is found numerically here from
// the roots on a grid of input points (a bracket that does not hold exactly
// one root everywhere is a spec the planner must refuse, and some are kept).
import { mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';

const HERE = dirname(fileURLToPath(import.meta.url));
const INPUT_NAMES = ['x', 'y', 'z'];

/** Digits of accuracy at the rounding floor (about -log10 u), per arithmetic. */
const FLOOR_DIGITS = { float32: 7.2, float64: 15.9 };

/** The raw draws of one spec. */
export const specParams = fc.record({
  degree: fc.integer({ min: 2, max: 6 }),
  inputs: fc.integer({ min: 1, max: 3 }),
  arithmetic: fc.constantFrom('float32', 'float64'),
  kind: fc.constantFrom('absolute', 'relative'),
  range: fc.constantFrom('unit', 'unit', 'wide', 'narrow', 'offset', 'tiny', 'huge', 'edge'),
  scaleExp: fc.integer({ min: -3, max: 3 }),
  // Integers scaled below: fast-check's doubles favour extremes (denormals, 1 - ulp).
  slope: fc.integer({ min: 25, max: 400 }).map((v) => v / 100),
  strength: fc.constantFrom(0.01, 0.05, 0.2, 0.5, 0.9),
  shape: fc.array(fc.integer({ min: -100, max: 100 }).map((v) => v / 100), { minLength: 7, maxLength: 7 }),
  perturb: fc.array(fc.integer({ min: -30, max: 30 }).map((v) => v / 100), { minLength: 7, maxLength: 7 }),
  spread: fc.constantFrom(0.01, 0.1, 0.3),
  // 0 = loose (a few digits) .. 1 = at the rounding floor.
  tightness: fc.constantFrom(0.2, 0.4, 0.6, 0.8, 0.9, 0.97),
  bracket: fc.constantFrom('none', 'fit', 'fit', 'loose', 'bad'),
  edge: fc.integer({ min: 0, max: 5 }),
});

const num = (v) => {
  if (v === 0) return '0';
  const a = Math.abs(v);
  const t = a >= 1e-3 && a < 1e6 ? String(Number(a.toPrecision(4))) : a.toExponential(3).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return t;
};
const signed = (v) => (v < 0 ? `- ${num(-v)}` : `+ ${num(v)}`);
const lead = (v) => (v < 0 ? `-${num(-v)}` : num(v));

/** The edge ranges of issue-style hard cases: beyond float32, tiny, subnormal. */
const EDGES = [
  { lo: 0, hi: 1e39, arithmetic: 'float32' },
  { lo: 1e-37, hi: 2e-37, arithmetic: 'float32' },
  { lo: 0, hi: 1e-40, arithmetic: 'float32' },
  { lo: 0, hi: 1e-320, arithmetic: 'float64' },
  { lo: 1e300, hi: 1e301, arithmetic: 'float64' },
  { lo: 1e-300, hi: 3e-300, arithmetic: 'float64' },
];

/** One spec (its YAML text) from the draws; `name` is the function name. */
export function specOf(p, name) {
  let arithmetic = p.arithmetic;
  let S = 10 ** p.scaleExp;
  let xlo;
  let xhi;
  const X = S * p.slope;
  switch (p.range) {
    case 'unit': xlo = p.kind === 'relative' ? X / 10 : 0; xhi = X; break;
    case 'wide': xlo = p.kind === 'relative' ? X * 1e-4 : -X; xhi = X; break;
    case 'narrow': xlo = X; xhi = X * 1.001; break;
    case 'offset': xlo = X / 2; xhi = X; break;
    case 'tiny': S = 10 ** (p.scaleExp - 30); xlo = p.kind === 'relative' ? (S * p.slope) / 4 : 0; xhi = S * p.slope; break;
    case 'huge': S = 10 ** (p.scaleExp + 25); xlo = (S * p.slope) / 4; xhi = S * p.slope; break;
    case 'edge': {
      const e = EDGES[p.edge];
      arithmetic = e.arithmetic;
      xlo = e.lo;
      xhi = e.hi;
      S = (e.hi || 1) / p.slope;
      break;
    }
  }
  const n = p.degree;
  const extra = INPUT_NAMES.slice(1, p.inputs);
  const ranges = { x: [xlo, xhi] };
  extra.forEach((v, i) => {
    const c = 1 + p.perturb[i] ;
    ranges[v] = [c * (1 - p.spread), c * (1 + p.spread)];
  });
  // c_k = a_k / S^(k-1) (times an input for some k): over s in [0, S] the term
  // c_k s^k is about strength * a_k * S, next to c1 s about slope * S.
  const coef = {};
  coef[0] = '-x';
  const c1 = p.slope;
  coef[1] = extra.length > 0 ? `${lead(c1)} * ${extra[0]}` : lead(c1);
  const values = { 0: (pt) => -pt.x, 1: (pt) => c1 * (extra.length > 0 ? pt[extra[0]] : 1) };
  for (let k = 2; k <= n; k++) {
    const a = (p.strength * p.shape[k]) / k;
    const ck = k === n && Math.abs(a) < 1e-3 ? 1e-3 : a;
    const scaled = ck / S ** (k - 1);
    if (!Number.isFinite(scaled) || scaled === 0) continue;
    const v = extra.length > 1 && k % 2 === 0 ? extra[1] : extra.length > 0 && k === n ? extra[0] : null;
    coef[k] = v ? `${lead(scaled)} * ${v}` : lead(scaled);
    values[k] = (pt) => scaled * (v ? pt[v] : 1);
  }
  if (coef[n] === undefined) {
    coef[n] = lead(1e-3);
    values[n] = () => 1e-3;
  }

  // Roots on a grid of input points: the one nearest the linear estimate x / c1.
  const points = gridPoints(ranges);
  const roots = points.map((pt) => nearRoot((s) => polyAt(values, n, pt, s), (pt.x || 0) / values[1](pt), S));
  let bracket = null;
  if (p.bracket !== 'none' && roots.every((r) => r !== null)) {
    const lo = Math.min(...roots);
    const hi = Math.max(...roots);
    const margin = p.bracket === 'loose' ? 0.5 * (hi - lo) + 0.5 * S : 0.05 * (hi - lo) + 0.02 * S;
    bracket = p.bracket === 'bad' ? [lo + 0.3 * (hi - lo) + 0.01 * S, hi + margin] : [lo - margin, hi + margin];
  }
  const scale = Math.max(...roots.filter((r) => r !== null).map(Math.abs), Math.abs(S) * 1e-300);
  const digits = 2 + p.tightness * (FLOOR_DIGITS[arithmetic] - 2);
  const rel = 10 ** -digits;
  const target = p.kind === 'relative' ? rel : rel * scale;

  const lines = [
    `# Random spec ${name} (bench/corpus/generate.js): ${p.range} range, ${p.inputs} input(s), nonlinearity ${p.strength}, bracket ${p.bracket}, tightness ${p.tightness}`,
    `function: ${name}`,
    'unknown: s',
    `degree: ${n}`,
    'coefficients:',
    ...Object.keys(coef).map((k) => `  ${k}: ${coef[k]}`),
    'inputs:',
    ...Object.entries(ranges).map(([v, [lo, hi]]) => `  ${v}: [${lead(lo)}, ${lead(hi)}]`),
  ];
  if (bracket) lines.push('root:', `  bracket: [${lead(bracket[0])}, ${lead(bracket[1])}]`);
  lines.push('accuracy:', `  ${p.kind}: ${num(Number(target.toPrecision(2)))}`, `arithmetic: ${arithmetic}`, '');
  return lines.join('\n');
}

function polyAt(values, n, pt, s) {
  let acc = 0;
  for (let k = n; k >= 0; k--) acc = acc * s + (values[k] ? values[k](pt) : 0);
  return acc;
}

/** Corners and centre of the box, and three points per input between. */
function gridPoints(ranges) {
  let pts = [{}];
  for (const [v, [lo, hi]] of Object.entries(ranges)) {
    const vals = [lo, lo + (hi - lo) / 4, lo + (hi - lo) / 2, lo + (3 * (hi - lo)) / 4, hi];
    pts = pts.flatMap((pt) => vals.map((x) => ({ ...pt, [v]: x })));
  }
  return pts;
}

/** The real root nearest `guess` within +-8 S of it (scan and bisect), or null. */
function nearRoot(f, guess, S) {
  const N = 4000;
  const lo = guess - 8 * Math.abs(S);
  const h = (16 * Math.abs(S)) / N;
  let best = null;
  let prev = f(lo);
  for (let i = 1; i <= N; i++) {
    const b = lo + i * h;
    const fb = f(b);
    if (prev === 0 || Math.sign(prev) !== Math.sign(fb)) {
      let a0 = b - h;
      let b0 = b;
      for (let j = 0; j < 200; j++) {
        const m = a0 + (b0 - a0) / 2;
        if (m <= a0 || m >= b0) break;
        if (Math.sign(f(m)) === Math.sign(f(a0))) a0 = m;
        else b0 = m;
      }
      const r = a0 + (b0 - a0) / 2;
      if (best === null || Math.abs(r - guess) < Math.abs(best - guess)) best = r;
    }
    prev = fb;
  }
  return best !== null && Number.isFinite(best) ? best : null;
}

export const DEFAULT_SEED = 20261202;
export const DEFAULT_COUNT = 320;

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const arg = (name, dflt) => {
    const i = process.argv.indexOf(name);
    return i > 0 ? Number(process.argv[i + 1]) : dflt;
  };
  const seed = arg('--seed', DEFAULT_SEED);
  const count = arg('--count', DEFAULT_COUNT);
  const dir = join(HERE, 'random');
  mkdirSync(dir, { recursive: true });
  for (const f of readdirSync(dir)) if (f.endsWith('.yaml')) rmSync(join(dir, f));
  const draws = fc.sample(specParams, { seed, numRuns: count });
  draws.forEach((p, i) => {
    const id = String(i).padStart(3, '0');
    writeFileSync(join(dir, `${id}.yaml`), specOf(p, `random_${id}`));
  });
  console.log(`wrote ${count} specs to ${dir} (seed ${seed})`);
}
