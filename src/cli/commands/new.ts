/**
 * `rootcast new NAME`: writes NAME.yaml, a commented starter spec, and refuses
 * to overwrite. Its first line points the YAML language server (editors'
 * completion and checking) at the spec schema this installation ships, by a
 * path relative to the new file, so nothing is fetched from the network.
 */
import { existsSync, writeFileSync } from 'node:fs';
import { dirname, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { RootcastError } from '../../errors.js';
import { PACKAGE_ROOT } from '../../package-root.js';
import { starterSpec } from '../../reader/starter.js';

export function runNew(name: string, out: string | undefined, print: (line: string) => void): number {
  const path = out ?? `${name}.yaml`;
  const text = `${schemaLine(path)}\n${starterSpec(name)}`;
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

/** schema/ at the package root. */
const SPEC_SCHEMA = fileURLToPath(new URL('schema/rootcast-spec.schema.json', PACKAGE_ROOT));

/** `# yaml-language-server: $schema=RELATIVE/PATH` from the spec's folder to the shipped spec schema. */
export function schemaLine(specPath: string): string {
  let rel = relative(dirname(resolve(specPath)), SPEC_SCHEMA).split(sep).join('/');
  if (!rel.startsWith('.')) rel = `./${rel}`;
  return `# yaml-language-server: $schema=${rel}`;
}
