// The second half of `npm run build`: bundles the command line (src/cli.ts)
// into dist/cli-bundle.cjs with esbuild, after tsc has written the per-module
// dist/ (which the tests, `npm run samples` and the benchmarks import); then
// dist/cli.js, the command as installed (src/launch.ts), which runs the bundle
// from V8's code cache; then that cache, dist/cli-bundle.v8cache
// (scripts/make-code-cache.js).
//
// Why: a cold `rootcast plan` loaded about 170 ES modules from dist/ and
// node_modules, one file read, resolution and compilation each, before the
// planner ran (about 270 ms of a 0.95 s plan). Bundled, it reads two files.
//
// - One CommonJS bundle, not ES chunks: node 20 keeps no compiled code between
//   runs for ES modules, but `vm.Script` takes V8's code cache (`cachedData`),
//   which only a script (CommonJS) can use. The cache holds the bytecode of
//   every function one planned example compiled (the build plans
//   examples/kiln-probe.yaml --json in a child process), so a cold plan parses
//   and compiles almost nothing; the rest compiles lazily as before. How it
//   is checked and when it is not used: src/cli/code-cache.ts. The commands'
//   modules (emitters, handlebars, the checkers) are in the one file, each
//   behind esbuild's lazy init, so `plan` still runs none of their top level;
//   only a run whose cache is rejected parses their text (about 1.3 MB).
//   `import()`s become `require()`s (`supported`); `import.meta.url` becomes
//   the bundle's own file URL, which the launcher passes in (`define`).
// - The bundle ends with its build id (sha256 of its text), and the cache file
//   starts with the id it was made for; the previous build's files are
//   removed first, so a failed build leaves no cache of another bundle.
// - ts-morph, typescript and playwright-core stay outside (`external`): they
//   are loaded at run time from node_modules by the commands that need them,
//   as before; so does cli-progress, which src/cli/progress.ts requires only
//   when it draws a bar (on a terminal). Everything else (yargs, yaml,
//   handlebars) is inside.
// - Paths to shipped files come from src/package-root.ts, which sits one
//   level below the package root in src/, dist/ and in the bundle in dist/.
// - yargs finds its message translations (node_modules/yargs/locales) from
//   its own file's place; in the bundle that place is dist/, so the build
//   points it at the installed yargs package instead (`yargsShim`).
// - Start-up (`yargsShim`, `yargsCommand`): three pieces of yargs' work
//   that a run without help needs not do are taken off every run. (1) cliui and
//   string-width, which lay the help out, build Intl.Segmenters and Unicode
//   property regexes (\p{RGI_Emoji}) at their top level, about 20 ms; yargs
//   reaches them only through its platform shim, so the shim gets them from
//   a small module that loads them (esbuild's lazy init) on the first call,
//   that is when help is printed. (2) yargs renders the command's whole help
//   text (cacheHelpMessage, about 30 ms) before it calls the command's
//   handler, in case the handler fails; our commands run after the parse
//   (src/cli/main.ts), yargs gives each a no-op handler, and nothing reads
//   that cache: with our .fail() yargs never prints help on a failure, and
//   --help renders afresh. (3) node:assert, for yargs' internal assertions,
//   loads only when one fails. Each patch checks the text it replaces, so a
//   yargs that changes it fails the build rather than going slow or wrong.
// - yaml comes from its ES module build (`alias`; the build its package
//   exports outside node, the same source), not the CommonJS one node would
//   pick: esbuild drops the parts the reader never reaches and the module
//   wrappers, about 9 ms of every run that reads a spec. What differs: a
//   warning goes to console.warn instead of process.emitWarning (the reader's
//   parseDocument gives its warnings back rather than printing them), and
//   yaml's own debugging switches LOG_TOKENS and LOG_STREAM are absent.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { BUILD_ID_MARK, BUNDLE_FILE, CACHE_FILE } from '../dist/cli/code-cache.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const DIST = join(ROOT, 'dist');
/** The ES chunks of earlier builds (cli-<name>-<hash>.js), removed so none lingers. */
const CHUNK = /^cli-.+-[A-Z0-9]{8}\.js$/;

/** Replaces `from` by `to` in `text`, which must hold `from` exactly once. */
function patch(text, from, to, file) {
  if (text.split(from).length !== 2) throw new Error(`scripts/bundle.js: ${file} no longer has ${JSON.stringify(from)} once; check what this yargs does there`);
  return text.replace(from, () => to);
}

/** The text-layout packages behind yargs' help, loaded on their first call (esbuild wraps a require()d ES module in a lazy init). */
const LAZY_LAYOUT = [
  "let cliui, stringWidth;",
  "export const lazyCliui = (...args) => (cliui ??= require('cliui').default)(...args);",
  "export const lazyStringWidth = (...args) => (stringWidth ??= require('string-width').default)(...args);",
].join('\n');

/**
 * yargs' two assertions (one runs on every command), with node:assert (its
 * load is about 4 ms) loaded only to throw when one fails. `require` is the
 * shim's own createRequire, declared below (hoisted: called only later).
 */
const LAZY_ASSERT = [
  "const notStrictEqual = (actual, expected, message) => { if (Object.is(actual, expected)) require('node:assert').notStrictEqual(actual, expected, message); };",
  "const strictEqual = (actual, expected, message) => { if (!Object.is(actual, expected)) require('node:assert').strictEqual(actual, expected, message); };",
  '',
].join('\n');

/**
 * Where the installed yargs keeps its translations. Node's resolution of
 * 'yargs' from the bundle (dist/) looks first in the package's own
 * node_modules; that one directory is checked with one stat, and only when it
 * is absent (yargs hoisted above the package) is the resolution asked, which
 * costs about 5 ms of every start. `__dirname` is the shim's name for the
 * bundle file's own path.
 */
const YARGS_LOCALES = [
  'const yargsLocales = () => {',
  "  const own = resolve(__dirname, '../../node_modules/yargs/locales');",
  "  return require('node:fs').existsSync(own) ? own : resolve(require.resolve('yargs'), '../locales');",
  '};',
  '',
].join('\n');

/** yargs' ESM shim: the translations directory from the installed package, not from the bundle's place; node:assert, cliui and string-width on demand. */
const yargsShim = {
  name: 'yargs-shim',
  setup(b) {
    b.onResolve({ filter: /^rootcast-lazy-layout$/ }, (args) => ({ path: args.path, namespace: 'rootcast-lazy-layout', pluginData: args.resolveDir }));
    b.onLoad({ filter: /.*/, namespace: 'rootcast-lazy-layout' }, (args) => ({ contents: LAZY_LAYOUT, loader: 'js', resolveDir: args.pluginData }));
    b.onLoad({ filter: /[\\/]yargs[\\/]lib[\\/]platform-shims[\\/]esm\.mjs$/ }, async (args) => {
      const { readFile } = await import('node:fs/promises');
      let text = await readFile(args.path, 'utf8');
      text = patch(text, "directory: resolve(__dirname, '../../../locales')", 'directory: yargsLocales()', args.path);
      text = patch(text, "const require = createRequire(import.meta.url);\n", `const require = createRequire(import.meta.url);\n${YARGS_LOCALES}`, args.path);
      text = patch(text, "import { notStrictEqual, strictEqual } from 'assert'\n", LAZY_ASSERT, args.path);
      text = patch(text, "import cliui from 'cliui'\n", '', args.path);
      text = patch(text, "import stringWidth from 'string-width';\n", "import { lazyCliui, lazyStringWidth } from 'rootcast-lazy-layout';\n", args.path);
      text = patch(text, '  cliui,\n', '  cliui: lazyCliui,\n', args.path);
      text = patch(text, '  stringWidth,\n', '  stringWidth: lazyStringWidth,\n', args.path);
      return { contents: text, loader: 'js' };
    });
  },
};

/** yargs' command runner: no help text rendered into a cache before each command's (no-op) handler. */
const yargsCommand = {
  name: 'yargs-command',
  setup(b) {
    b.onLoad({ filter: /[\\/]yargs[\\/]build[\\/]lib[\\/]command\.js$/ }, async (args) => {
      const { readFile } = await import('node:fs/promises');
      const text = await readFile(args.path, 'utf8');
      const call = 'yargs.getInternalMethods().getUsageInstance().cacheHelpMessage();';
      return { contents: patch(text, call, '/* rootcast: no help cache (scripts/bundle.js) */', args.path), loader: 'js' };
    });
  },
};

for (const f of readdirSync(DIST)) if (CHUNK.test(f)) rmSync(join(DIST, f));
rmSync(join(DIST, BUNDLE_FILE), { force: true });
rmSync(join(DIST, CACHE_FILE), { force: true });

// A work tree whose node_modules predates esbuild (npm ci adds it) keeps
// tsc's per-module dist/cli.js, which works the same, only slower to start.
let build;
try {
  ({ build } = await import('esbuild'));
} catch {
  process.stderr.write('scripts/bundle.js: esbuild is not installed (run npm ci); dist/cli.js stays the per-module entry, which starts slower\n');
  process.exit(0);
}

const common = { bundle: true, platform: 'node', target: 'node20', tsconfig: join(ROOT, 'tsconfig.json'), logLevel: 'warning' };

await build({
  ...common,
  entryPoints: [join(ROOT, 'src', 'cli.ts')],
  outfile: join(DIST, BUNDLE_FILE),
  format: 'cjs',
  external: ['ts-morph', 'typescript', 'playwright-core', 'cli-progress'],
  alias: { yaml: join(ROOT, 'node_modules', 'yaml', 'browser', 'index.js') },
  define: { 'import.meta.url': '__rootcastUrl' },
  supported: { 'dynamic-import': false },
  plugins: [yargsShim, yargsCommand],
});

// The bundle runs as a function body (src/cli/code-cache.ts): no #! line. Its last line is its build id.
const bundlePath = join(DIST, BUNDLE_FILE);
const text = readFileSync(bundlePath, 'utf8').replace(/^#!.*\n/, '');
if (/\bimport\.meta\b/.test(text)) throw new Error('scripts/bundle.js: the bundle still says import.meta, which a CommonJS script cannot');
// The launcher reads the bundle as latin1 (src/cli/code-cache.ts runBundle), which is the same text only for ASCII.
if (/[^\x00-\x7f]/.test(text)) throw new Error('scripts/bundle.js: the bundle has a character outside ASCII (esbuild charset?): the launcher reads it as latin1');
writeFileSync(bundlePath, `${text}${BUILD_ID_MARK}${createHash('sha256').update(text).digest('hex')}\n`);

await build({
  ...common,
  entryPoints: [join(ROOT, 'src', 'launch.ts')],
  outfile: join(DIST, 'cli.js'),
  format: 'esm',
  allowOverwrite: true,
});

// The cache: the bundle plans one example in a child process (without the
// caller's NODE_OPTIONS, whose V8 flags would not match a plain run's).
const env = { ...process.env };
delete env.NODE_OPTIONS;
const made = spawnSync(process.execPath, [join(ROOT, 'scripts', 'make-code-cache.js'), 'plan', 'examples/kiln-probe.yaml', '--json'], {
  cwd: ROOT,
  env,
  stdio: ['ignore', 'ignore', 'inherit'],
});
if (made.status !== 0) throw new Error(`scripts/make-code-cache.js failed (exit ${made.status ?? made.signal}): the bundle did not plan examples/kiln-probe.yaml`);
