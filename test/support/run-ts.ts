/**
 * Running emitted TypeScript for real: transpiled to ES module JavaScript
 * (src/emit/ts/typecheck.ts, the compiler ts-morph bundles) and run by this
 * node in a child process, with exact input and result bits (always binary64
 * hex: TypeScript numbers are doubles, so a missing Math.fround cannot hide
 * behind a conversion to binary32).
 */
import { execFileSync } from 'node:child_process';
import { transpileTs, typeCheckTs } from '../../src/emit/ts/typecheck.js';
import type { EmittedFile } from '../../src/emit/types.js';
import { float64Hex, fromFloat64Hex } from './bits.js';
import type { WorkDir } from './workdir.js';

const RUNNER = (module: string, name: string): string => `import { readFileSync } from 'node:fs';
import { ${name} } from './${module}';
const view = new DataView(new ArrayBuffer(8));
const toNumber = (hex) => { view.setBigUint64(0, BigInt('0x' + hex)); return view.getFloat64(0); };
const toHex = (x) => { view.setFloat64(0, x); return view.getBigUint64(0).toString(16).padStart(16, '0'); };
const out = [];
for (const line of readFileSync(0, 'utf8').split('\\n')) {
  if (line === '') continue;
  const args = line === '-' ? [] : line.split(' ').map(toNumber);
  out.push(toHex(${name}(...args)));
}
process.stdout.write(out.join('\\n') + '\\n');
`;

/** Transpiles the emitted files into dir (an ES module package) and returns their JavaScript paths. */
export function writeTranspiled(dir: WorkDir, files: readonly EmittedFile[]): string[] {
  dir.write('package.json', '{ "type": "module" }\n');
  return transpileTs(files.map((f) => ({ path: f.path, text: f.text }))).map((js) => dir.write(js.path, js.text));
}

/** Transpiles the emitted function into dir; the returned function runs rows of inputs in one node process and gives one binary64 hex word per row. */
function tsRunner(dir: WorkDir, file: EmittedFile, functionName: string): (rows: readonly (readonly number[])[]) => string[] {
  writeTranspiled(dir, [file]);
  const runner = dir.write(`${functionName}.run.js`, RUNNER(file.path.replace(/\.ts$/, '.js'), functionName));
  return (rows) => {
    const stdin = rows.map((r) => (r.length === 0 ? '-' : r.map(float64Hex).join(' '))).join('\n') + '\n';
    const out = execFileSync(process.execPath, [runner], { input: stdin, encoding: 'utf8', cwd: dir.path });
    const lines = out.split('\n').filter((l) => l !== '');
    if (lines.length !== rows.length) throw new Error(`TypeScript runner printed ${lines.length} results for ${rows.length} rows`);
    return lines;
  };
}

/** Transpiles the emitted function and returns a function that runs it on rows of inputs in one node process. */
export function transpileTsFunction(dir: WorkDir, file: EmittedFile, functionName: string): (rows: readonly (readonly number[])[]) => number[] {
  const run = tsRunner(dir, file, functionName);
  return (rows) => run(rows).map(fromFloat64Hex);
}

/** Type-checks the emitted file (unused names are errors), then runs the rows; returns one binary64 hex word per row. */
export function runTs(dir: WorkDir, file: EmittedFile, functionName: string, rows: readonly number[][]): string[] {
  const diagnostics = typeCheckTs([file], { noUnused: true });
  if (diagnostics.length > 0) throw new Error(`emitted TypeScript has type errors:\n${diagnostics.join('\n')}`);
  return tsRunner(dir, file, functionName)(rows);
}
