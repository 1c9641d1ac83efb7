import { describe, test } from '@jest/globals';
import { edit, expectRefusal } from './helpers.js';

describe('reading single values', () => {
  test('a name must be text, not a number, true/false or a list', () => {
    expectRefusal(edit(2, 'unknown: 7'), 'spec.yaml:2:10: unknown: ', 'expected a name, found the number 7');
    expectRefusal(edit(2, 'unknown: true'), 'spec.yaml:2:10: unknown: ', 'expected a name, found `true`');
    expectRefusal(edit(2, 'unknown: [x]'), 'spec.yaml:2:10: unknown: ', 'expected a name, found a list');
  });

  test('a name must obey the identifier rule', () => {
    expectRefusal(edit(1, 'function: 2fast'), 'spec.yaml:1:11: function: ', '`2fast` is not a valid name');
    expectRefusal(edit(1, 'function: "spring x"'), 'spec.yaml:1:11: function: ', '`spring x` is not a valid name');
    expectRefusal(edit(1, 'function: _spring'), 'spec.yaml:1:11: function: ', '`_spring` starts with _');
  });

  test('keywords of C, TypeScript and GLSL are refused with the reason', () => {
    expectRefusal(edit(1, 'function: float'), 'spec.yaml:1:11: function: ', '`float` is a keyword in C, GLSL and HLSL; choose another name');
    expectRefusal(edit(1, 'function: function'), 'spec.yaml:1:11: function: ', '`function` is a reserved word in TypeScript; choose another name');
    expectRefusal(edit(1, 'function: vec4'), 'spec.yaml:1:11: function: ', '`vec4` is a keyword in GLSL, and a predeclared type in WGSL; choose another name');
    expectRefusal(edit(1, 'function: gl_Pos'), 'spec.yaml:1:11: function: ', '`gl_Pos` starts with gl_, which GLSL reserves');
    expectRefusal(edit(1, 'function: a__b'), 'spec.yaml:1:11: function: ', '`a__b` contains __, which GLSL reserves');
  });

  test('a whole number must be written as digits', () => {
    expectRefusal(edit(3, 'degree: 3.0'), 'spec.yaml:3:9: degree: ', 'expected a whole number from 1 to 64, found 3.0');
    expectRefusal(edit(3, 'degree: "3"'), 'spec.yaml:3:9: degree: ', 'found the text `3`');
    expectRefusal(edit(3, 'degree: 1e1'), 'spec.yaml:3:9: degree: ', 'found 1e1');
  });

  test('a huge whole number is refused without overflowing', () => {
    expectRefusal(edit(3, 'degree: 123456789012345678901234567890'), 'spec.yaml:3:9: degree: ', 'found 123456789012345678901234...');
  });
});
