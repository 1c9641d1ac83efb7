import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { checkDecimalText } from '../../src/family/decimal-text.js';

const value = (s: string) => {
  const c = checkDecimalText(s);
  if (!c.ok) throw new Error(c.problem);
  return c;
};

describe('checkDecimalText', () => {
  test('keeps the text as written and gives its exact value', () => {
    const c = value('3.9083e-3');
    expect(c.text).toBe('3.9083e-3');
    expect(c.value.toString()).toBe('39083/10000000');
    expect(value('-5.775e-7').value.toString()).toBe('-231/400000000');
    expect(value('390.48').value.toString()).toBe('9762/25');
  });

  test('accepts the YAML 1.2 float spellings 5. and .5, and drops a leading +', () => {
    expect(value('5.').value.toString()).toBe('5');
    expect(value('.5').value.toString()).toBe('1/2');
    expect(value('+12.5').text).toBe('12.5');
  });

  test('agrees with decimal.js on the exact value of random decimal texts', () => {
    // decimal.js (a registry library) parses the same text independently; toFraction gives lowest terms.
    const text = fc
      .tuple(fc.boolean(), fc.stringMatching(/^[0-9]{1,12}$/), fc.stringMatching(/^[0-9]{0,12}$/), fc.integer({ min: -300, max: 300 }))
      .map(([neg, int, frac, exp]) => `${neg ? '-' : ''}${int}${frac ? `.${frac}` : ''}e${exp}`);
    fc.assert(
      fc.property(text, (t) => {
        const c = checkDecimalText(t);
        if (!c.ok) return /below the smallest|beyond/.test(c.problem);
        const [n, d] = new Decimal(t).toFraction().map((x) => BigInt(x.toFixed()));
        return c.value.num === n && c.value.den === d;
      }),
    );
  });

  test('refuses infinities and NaN as YAML writes them', () => {
    for (const s of ['.inf', '-.inf', '+.INF', '.Inf']) expect(checkDecimalText(s)).toMatchObject({ ok: false, problem: expect.stringContaining('is infinite') });
    expect(checkDecimalText('.nan')).toMatchObject({ ok: false, problem: expect.stringContaining('NaN') });
  });

  test('refuses values that overflow float64 (1e400) and those that round to zero (1e-400)', () => {
    expect(checkDecimalText('1e400')).toMatchObject({ ok: false, problem: expect.stringContaining('beyond the float64 range') });
    // 1.8e308 rounds above DBL_MAX = 1.7976931348623157e308 (IEEE 754 binary64), so it overflows.
    expect(checkDecimalText('1.8e308').ok).toBe(false);
    expect(checkDecimalText('1.7976931348623157e308').ok).toBe(true);
    expect(checkDecimalText('1e-400')).toMatchObject({ ok: false, problem: expect.stringContaining('would round to zero') });
    // 5e-324 is the smallest subnormal binary64 value (IEEE 754): kept.
    expect(checkDecimalText('5e-324').ok).toBe(true);
    expect(checkDecimalText('0e-999').ok).toBe(true);
  });

  test('refuses hexadecimal, octal and other non-decimal texts', () => {
    expect(checkDecimalText('0x1F')).toMatchObject({ ok: false, problem: expect.stringContaining('write it in decimal digits') });
    expect(checkDecimalText('0o17').ok).toBe(false);
    expect(checkDecimalText('1_000').ok).toBe(false);
    expect(checkDecimalText('').ok).toBe(false);
    expect(checkDecimalText('1e').ok).toBe(false);
  });
});
