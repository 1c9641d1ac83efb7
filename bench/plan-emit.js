// npm run bench: plan and emit time and emitted op counts for every example.
// Figures, not a timed test: run on a quiet machine and read them as such.
import { readdirSync } from 'node:fs';
import { cpus } from 'node:os';
import { planSpec, emitInputOf } from '../dist/cli/pipeline.js';
import { emitFiles, TARGETS } from '../dist/cli/emit-files.js';

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const time = (fn, runs) => {
  const ms = [];
  let out;
  for (let i = 0; i < runs; i++) {
    const t = process.hrtime.bigint();
    out = fn();
    ms.push(Number(process.hrtime.bigint() - t) / 1e6);
  }
  return { out, ms: median(ms) };
};

console.log(`machine: ${cpus()[0]?.model ?? 'unknown cpu'}, ${cpus().length} cores; node ${process.version}`);
console.log('example                      plan ms  emit ms  form        segments  order terms steps  add  mul  div reads  bound (kind)');
for (const f of readdirSync('examples').filter((x) => x.endsWith('.yaml')).sort()) {
  const spec = `examples/${f}`;
  const plan = time(() => planSpec(spec), 5);
  const input = emitInputOf(plan.out);
  emitFiles(input, TARGETS); // warm the TypeScript printer once (ts-morph start-up)
  const emit = time(() => emitFiles(input, TARGETS), 5);
  const p = plan.out;
  console.log(
    [
      f.padEnd(28),
      plan.ms.toFixed(0).padStart(7),
      emit.ms.toFixed(0).padStart(8),
      ` ${p.form.padEnd(11)}`,
      p.counts.join('x').padEnd(8),
      String(p.order).padStart(6),
      String(p.terms.length).padStart(5),
      String(p.steps).padStart(5),
      String(p.ops.add).padStart(4),
      String(p.ops.mul).padStart(4),
      String(p.ops.div).padStart(4),
      String(p.ops.tableReads).padStart(5),
      `  ${p.bound.total.toExponential(2)} (${p.bound.kind})`,
    ].join(' '),
  );
}
