/** Shared helpers for the spec reader's tests: a small valid spec to edit, and refusal capture. */
import { expect } from '@jest/globals';
import { RootcastError } from '../../src/errors.js';
import { readSpec } from '../../src/reader/read.js';

/**
 * A valid spec, one field per line, so a test can replace line N and state
 * the expected line and column literally. (An invented spring: k3 x^3 + k1 x = F.)
 */
export const BASE: readonly string[] = [
  'function: spring_x', //   1
  'unknown: x', //           2
  'degree: 3', //            3
  'coefficients:', //        4
  '  0: -F', //              5
  '  1: k1', //              6
  '  3: k3', //              7
  'inputs:', //              8
  '  F: [0, 200]', //        9
  'constants:', //          10
  '  k1: 12.5', //          11
  '  k3: 0.004', //         12
  'accuracy:', //           13
  '  absolute: 0.001', //   14
  'arithmetic: float32', // 15
];

/** BASE with 1-based line `n` replaced by `replacement` (which may hold several lines). */
export function edit(n: number, replacement: string, lines: readonly string[] = BASE): string {
  const out = [...lines];
  out[n - 1] = replacement;
  return out.join('\n') + '\n';
}

/** BASE with `extra` lines appended. */
export function withExtra(...extra: string[]): string {
  return [...BASE, ...extra].join('\n') + '\n';
}

export const baseText = (): string => BASE.join('\n') + '\n';

/** The RootcastError readSpec throws for `text`; fails the test if it accepts it or throws anything else. */
export function refusal(text: string, file = 'spec.yaml'): RootcastError {
  try {
    readSpec(file, text);
  } catch (err) {
    if (err instanceof RootcastError) return err;
    throw err;
  }
  throw new Error(`expected a refusal, but the spec was accepted:\n${text}`);
}

/**
 * Assert the refusal's one line: the exact `file:line:column: field: ` prefix,
 * a message containing `part`, and no newline.
 */
export function expectRefusal(text: string, prefix: string, part: string | RegExp): RootcastError {
  const err = refusal(text);
  const line = err.toLine();
  expect(line).not.toContain('\n');
  expect(line.startsWith(prefix) ? prefix : line).toBe(prefix);
  if (typeof part === 'string') expect(line).toContain(part);
  else expect(line).toMatch(part);
  const field = prefix.split(': ')[1];
  expect(err.location?.field).toBe(field);
  expect(err.exitCode).toBe(2);
  return err;
}
