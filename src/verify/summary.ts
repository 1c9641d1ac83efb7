/**
 * The one summary line every check prints (the in-process check, the C
 * harness and the TypeScript harness print it identically, numbers in C's
 * `%.1e` and `%.9g` formats), and its reader, so `rootcast verify` can read a
 * harness's verdict from its stdout.
 *
 *   check NAME (LANGUAGE, ARITHMETIC): N points; worst KIND error E at IN = V[, IN = V];
 *     [no sign change in the bracket at K point(s), first at IN = V[, ...]; ]
 *     certified bound B; target T; PASS|FAIL
 *
 * (one line; E, T in `%.1e`, V in `%.9g`, B in the `%.1e` layout but rounded
 * up, so the printed bound is never below the proven one (formatEUp); "worst
 * KIND error none" when no point could be measured).
 *
 * summaryText and what it reaches are part of the harness machinery
 * (scripts/gen-harness.js copies them, renamed rc_*): keep them free of
 * imports beyond printf.ts and tally.ts.
 */
import { checkLineFigures } from '../emit/literals/round-up.js';
import type { Arithmetic } from '../family/arithmetic.js';
import { formatE, formatG } from './printf.js';
import type { TallyFigures } from './tally.js';

/** `GLSL` is the scalar GLSL function, `GLSL vec4` its vec4 overload (both run on WebGL2). */
export type SummaryLanguage = 'C' | 'TypeScript' | 'GLSL' | 'GLSL vec4' | 'WGSL' | 'WGSL vec4' | 'Rust' | 'in-process';
export type CheckTarget = 'in-process' | 'c' | 'ts' | 'glsl' | 'wgsl' | 'rust';

/** A check's figures (tally.ts) and which check it was. */
export interface CheckSummary extends TallyFigures {
  readonly target: CheckTarget;
}

/** A summary read back from a line: the numbers carry the line's printed digits only. */
export interface ParsedSummary extends CheckSummary {
  readonly functionName: string;
  readonly language: SummaryLanguage;
  readonly arithmetic: Arithmetic;
}

const LANGUAGE_TARGET: Readonly<Record<SummaryLanguage, CheckTarget>> = {
  C: 'c',
  TypeScript: 'ts',
  GLSL: 'glsl',
  'GLSL vec4': 'glsl',
  WGSL: 'wgsl',
  'WGSL vec4': 'wgsl',
  Rust: 'rust',
  'in-process': 'in-process',
};

function pointText(names: readonly string[], values: readonly number[]): string {
  return names.map((name, j) => `${name} = ${formatG(values[j]!, 9)}`).join(', ');
}

function plural(count: number): string {
  return `${count} point${count === 1 ? '' : 's'}`;
}

export function formatSummary(
  s: CheckSummary,
  functionName: string,
  arithmetic: Arithmetic,
  language: SummaryLanguage,
): string {
  const f = checkLineFigures(s.bound, s.targetAccuracy);
  return summaryText(s, f.boundText, f.targetDecimals, functionName, arithmetic, language);
}

/**
 * The line itself, the bound given as its printed text (rounded up, never
 * below the proven bound): the harnesses print it with the text the emitter
 * computed, so they need no decimal machinery of their own.
 */
export function summaryText(s: TallyFigures, boundText: string, targetDecimals: number, functionName: string, arithmetic: string, language: string): string {
  const worst =
    s.worstAt.length === 0
      ? `worst ${s.kind} error none`
      : `worst ${s.kind} error ${formatE(s.worstError, 1)} at ${pointText(s.inputNames, s.worstAt)}`;
  const noSign =
    s.noSignChangeAt && s.noSignChangeCount
      ? `; no sign change in the bracket at ${plural(s.noSignChangeCount)}, first at ${pointText(s.inputNames, s.noSignChangeAt)}`
      : '';
  return (
    `check ${functionName} (${language}, ${arithmetic}): ${plural(s.points)}; ${worst}${noSign}; ` +
    `certified bound ${boundText}; target ${formatE(s.targetAccuracy, targetDecimals)}; ${s.pass ? 'PASS' : 'FAIL'}`
  );
}

const NUMBER = String.raw`(?:-?inf|nan|-?\d+(?:\.\d+)?(?:e[+-]\d+)?)`;
const POINT = String.raw`\w+ = ${NUMBER}(?:, \w+ = ${NUMBER})*`;
const LINE = new RegExp(
  String.raw`^check (\w+) \((C|TypeScript|GLSL vec4|GLSL|WGSL vec4|WGSL|Rust|in-process), (float32|float64)\): (\d+) points?; ` +
    String.raw`worst (absolute|relative) error (?:none|(${NUMBER}) at (${POINT}))` +
    String.raw`(?:; no sign change in the bracket at (\d+) points?, first at (${POINT}))?` +
    String.raw`; certified bound (${NUMBER}); target (${NUMBER}); (PASS|FAIL)$`,
);

function parseNumber(text: string): number {
  if (text === 'inf') return Infinity;
  if (text === '-inf') return -Infinity;
  if (text === 'nan') return NaN;
  return Number(text);
}

function parsePoint(text: string): { names: string[]; values: number[] } {
  const names: string[] = [];
  const values: number[] = [];
  for (const part of text.split(', ')) {
    const [name, value] = part.split(' = ');
    names.push(name!);
    values.push(parseNumber(value!));
  }
  return { names, values };
}

/** Reads a summary line; throws a SyntaxError naming the line when it is not one. */
export function parseSummary(line: string): ParsedSummary {
  const m = LINE.exec(line.trim());
  if (!m) throw new SyntaxError(`not a check summary line: ${JSON.stringify(line)}`);
  const language = m[2] as SummaryLanguage;
  const worst = m[7] !== undefined ? parsePoint(m[7]) : null;
  const noSign = m[9] !== undefined ? parsePoint(m[9]) : null;
  return {
    functionName: m[1]!,
    language,
    arithmetic: m[3] as Arithmetic,
    target: LANGUAGE_TARGET[language],
    inputNames: worst?.names ?? noSign?.names ?? [],
    points: Number(m[4]),
    kind: m[5] as 'absolute' | 'relative',
    worstError: m[6] !== undefined ? parseNumber(m[6]) : 0,
    worstAt: worst?.values ?? [],
    ...(noSign ? { noSignChangeAt: noSign.values, noSignChangeCount: Number(m[8]) } : {}),
    bound: parseNumber(m[10]!),
    targetAccuracy: parseNumber(m[11]!),
    pass: m[12] === 'PASS',
  };
}

/** The last summary line in a harness's stdout (a `--dump` run prints point lines first). */
export function summaryLineOf(stdout: string): string {
  const lines = stdout.split('\n').filter((l) => l.startsWith('check '));
  const last = lines[lines.length - 1];
  if (last === undefined) throw new SyntaxError('no check summary line in the output');
  return last;
}
