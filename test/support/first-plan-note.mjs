// Preloaded (node --import) by test/cli/quote-check-units.test.ts into a
// `rootcast plan` process: on exit, the units the planner had counted at its
// first plan (src/plan/work.ts workAtFirstPlan) go to stderr as one marker
// line, `@first-plan-units N` (`none` when no plan was made).
const cli = process.argv[1] ?? '';
const work = await import(new URL('plan/work.js', new URL(`file://${cli}`)).href);
process.on('exit', () => {
  const at = work.workAtFirstPlan();
  process.stderr.write(`\n@first-plan-units ${at === null ? 'none' : at}\n`);
});
