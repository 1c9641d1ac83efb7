/**
 * A Make-format dependency file, as compilers write with -MF: one rule per
 * spec, `OUTPUTS : SPEC`, so Make (include) and Ninja (depfile =) learn the
 * generated files' names without a hand-written list. Spaces, `#` and `$` in
 * paths are escaped the way GNU make reads them (`\ `, `\#`, `$$`); a
 * backslash is left alone (a Windows path separator).
 */
export interface DepRule {
  readonly outputs: readonly string[];
  readonly input: string;
}

export function depfileText(rules: readonly DepRule[]): string {
  return rules.map((r) => `${r.outputs.map(escape).join(' ')}: ${escape(r.input)}\n`).join('');
}

function escape(path: string): string {
  return path.replace(/([ #])/g, '\\$1').replace(/\$/g, '$$$$');
}
