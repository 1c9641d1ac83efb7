/**
 * Parsing the spec text into a YAML document, turning the parser's first
 * error into a one-line refusal at its line and column. JSON is YAML, so
 * JSON specs come through the same door.
 */
import { LineCounter, parseDocument, type Node } from 'yaml';
import { NO_POS, SpecContext, WHOLE_FILE } from './context.js';
import { showText } from '../family/show.js';

/** Friendlier wording for the parser errors a hand-written spec meets most. */
const MESSAGES: Readonly<Record<string, string>> = {
  TAB_AS_INDENT: 'YAML does not allow tabs for indentation; indent with spaces',
  MULTIPLE_DOCS: 'the file holds more than one YAML document (a second ---); keep one spec per file',
  DUPLICATE_KEY: 'a key appears twice; keep one',
};

export function parseSpecDocument(file: string, text: string): { ctx: SpecContext; contents: Node } {
  const lines = new LineCounter();
  // uniqueKeys: false lets yaml-map.ts refuse duplicates with their field path.
  const doc = parseDocument(text, { lineCounter: lines, uniqueKeys: false, prettyErrors: false, version: '1.2' });
  const ctx = new SpecContext(file, text, lines);
  const err = doc.errors[0];
  if (err) {
    const first = err.message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '').replace(/[.:]$/, '');
    ctx.fail(MESSAGES[err.code] ?? `not valid YAML: ${showText(first, 120)}`, ctx.pos(err.pos[0]), WHOLE_FILE);
  }
  if (doc.contents === null) {
    ctx.fail('the spec is empty; write the fields (`rootcast new NAME` writes a starter)', NO_POS, WHOLE_FILE);
  }
  return { ctx, contents: doc.contents as Node };
}
