// npm run bench:segments: for each segmented example (examples/*.yaml whose
// chosen plan has segments) and the landing-time fixture
// (test/fixtures/segments/landing-time.yaml), the table bytes and ops of the
// best plan with equal segments beside the chosen layout (two-level or
// equal), as the planner weighed them (issue 11, item 6).
//
// "Best equal" is what the planner would choose among its equal-segment
// candidates alone: the fewest table bytes among those within the flash-
// frugal cost slack of the cheapest (segment-search.ts frugalChoice). When
// no equal layout fits plan.max_table_bytes, the spec is planned again with
// the limit doubled (up to 64 KB) and the row says so. Figures, not a timed
// test; no clock is read.
//
//   node bench/segments.js [--only REGEX]
import { readdirSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';

const { loadSpec } = await import('../dist/reader/load.js');
const { makePlan } = await import('../dist/plan/plan.js');
const { REFINE } = await import('../dist/plan/tuning.js');

const arg = (name, dflt) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : dflt;
};
const only = new RegExp(arg('--only', '.'));

const specs = [
  ...readdirSync('examples').filter((f) => f.endsWith('.yaml')).sort().map((f) => `examples/${f}`),
  'test/fixtures/segments/landing-time.yaml',
].filter((s) => only.test(s));

const ops = (o) => (o ? `${o.add} add, ${o.mul} mul, ${o.div} div, ${o.tableReads} reads, ${o.intOps} int` : '-');
const layout = (k) => `${k.counts.join('x')}${k.coarseCells ? ` two-level (${k.coarseCells.map((c) => c ?? '=').join('x')} coarse)` : ' equal'}`;

/** The planner's frugal choice among equal-segment candidates, or null. */
function bestEqual(candidates) {
  const equal = candidates.filter((k) => k.refusal === null && k.coarseCells === null && k.counts.some((n) => n > 1));
  if (equal.length === 0) return null;
  const cheapest = Math.min(...equal.map((k) => k.cost));
  const near = equal.filter((k) => k.cost <= cheapest * (1 + REFINE.costSlack));
  return near.reduce((a, b) => (b.tableBytes < a.tableBytes || (b.tableBytes === a.tableBytes && b.cost < a.cost) ? b : a));
}

console.log(`segment layouts: equal segments beside the chosen layout (${cpus()[0]?.model ?? 'unknown cpu'}, ${cpus().length} cores, load ${loadavg().map((l) => l.toFixed(1)).join(' ')})`);
for (const spec of specs) {
  const family = loadSpec(spec);
  if (family.fixed) continue;
  let plan;
  try {
    plan = makePlan(family);
  } catch (e) {
    console.log(`\n${spec}: refused: ${e.message}`);
    continue;
  }
  if (plan.counts.every((n) => n === 1)) continue;
  const chosen = plan.candidates.find((k) => k.chosen);
  let equal = bestEqual(plan.candidates);
  let limit = family.plan.maxTableBytes;
  while (!equal && limit < 65536) {
    limit *= 2;
    try {
      equal = bestEqual(makePlan({ ...family, plan: { ...family.plan, maxTableBytes: limit } }).candidates);
    } catch {
      equal = null;
    }
  }
  console.log(`\n${spec} (${family.arithmetic}, ${family.accuracy.kind} ${family.accuracy.value.text ?? family.accuracy.value}, max_table_bytes ${family.plan.maxTableBytes})`);
  const rows = [
    ['chosen', layout(chosen), String(chosen.tableBytes), `order ${chosen.order}, ${chosen.steps} step${chosen.steps === 1 ? '' : 's'}`, ops(chosen.ops), String(chosen.cost), chosen.bound.toExponential(1)],
    equal
      ? ['equal', layout(equal), String(equal.tableBytes), `order ${equal.order}, ${equal.steps} step${equal.steps === 1 ? '' : 's'}`, ops(equal.ops), String(equal.cost), equal.bound.toExponential(1)]
      : ['equal', 'none up to 64 KB', '-', '-', '-', '-', '-'],
  ];
  if (equal && limit !== family.plan.maxTableBytes) rows[1][1] += ` (only with max_table_bytes ${limit})`;
  const head = ['', 'layout', 'bytes', 'form', 'ops', 'cost', 'bound'];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  for (const r of [head, ...rows]) console.log(`  ${r.map((x, i) => x.padEnd(widths[i])).join('  ').trimEnd()}`);
  if (equal) console.log(`  table bytes, chosen / equal: ${(chosen.tableBytes / equal.tableBytes).toFixed(2)}`);
}
