// Preloaded by bench/plan-time.js (node --import): on exit, the process's own
// CPU time goes to stderr as one marker line, so the benchmark can report CPU
// seconds as well as wall time on a shared machine.
process.on('exit', () => {
  const { user, system } = process.cpuUsage();
  process.stderr.write(`\n@cpu-ms ${((user + system) / 1000).toFixed(0)}\n`);
});
