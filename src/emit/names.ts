/**
 * Names the printers give to program values. Node i that is computed gets the
 * local `v<i>` (its IR index, so a line of emitted code points straight at its
 * node); generated helpers start with `rc_`. The spec reader refuses both
 * shapes as user names, and the printers check again, since a clash would
 * silently compute something else.
 */
const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;
const RESERVED_SHAPE = /^(v\d+|rc_.*)$/;

export function valueName(index: number): string {
  return `v${index}`;
}

/** Throws unless `name` is a plain identifier outside the generated-name shapes. */
export function assertUserName(name: string, what: string): void {
  if (!IDENTIFIER.test(name)) throw new Error(`${what} ${JSON.stringify(name)} is not an identifier`);
  if (RESERVED_SHAPE.test(name)) throw new Error(`${what} ${JSON.stringify(name)} clashes with generated names (v<digits>, rc_...)`);
}
