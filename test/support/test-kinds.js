/**
 * Which jest project a test file belongs to (jest.config.js). A test is an
 * integration test when it, or any module it imports (followed through
 * relative imports, src/ included), starts a process, a browser or the
 * TypeScript compiler API: it reads child_process, playwright or ts-morph.
 * Tests that stay in process but take longer than jest's default 5 s per test
 * (planning every example, property tests over many specs) are listed in
 * SLOW. Every other test is a unit test: the fast loop, `npm run test:unit`.
 * Imports are read by the TypeScript pre-processor, as the layering test does.
 */
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import ts from 'typescript';

const HEAVY = /from ['"](node:)?child_process['"]|from ['"]playwright(-core)?['"]|from ['"]ts-morph['"]/;

/** In-process tests slower than the default timeout (paths from the repository root). */
const SLOW = [
  'test/plan/bound-property.test.ts',
  'test/plan/polish-property.test.ts',
  'test/plan/result-property.test.ts',
  'test/plan/result-fold.test.ts',
  'test/plan/plan.test.ts',
  'test/plan/segments.test.ts',
  'test/plan/cost-model.test.ts',
  'test/plan/extreme-ranges.test.ts',
  'test/ir/check.test.ts',
  'test/verify/inprocess.test.ts',
  'test/plan/tight-enclosures.test.ts',
  'test/plan/corpus-property.test.ts',
  'test/plan/plain-series.test.ts',
  'test/plan/landing-time.test.ts',
  'test/plan/segments-property.test.ts',
  // Plan a bracketed quadratic's whole segment search in process: seconds on a busy machine.
  'test/plan/table-limit.test.ts',
  'test/plan/table-free-trials.test.ts',
  // Plans eleven layouts of a quadratic in process to check the cost floor against them.
  'test/plan/cost-floor.test.ts',
  // Plans ease-in-out-y's folded layouts in process to check the folded floor against them.
  'test/plan/folded-floor.test.ts',
  // Plans and checks 60 random fixed32 families in process: about a minute.
  'test/fixed/no-bracket-property.test.ts',
  // Plans 100 random fixed32 families and every fix their refusals quote, in process: about a minute (89 s in CI).
  'test/fixed/quoted-fix-property.test.ts',
  // Plans the Pt1000 example's quoted floor with every auto segment count in process: half a minute under jest.
  'test/plan/fixed/quoted-fixes.test.ts',
  'test/plan/first-plan.test.ts',
  // Sweeps two corpus specs' bracket check to its cell limit the plain way, for comparison: seconds on a busy machine.
  'test/plan/bracket-check-corpus.test.ts',
  'test/support/plan-cache.test.ts',
  // Runs scripts/gen-harness.js (ts-morph) through a dynamic import, which the import scan does not follow.
  'test/verify/harness-machinery.test.ts',
  // These set their own timeouts (minutes): they plan every example or a slow one, so they are not unit tests.
  'test/examples/golden.test.ts',
  'test/examples/thermocouple.test.ts',
  'test/plan/work-exact.test.ts',
  'test/targets/gpu-cost.test.ts',
  // Reads every test file's imports (as jest.config.js does at start-up): seconds on a busy machine.
  'test/layout/test-kinds.test.ts',
];

function testFiles(dir) {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    if (e.isDirectory()) return testFiles(p);
    return e.name.endsWith('.test.ts') ? [p] : [];
  });
}

function heavy(file, seen) {
  if (seen.has(file)) return false;
  seen.add(file);
  const text = readFileSync(file, 'utf8');
  if (HEAVY.test(text)) return true;
  return ts.preProcessFile(text, true, true).importedFiles.some((f) => {
    if (!f.fileName.startsWith('.')) return false;
    const target = resolve(dirname(file), f.fileName.replace(/\.js$/, '.ts'));
    return existsSync(target) && heavy(target, seen);
  });
}

/** The test files of each project, as paths relative to `root`. */
export function testKinds(root) {
  const unit = [];
  const integration = [];
  for (const file of testFiles(join(root, 'test')).sort()) {
    const rel = relative(root, file).split('\\').join('/');
    (SLOW.includes(rel) || heavy(file, new Set()) ? integration : unit).push(rel);
  }
  return { unit, integration };
}
