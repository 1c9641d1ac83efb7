// npm run bench:result-time: what `result:` costs the planner (issue 16,
// item 3). For each example with result: (and any spec given on the command
// line), in one process: CPU seconds to plan the root alone (the spec without
// result:, accuracy unchanged), the folded trial alone (makeFoldedPlan), and
// the whole result spec (makePlan: the root's budget search, the folded
// trial, the choice), with the ratio to the root alone. Every plan is made
// once before timing so the JIT is warm. CPU time (process.cpuUsage), not
// wall time: the machine is shared. Figures, not a timed test.
//
//   node bench/result-time.js [SPEC...]
import { readdirSync } from 'node:fs';
import { cpus } from 'node:os';

const { loadSpec } = await import('../dist/reader/load.js');
const { makePlan, makeFoldedPlan } = await import('../dist/plan/plan.js');

const given = process.argv.slice(2);
const specs = given.length > 0 ? given : readdirSync('examples').filter((f) => f.endsWith('.yaml')).sort().map((f) => `examples/${f}`);

const cpu = (fn) => {
  const t = process.cpuUsage();
  try {
    fn();
  } catch {
    return null;
  }
  const u = process.cpuUsage(t);
  return (u.user + u.system) / 1e6;
};
const s = (x) => (x === null ? 'refused' : `${x.toFixed(2)} s`);

console.log(`machine: ${cpus().length} x ${cpus()[0]?.model ?? '?'}, node ${process.version}`);
for (const file of specs) {
  const family = loadSpec(file);
  if (!family.result) continue;
  const { result: _result, ...root } = family;
  const folds = family.inputs.length === 1;
  // Warm-up: the same three plans once.
  cpu(() => makePlan(root));
  if (folds) cpu(() => makeFoldedPlan(family));
  cpu(() => makePlan(family));
  const tRoot = cpu(() => makePlan(root));
  const tFold = folds ? cpu(() => makeFoldedPlan(family)) : null;
  const tAll = cpu(() => makePlan(family));
  const ratio = tRoot && tAll ? ` (${(tAll / tRoot).toFixed(1)}x the root alone)` : '';
  console.log(`${file}: root alone ${s(tRoot)}, folded trial ${folds ? s(tFold) : 'not weighed (more than one input)'}, result spec ${s(tAll)}${ratio}`);
}
