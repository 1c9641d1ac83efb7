/**
 * The rule for names a spec gives (the function, the unknown, inputs and
 * constants). A name is printed verbatim into C, TypeScript, GLSL, WGSL, HLSL
 * and Rust, so it must be an identifier in all of them and collide with
 * nothing they reserve.
 */
import { RESERVED_GROUPS, type Language } from './reserved-words.js';
import { showText } from '../family/show.js';

/**
 * C99 5.2.4.1 guarantees 63 significant initial characters in an internal
 * identifier; a longer name could silently collide with another.
 */
export const MAX_NAME_LENGTH = 63;

const NAME_SHAPE = /^[A-Za-z][A-Za-z0-9_]*$/;

/** word -> the ways it is reserved, in RESERVED_GROUPS order. */
const RESERVED = new Map<string, { language: Language; kind: string }[]>();
for (const group of RESERVED_GROUPS) {
  for (const w of group.words) {
    const list = RESERVED.get(w) ?? [];
    list.push({ language: group.language, kind: group.kind });
    RESERVED.set(w, list);
  }
}

/** Prefix and pattern rules; the reason reads after the quoted name. */
const PATTERN_RULES: readonly { test: (name: string) => boolean; reason: string }[] = [
  { test: (n) => n.startsWith('gl_'), reason: 'starts with gl_, which GLSL reserves for its built-in names' },
  { test: (n) => n.startsWith('GL_'), reason: 'starts with GL_, which GLSL reserves for its macros' },
  { test: (n) => n.startsWith('webgl_'), reason: 'starts with webgl_, which WebGL reserves' },
  { test: (n) => n.includes('__'), reason: 'contains __, which GLSL reserves for the implementation' },
  { test: (n) => n.startsWith('rc_'), reason: "starts with rc_, which rootcast reserves for the generated code's locals" },
  { test: (n) => /^v[0-9]+$/.test(n), reason: 'has the form v<digits>, which rootcast uses for its temporaries' },
];

/**
 * Why `name` cannot be used, as one sentence ending in what to do, or null
 * when it is a good name.
 */
export function identifierProblem(name: string): string | null {
  if (name === '') return 'the name is empty; write a letter followed by letters, digits or _';
  if (!NAME_SHAPE.test(name)) {
    const shown = showText(name, 40);
    if (name.startsWith('_')) {
      return `\`${shown}\` starts with _; a name starts with a letter, then letters, digits or _`;
    }
    return `\`${shown}\` is not a valid name; use a letter followed by letters, digits or _`;
  }
  if (name.length > MAX_NAME_LENGTH) {
    return `the name has ${name.length} characters; at most ${MAX_NAME_LENGTH} are allowed`;
  }
  const reserved = RESERVED.get(name);
  if (reserved) return `\`${name}\` is ${describeReservations(reserved)}; choose another name`;
  for (const rule of PATTERN_RULES) {
    if (rule.test(name)) return `\`${name}\` ${rule.reason}; choose another name`;
  }
  return null;
}

/** "a keyword in C and GLSL, and a reserved word in TypeScript". */
function describeReservations(list: readonly { language: Language; kind: string }[]): string {
  const byKind = new Map<string, Language[]>();
  for (const { language, kind } of list) {
    const langs = byKind.get(kind) ?? [];
    if (!langs.includes(language)) langs.push(language);
    byKind.set(kind, langs);
  }
  return [...byKind].map(([kind, langs]) => `${kind} in ${joinAnd(langs)}`).join(', and ');
}

/** "C", "C and GLSL", "C, TypeScript and GLSL". */
function joinAnd(items: readonly string[]): string {
  return items.length <= 2 ? items.join(' and ') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}
