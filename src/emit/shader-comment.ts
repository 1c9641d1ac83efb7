/**
 * Header comments for the WGSL, HLSL and Rust files: the shared header
 * (header.ts) as comment lines. ASCII only for the shaders (any other
 * character, a spec file name say, is written as <U+XXXX>), so no compiler's
 * source character set or line-break rules (WGSL counts U+0085 as a line
 * break) can cut a comment short.
 */
import { assertCommentSafe } from './header.js';

/** Lines as `// text` comments (`//` for a blank); ASCII only when `ascii`. */
export function slashCommentLines(lines: readonly string[], ascii: boolean): string[] {
  return lines.map((line) => {
    const text = ascii ? asciiOnly(line) : line;
    assertCommentSafe(text);
    return text === '' ? '//' : `// ${text}`;
  });
}

/** Lines as the inside of a block comment (` * text`, ` *` for a blank), ASCII only. */
export function blockCommentLines(lines: readonly string[]): string[] {
  return lines.map((line) => {
    const text = asciiOnly(line);
    assertCommentSafe(text);
    return text === '' ? ' *' : ` * ${text}`;
  });
}

export function asciiOnly(text: string): string {
  return text.replace(/[^\x20-\x7e]/gu, (c) => `<U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}>`);
}
