// Preloaded by bench/plan-time.js (node --import): on exit, the process's own
// CPU time goes to stderr as one marker line, so the benchmark can report CPU
// seconds as well as wall time on a shared machine, and the planner's work
// units over the run (src/plan/work.ts workTotal) as a second marker line, so
// the benchmark can show how closely the deterministic work count follows CPU.
const work = await import(new URL('../dist/plan/work.js', import.meta.url));
process.on('exit', () => {
  const { user, system } = process.cpuUsage();
  // An older build (a before/after comparison) has no workTotal: its units are left out.
  const units = typeof work.workTotal === 'function' ? `\n@work-units ${Math.round(work.workTotal())}` : '';
  process.stderr.write(`${units}\n@cpu-ms ${((user + system) / 1000).toFixed(0)}\n`);
});
