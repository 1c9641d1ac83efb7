// Calls the built CLI's main(argv) many times in one plain node process (the
// speed a user gets; jest's module sandbox makes the planner several times
// slower). Reads a JSON list of argv arrays from the file named by argv[2],
// writes one JSON result per job: exit code, captured stdout and stderr, and
// any exception that escaped main.
import { readFileSync } from 'node:fs';
const { main } = await import(process.env.ROOTCAST_DIST ? `${process.env.ROOTCAST_DIST}/cli/main.js` : '../../../dist/cli/main.js');

const jobs = JSON.parse(readFileSync(process.argv[2], 'utf8'));
const realOut = process.stdout.write.bind(process.stdout);
const results = [];
for (const argv of jobs) {
  let stdout = '';
  let stderr = '';
  process.stdout.write = (c) => ((stdout += String(c)), true);
  process.stderr.write = (c) => ((stderr += String(c)), true);
  let code;
  let thrown = null;
  try {
    code = await main(argv);
  } catch (e) {
    code = -1;
    thrown = e instanceof Error ? `${e.name}: ${e.message}\n${e.stack}` : String(e);
  }
  results.push({ code, stdout, stderr, thrown });
}
process.stdout.write = realOut;
realOut(JSON.stringify(results));
