/** A spec position for a message about a field, found after parsing. */
import type { SourceLocation } from '../errors.js';
import type { Family } from '../family/types.js';

export function locate(family: Family, field: string): SourceLocation {
  const pos = family.positions[field] ?? family.positions[field.split('.')[0]!] ?? { line: 1, column: 1 };
  return { file: family.file, line: pos.line, column: pos.column, field };
}
