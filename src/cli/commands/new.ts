/** `rootcast new NAME`: writes NAME.yaml, a commented starter spec, and refuses to overwrite. */
import { existsSync, writeFileSync } from 'node:fs';
import { RootcastError } from '../../errors.js';
import { starterSpec } from '../../reader/starter.js';

export function runNew(name: string, out: string | undefined, print: (line: string) => void): number {
  const text = starterSpec(name);
  const path = out ?? `${name}.yaml`;
  if (existsSync(path)) throw new RootcastError(`${path} already exists; choose another name or pass --out FILE`);
  try {
    writeFileSync(path, text, { flag: 'wx' });
  } catch (e) {
    const why = (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'its folder does not exist' : (e as Error).message;
    throw new RootcastError(`cannot write ${path}: ${why}; create the folder or choose another --out`);
  }
  print(`wrote ${path}: edit the coefficients, inputs and accuracy, then run rootcast plan ${path}`);
  return 0;
}
