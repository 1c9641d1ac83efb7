/**
 * The one error type that reaches the user. Every refusal (bad spec, bad usage,
 * impossible plan) is a RootcastError: the command line prints `toLine()` and
 * exits with `exitCode` (2), writing nothing.
 */
export interface SourceLocation {
  /** Spec file path as the user gave it. */
  file: string;
  /** 1-based line and column; 0 when the fact has no position (an empty file). */
  line: number;
  column: number;
  /** Field path such as `coefficients.0` or `inputs.R`. */
  field: string;
}

export class RootcastError extends Error {
  readonly location: SourceLocation | null;
  readonly exitCode: number;

  constructor(message: string, location: SourceLocation | null = null, exitCode = 2) {
    super(message);
    this.name = 'RootcastError';
    this.location = location;
    this.exitCode = exitCode;
  }

  /** One line: `file:line:column: field: message`. */
  toLine(): string {
    const flat = this.message.replace(/\s*\n\s*/g, ' ');
    const loc = this.location;
    if (!loc) return `rootcast: ${flat}`;
    return `${loc.file}:${loc.line}:${loc.column}: ${loc.field}: ${flat}`;
  }
}
