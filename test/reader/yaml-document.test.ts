import { describe, expect, test } from '@jest/globals';
import { baseText, edit, expectRefusal, refusal } from './helpers.js';

describe('parsing the spec text', () => {
  test('an empty file is refused, with no position', () => {
    expectRefusal('', 'spec.yaml:0:0: (file): ', 'the spec is empty');
  });

  test('a file of comments only is refused as empty', () => {
    expectRefusal('# nothing here\n\n', 'spec.yaml:0:0: (file): ', 'the spec is empty');
  });

  test('malformed YAML is refused at the parser\'s line and column', () => {
    expectRefusal(edit(9, '  F: [0, 200'), 'spec.yaml:10:1: (file): ', 'not valid YAML');
  });

  test('an unterminated quote is refused with the parser\'s message', () => {
    const err = refusal(edit(5, '  0: "-F'));
    expect(err.toLine()).toMatch(/^spec\.yaml:\d+:\d+: \(file\): not valid YAML: Missing closing "quote$/);
  });

  test('tabs used for indentation are refused with what to do', () => {
    expectRefusal(edit(9, '\tF: [0, 200]'), 'spec.yaml:9:1: (file): ', 'YAML does not allow tabs for indentation; indent with spaces');
  });

  test('two YAML documents in one file are refused', () => {
    expectRefusal(baseText() + '---\nfunction: other\n', 'spec.yaml:16:1: (file): ', 'more than one YAML document');
  });

  test('a spec that is not a map is refused', () => {
    expectRefusal('just some words\n', 'spec.yaml:1:1: (file): ', 'expected a map of fields such as `function: NAME`, found the text `just some words`');
    expectRefusal('- function\n', 'spec.yaml:1:1: (file): ', 'found a list');
  });

  test('the file name is kept verbatim in the message', () => {
    const err = refusal('');
    expect(err.location?.file).toBe('spec.yaml');
  });
});
