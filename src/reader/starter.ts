/**
 * The commented starter spec that `rootcast new NAME` writes, rendered from
 * templates/spec/starter.yaml with the function name filled in.
 */
import { readFileSync } from 'node:fs';
import Handlebars from 'handlebars';
import { RootcastError } from '../errors.js';
import { PACKAGE_ROOT } from '../package-root.js';
import { identifierProblem } from './identifiers.js';

/** templates/ at the package root. */
const TEMPLATE = new URL('templates/spec/starter.yaml', PACKAGE_ROOT);

let compiled: Handlebars.TemplateDelegate<{ name: string }> | null = null;

/** The starter spec for a function called `name`; refuses a name the spec reader would refuse. */
export function starterSpec(name: string): string {
  const problem = identifierProblem(name);
  if (problem) throw new RootcastError(`cannot use that function name: ${problem}`);
  compiled ??= Handlebars.compile<{ name: string }>(readFileSync(TEMPLATE, 'utf8'), { noEscape: true, strict: true });
  return compiled({ name });
}
