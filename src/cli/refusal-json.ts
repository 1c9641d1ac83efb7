/**
 * The JSON a refusal prints under `plan --json` and `verify --json`
 * (schema/refusal.schema.json): the generator, the spec as given, and the
 * refusal's location and message, the same facts as its one stderr line.
 */
import { RootcastError } from '../errors.js';
import { VERSION } from '../version.js';

export const GENERATOR = { name: 'rootcast', version: VERSION } as const;

export interface RefusalJson {
  readonly generator: typeof GENERATOR;
  readonly spec: string | null;
  readonly exitCode: number;
  readonly refusal: {
    readonly file: string | null;
    readonly line: number | null;
    readonly column: number | null;
    readonly field: string | null;
    readonly message: string;
  };
}

/**
 * A spec a command refused: its one stderr line, its refusal object in
 * `results` under --json (null otherwise), and its exit code. Anything that is
 * not a RootcastError is a bug and is thrown on.
 */
export function reportRefusal(e: unknown, spec: string, results: object[] | null, printError: (line: string) => void): number {
  if (!(e instanceof RootcastError)) throw e;
  printError(e.toLine());
  results?.push(refusalJson(e, spec));
  return e.exitCode;
}

export function refusalJson(e: RootcastError, spec: string | null): RefusalJson {
  const loc = e.location;
  return {
    generator: GENERATOR,
    spec,
    exitCode: e.exitCode,
    refusal: {
      file: loc ? loc.file : null,
      line: loc ? loc.line : null,
      column: loc ? loc.column : null,
      field: loc ? loc.field : null,
      message: e.message.replace(/\s*\n\s*/g, ' '),
    },
  };
}

/** One spec: its object; several: an array, in the order given. */
export function jsonOutput(results: readonly object[]): string {
  return JSON.stringify(results.length === 1 ? results[0] : results, null, 2);
}
