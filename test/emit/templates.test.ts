/** Templates fill framing slots only, and a missing or unknown slot is an error, never a blank. */
import { describe, expect, test } from '@jest/globals';
import { readTemplate, renderTemplate, TemplateSlotError } from '../../src/emit/templates.js';

const slots = {
  guard: 'ROOTCAST_DEMO_H',
  commentLines: [' * demo'],
  returnType: 'float',
  name: 'demo',
  parameters: 'float x',
  bodyLines: ['return x;'],
  batchParameters: 'const float *ROOTCAST_RESTRICT x, float *ROOTCAST_RESTRICT rc_out, size_t rc_n',
  batchArguments: '*x++',
  tableLines: [] as string[],
};

describe('renderTemplate', () => {
  test('places the slots of the C function template', () => {
    const text = renderTemplate('c/function.h.hbs', slots);
    expect(text).toBe(
      '#ifndef ROOTCAST_DEMO_H\n#define ROOTCAST_DEMO_H\n\n/*\n * demo\n */\n\n#include <stddef.h>\n#include <stdint.h>\n\n' +
        "// Reads a float's bits (defined in C and C++, unlike a union pun in C++);\n// gcc and clang need no <string.h>, so freestanding builds work too.\n" +
        '#ifndef ROOTCAST_MEMCPY\n#if defined(__GNUC__) || defined(__clang__)\n#define ROOTCAST_MEMCPY __builtin_memcpy\n#else\n#include <string.h>\n#define ROOTCAST_MEMCPY memcpy\n#endif\n#endif\n\n' +
        "// restrict is C99's; C++ compilers spell it __restrict.\n" +
        '#ifndef ROOTCAST_RESTRICT\n#ifdef __cplusplus\n#define ROOTCAST_RESTRICT __restrict\n#else\n#define ROOTCAST_RESTRICT restrict\n#endif\n#endif\n\n' +
        'static inline float demo(float x)\n{\n    return x;\n}\n\n' +
        '// rc_out[i] = demo(each input[i]) for i < rc_n; the arrays must not overlap.\n' +
        'static inline void demo_batch(const float *ROOTCAST_RESTRICT x, float *ROOTCAST_RESTRICT rc_out, size_t rc_n)\n{\n    while (rc_n--) {\n        *rc_out++ = demo(*x++);\n    }\n}\n\n' +
        '#endif /* ROOTCAST_DEMO_H */\n',
    );
  });

  test('a slot the caller leaves unfilled is an error', () => {
    const { guard: _guard, ...missing } = slots;
    expect(() => renderTemplate('c/function.h.hbs', missing)).toThrow(TemplateSlotError);
  });

  test('a value the template never names is an error', () => {
    expect(() => renderTemplate('c/function.h.hbs', { ...slots, gaurd: 'X' })).toThrow(/has no slot named gaurd/);
  });

  test('does not HTML-escape code', () => {
    expect(renderTemplate('c/function.h.hbs', { ...slots, parameters: 'float a, float b', bodyLines: ['return a < b ? a : b & 1;'] })).toContain(
      'return a < b ? a : b & 1;',
    );
  });

  test('the C template holds no arithmetic, only slots and framing', () => {
    const source = readTemplate('c/function.h.hbs');
    expect(source).not.toMatch(/\bconst\b|\breturn\b|\{\{\s*[a-zA-Z]+\s*\}\}\s*[-+*/]\s*\{\{/);
    expect(() => readTemplate('../package.json')).toThrow(RangeError);
  });
});
