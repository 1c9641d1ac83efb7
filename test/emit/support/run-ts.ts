/**
 * Type-checks emitted TypeScript, transpiles it to ES module JavaScript and
 * runs it with this node, feeding exact input bits and reading result bits
 * back (always binary64 bits, so a missing Math.fround cannot hide behind a
 * conversion to binary32).
 */
import { execFileSync } from 'node:child_process';
import { transpileTs, typeCheckTs } from '../../../src/emit/ts/typecheck.js';
import type { EmittedFile } from '../../../src/emit/types.js';
import { float64Hex } from '../../support/bits.js';
import type { WorkDir } from '../../support/workdir.js';

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

export function runTs(dir: WorkDir, file: EmittedFile, functionName: string, rows: readonly number[][]): string[] {
  const diagnostics = typeCheckTs([file], { noUnused: true });
  if (diagnostics.length > 0) throw new Error(`emitted TypeScript has type errors:\n${diagnostics.join('\n')}`);
  const [js] = transpileTs([file]);
  dir.write('package.json', '{ "type": "module" }\n');
  dir.write(js!.path, js!.text);
  const runner = dir.write(`${functionName}.run.js`, RUNNER(js!.path, functionName));
  const stdin = rows.map((r) => (r.length === 0 ? '-' : r.map(float64Hex).join(' '))).join('\n') + '\n';
  const out = execFileSync(process.execPath, [runner], { input: stdin, encoding: 'utf8', cwd: dir.path });
  return out.split('\n').filter((l) => l !== '');
}
