/**
 * Loads the file-framing templates (templates/ at the package root) and fills
 * their slots. Templates hold guards, header comment placement, signatures and
 * harness skeletons only; arithmetic is printed from the IR and arrives here
 * as finished lines.
 *
 * A slot the template names but the caller does not fill is an error
 * (Handlebars `strict`), and so is a value the caller passes that the template
 * never names: a typo on either side fails loudly instead of printing a blank
 * or silently dropping text. Output is never HTML-escaped (`noEscape`).
 */
import { readFileSync } from 'node:fs';
import Handlebars from 'handlebars';
import { PACKAGE_ROOT } from '../package-root.js';

/** templates/ at the package root. */
const TEMPLATE_ROOT = new URL('templates/', PACKAGE_ROOT);

interface LoadedTemplate {
  readonly render: Handlebars.TemplateDelegate;
  /** Every name the template mentions (an over-approximation of its slots). */
  readonly names: ReadonlySet<string>;
}

/** One private Handlebars environment, so no helper registered elsewhere can change our output. */
const handlebars = Handlebars.create();
const cache = new Map<string, LoadedTemplate>();

export class TemplateSlotError extends Error {}

/** Reads templates/<relativePath> as UTF-8 text. */
export function readTemplate(relativePath: string): string {
  if (relativePath.startsWith('/') || relativePath.split('/').includes('..')) {
    throw new RangeError(`template path must stay inside templates/: ${relativePath}`);
  }
  return readFileSync(new URL(relativePath, TEMPLATE_ROOT), 'utf8');
}

/** Fills a template's slots; throws TemplateSlotError on a missing or unknown slot. */
export function renderTemplate(relativePath: string, slots: Readonly<Record<string, unknown>>): string {
  const t = load(relativePath);
  for (const key of Object.keys(slots)) {
    if (!t.names.has(key)) throw new TemplateSlotError(`template ${relativePath} has no slot named ${key}`);
  }
  try {
    return t.render(slots);
  } catch (e) {
    throw new TemplateSlotError(`template ${relativePath}: ${(e as Error).message}`);
  }
}

function load(relativePath: string): LoadedTemplate {
  const hit = cache.get(relativePath);
  if (hit) return hit;
  const source = readTemplate(relativePath);
  const loaded: LoadedTemplate = {
    render: handlebars.compile(source, { noEscape: true, strict: true, knownHelpersOnly: true }),
    names: mentionedNames(handlebars.parse(source)),
  };
  cache.set(relativePath, loaded);
  return loaded;
}

/** The first part of every path expression in the template (`{{a.b}}` gives a; `{{this}}` and `{{@index}}` give none). */
function mentionedNames(ast: hbs.AST.Program): Set<string> {
  const names = new Set<string>();
  const walk = (node: unknown): void => {
    if (Array.isArray(node)) {
      for (const x of node) walk(x);
      return;
    }
    if (node === null || typeof node !== 'object') return;
    const n = node as { type?: string; data?: boolean; parts?: string[] };
    if (n.type === 'PathExpression' && !n.data && n.parts && n.parts.length > 0) names.add(n.parts[0]!);
    for (const [key, value] of Object.entries(node)) if (key !== 'loc') walk(value);
  };
  walk(ast);
  return names;
}
