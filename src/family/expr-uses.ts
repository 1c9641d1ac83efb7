/** Which inputs and constants an expression mentions. */
import type { Expr } from './types.js';

/** Indices of the inputs `e` depends on. */
export function inputsUsed(e: Expr, into: Set<number> = new Set()): Set<number> {
  switch (e.kind) {
    case 'input':
      into.add(e.index);
      break;
    case 'neg':
      inputsUsed(e.arg, into);
      break;
    case 'pow':
      inputsUsed(e.base, into);
      break;
    case 'add':
    case 'sub':
    case 'mul':
    case 'div':
      inputsUsed(e.left, into);
      inputsUsed(e.right, into);
      break;
    case 'num':
    case 'constant':
      break;
  }
  return into;
}

/** Names of the constants `e` mentions. */
export function constantsUsed(e: Expr, into: Set<string> = new Set()): Set<string> {
  switch (e.kind) {
    case 'constant':
      into.add(e.name);
      break;
    case 'neg':
      constantsUsed(e.arg, into);
      break;
    case 'pow':
      constantsUsed(e.base, into);
      break;
    case 'add':
    case 'sub':
    case 'mul':
    case 'div':
      constantsUsed(e.left, into);
      constantsUsed(e.right, into);
      break;
    case 'num':
    case 'input':
      break;
  }
  return into;
}
