/**
 * User text quoted inside a message: on one line, control characters
 * escaped (a quoted YAML key or value may hold a line break or a tab), and
 * cut to a length a message can carry.
 */
export function showText(s: string, max = 24): string {
  const escaped = s.replace(/[\u0000-\u001f\u007f\u2028\u2029]/g, (c) => {
    const named: Record<string, string> = { '\n': '\\n', '\t': '\\t', '\r': '\\r' };
    return named[c] ?? `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`;
  });
  // Cut on a code point boundary, so a surrogate pair is never split.
  const points = [...escaped];
  return points.length > max ? `${points.slice(0, max).join('')}...` : escaped;
}
