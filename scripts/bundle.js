// The second half of `npm run build`: bundles the command line (src/cli.ts)
// into dist/cli.js with esbuild, after tsc has written the per-module dist/
// (which the tests, `npm run samples` and the benchmarks import).
//
// Why: a cold `rootcast plan` loaded about 170 ES modules from dist/ and
// node_modules, one file read, resolution and compilation each, before the
// planner ran (about 270 ms of a 0.95 s plan). The bundle is a few files.
//
// - Split at the commands' dynamic imports (`splitting`), so `plan` still
//   loads neither the emitters nor handlebars, and `--version` only yargs.
//   The chunks sit directly in dist/ beside cli.js, named cli-<name>-<hash>.js;
//   the previous build's chunks are removed first, so none lingers.
// - ts-morph, typescript and playwright-core stay outside (`external`): they
//   are loaded at run time from node_modules by the commands that need them,
//   as before; so does cli-progress, which src/cli/progress.ts requires only
//   when it draws a bar (on a terminal). Everything else (yargs, yaml,
//   handlebars, decimal.js) is inside.
// - Paths to shipped files come from src/package-root.ts, which sits one
//   level below the package root in src/, dist/ and as a chunk in dist/.
// - yargs finds its message translations (node_modules/yargs/locales) from
//   its own file's place; in the bundle that place is dist/, so the build
//   points it at the installed yargs package instead (`yargsLocales`).
// - CommonJS packages inside (yaml, handlebars) call require()
//   for node's built-in modules: each output file gets a require of its own
//   (`banner`).
import { readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const DIST = join(ROOT, 'dist');
const CHUNK = /^cli-.+-[A-Z0-9]{8}\.js$/;

/** yargs' ESM shim: the translations directory from the installed package, not from the bundle's place. */
const yargsLocales = {
  name: 'yargs-locales',
  setup(b) {
    b.onLoad({ filter: /[\\/]yargs[\\/]lib[\\/]platform-shims[\\/]esm\.mjs$/ }, async (args) => {
      const { readFile } = await import('node:fs/promises');
      const text = await readFile(args.path, 'utf8');
      const from = "directory: resolve(__dirname, '../../../locales')";
      if (!text.includes(from)) throw new Error(`scripts/bundle.js: ${args.path} no longer has ${from}; check how this yargs finds its locales`);
      return { contents: text.replace(from, "directory: fileURLToPath(new URL('./locales/', import.meta.resolve('yargs')))"), loader: 'js' };
    });
  },
};

for (const f of readdirSync(DIST)) if (CHUNK.test(f)) rmSync(join(DIST, f));

// A work tree whose node_modules predates esbuild (npm ci adds it) keeps
// tsc's per-module dist/cli.js, which works the same, only slower to start.
let build;
try {
  ({ build } = await import('esbuild'));
} catch {
  process.stderr.write('scripts/bundle.js: esbuild is not installed (run npm ci); dist/cli.js stays the per-module entry, which starts slower\n');
  process.exit(0);
}

await build({
  entryPoints: { cli: join(ROOT, 'src', 'cli.ts') },
  outdir: DIST,
  chunkNames: 'cli-[name]-[hash]',
  entryNames: '[name]',
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  tsconfig: join(ROOT, 'tsconfig.json'),
  external: ['ts-morph', 'typescript', 'playwright-core', 'cli-progress'],
  banner: { js: "import { createRequire as __rootcastRequire } from 'node:module'; const require = __rootcastRequire(import.meta.url);" },
  plugins: [yargsLocales],
  allowOverwrite: true,
  logLevel: 'warning',
});
