// The exact reference of this GLSL page: the same machinery as the
// TypeScript harness NAME.check.ts, in plain JavaScript for a browser:
// exact BigInt fractions, the bisection reference, the resolution rule and
// C's %.1e / %.9g (README, "How the checks work"). It prints exactly the
// summary line of the in-process check.
// ---- Exact fractions over BigInt, n / d with d > 0, deliberately not kept in
// lowest terms: the per-point numbers are dyadic and a gcd after every
// operation would cost more than the bisection (README, "How the checks work").
function rc_q(n, d) {
    if (d === 0n)
        throw new RangeError('division by zero in a coefficient');
    return d < 0n ? { n: -n, d: -d } : { n, d };
}
function rc_add(a, b) {
    return a.d === b.d ? { n: a.n + b.n, d: a.d } : { n: a.n * b.d + b.n * a.d, d: a.d * b.d };
}
function rc_sub(a, b) {
    return rc_add(a, rc_neg(b));
}
function rc_mul(a, b) {
    return { n: a.n * b.n, d: a.d * b.d };
}
function rc_div(a, b) {
    return rc_q(a.n * b.d, a.d * b.n);
}
function rc_neg(a) {
    return { n: -a.n, d: a.d };
}
function rc_abs(a) {
    return a.n < 0n ? rc_neg(a) : a;
}
function rc_powi(a, k) {
    const p = { n: a.n ** BigInt(Math.abs(k)), d: a.d ** BigInt(Math.abs(k)) };
    return k < 0 ? rc_div({ n: 1n, d: 1n }, p) : p;
}
function rc_cmp(a, b) {
    const t = a.n * b.d - b.n * a.d;
    return t < 0n ? -1 : t > 0n ? 1 : 0;
}
const rc_f64 = new Float64Array(1);
const rc_u64 = new BigUint64Array(rc_f64.buffer);
const rc_f32 = new Float32Array(1);
const rc_u32 = new Uint32Array(rc_f32.buffer);
/** x = m * 2^e exactly, for finite x > 0. */
function rc_binaryParts(x) {
    rc_f64[0] = x;
    const bits = rc_u64[0];
    const bexp = Number((bits >> 52n) & 0x7ffn);
    const frac = bits & 0xfffffffffffffn;
    return bexp === 0 ? { m: frac, e: -1074 } : { m: frac | (1n << 52n), e: bexp - 1075 };
}
/** The exact value of a finite double. */
function rc_fromDouble(x) {
    if (x === 0)
        return { n: 0n, d: 1n };
    const { m, e } = rc_binaryParts(Math.abs(x));
    const n = x < 0 ? -m : m;
    return e >= 0 ? { n: n << BigInt(e), d: 1n } : { n, d: 1n << BigInt(-e) };
}
function rc_bitLength(x) {
    if (x === 0n)
        return 0;
    const hex = x.toString(16);
    return (hex.length - 1) * 4 + (32 - Math.clz32(parseInt(hex[0], 16)));
}
/**
 * The smallest double >= q for q >= 0 (as Rational.toNumberUp): with
 * 2^e <= q < 2^(e+1) and the quantum 2^k, k = max(e - 52, -1074), it is
 * ceil(q / 2^k) * 2^k, an integer of at most 53 bits times a power of two.
 */
function rc_toDoubleUp(q) {
    if (q.n === 0n)
        return 0;
    let e = rc_bitLength(q.n) - rc_bitLength(q.d);
    if (e >= 0 ? q.n < q.d << BigInt(e) : q.n << BigInt(-e) < q.d)
        e -= 1;
    const k = Math.max(e - 52, -1074);
    const a = k >= 0 ? q.n : q.n << BigInt(-k);
    const b = k >= 0 ? q.d << BigInt(k) : q.d;
    let m = a / b;
    if (m * b !== a)
        m += 1n;
    if (k > 1023)
        return Infinity;
    return Number(m) * 2 ** k;
}
// ---- The exact reference root (README, "How the checks work"): the grid cell
// [X, X + 1] / 2^s where the sign changes, every sign decided exactly by
// Horner's rule on integers, A(X) = 2^(s n) P(X / 2^s) = sum_k C_k X^k 2^(s (n - k)).
function rc_floorDiv(a, b) {
    const q = a / b;
    return a % b !== 0n && (a < 0n) !== (b < 0n) ? q - 1n : q;
}
/** Sign of P(p / q), q > 0, for integer coefficients c. */
function rc_signAtRational(c, p, q) {
    const n = c.length - 1;
    let acc = c[n];
    let qk = 1n;
    for (let k = n - 1; k >= 0; k--) {
        qk *= q;
        acc = acc * p + c[k] * qk;
    }
    return acc < 0n ? -1 : acc > 0n ? 1 : 0;
}
/**
 * A root interval of width <= 2^-s inside [lo, hi], or null when P(lo), P(hi)
 * are non-zero with one sign. `hint` (the value under test) starts the Newton
 * shortcut described in README, "How the checks work"; bisection when it does not settle.
 */
function rc_referenceRoot(coeffs, lo, hi, s, hint) {
    // Integer coefficients: every c_k times the product of all denominators (> 0, signs kept).
    const c = coeffs.map((r, k) => coeffs.reduce((acc, o, j) => (j === k ? acc : acc * o.d), r.n));
    const n = c.length - 1;
    const signLo = rc_signAtRational(c, lo.n, lo.d);
    if (signLo === 0)
        return [lo, lo];
    const signHi = rc_signAtRational(c, hi.n, hi.d);
    if (signHi === 0)
        return [hi, hi];
    if (signLo === signHi)
        return null;
    const sBig = BigInt(s);
    const point = (x) => ({ n: x, d: 1n << sBig });
    const cell = (a, b) => [point(a), point(b)];
    const scaled = c.map((ck, k) => ck << BigInt(s * (n - k)));
    const signAt = (x) => {
        let acc = scaled[n];
        for (let k = n - 1; k >= 0; k--)
            acc = acc * x + scaled[k];
        return acc < 0n ? -1 : acc > 0n ? 1 : 0;
    };
    let left = -rc_floorDiv(-(lo.n << sBig), lo.d);
    let right = rc_floorDiv(hi.n << sBig, hi.d);
    if (left > right)
        return [lo, hi];
    const signLeft = signAt(left);
    if (signLeft === 0)
        return cell(left, left);
    if (signLeft !== signLo)
        return [lo, point(left)];
    const signRight = signAt(right);
    if (signRight === 0)
        return cell(right, right);
    if (signRight !== signHi)
        return [point(right), hi];
    const found = rc_newtonCell(scaled, rc_floorDiv(hint.n << sBig, hint.d), left, right, signLeft, signAt);
    if (found !== null)
        return cell(found[0], found[1]);
    while (right - left > 1n) {
        const mid = (left + right) >> 1n;
        const sm = signAt(mid);
        if (sm === 0)
            return cell(mid, mid);
        if (sm === signLeft)
            left = mid;
        else
            right = mid;
    }
    return cell(left, right);
}
/** Newton on the grid, X <- X - A(X) / A'(X) until the step is 0, then a short walk to the sign change. */
function rc_newtonCell(scaled, start, left, right, signLeft, signAt) {
    const n = scaled.length - 1;
    let x = start < left ? left : start > right ? right : start;
    let settled = false;
    for (let i = 0; i < 12; i++) {
        let p = scaled[n];
        let dp = 0n;
        for (let k = n - 1; k >= 0; k--) {
            dp = dp * x + p;
            p = p * x + scaled[k];
        }
        if (p === 0n)
            return [x, x];
        if (dp === 0n)
            return null;
        const h = p / dp;
        if (h === 0n) {
            settled = true;
            break;
        }
        x -= h;
        if (x < left || x > right)
            return null;
    }
    if (!settled)
        return null;
    const sx = signAt(x);
    if (sx === 0)
        return [x, x];
    const dir = sx === signLeft ? 1n : -1n;
    for (let i = 0; i < 4; i++) {
        const y = x + dir;
        if (y < left || y > right)
            return null;
        const sy = signAt(y);
        if (sy === 0)
            return [y, y];
        if (sy !== sx)
            return dir > 0n ? [x, y] : [y, x];
        x = y;
    }
    return null;
}
/** s with 2^-s = 2^(e - rc_referenceBits), 2^e <= max(|x|, B, 2^-1000) < 2^(e+1), s >= 0 (README, "How the checks work"). */
function rc_gridExponent(x) {
    const scale = Math.max(Math.abs(x), rc_absoluteBound, 2 ** -1000);
    let e = 0;
    let p = 1;
    while (p * 2 <= scale) {
        p *= 2;
        e++;
    }
    while (p > scale) {
        p /= 2;
        e--;
    }
    return Math.max(0, rc_referenceBits - e);
}
// ---- C's %.Ne and %.Pg, digit for digit (README, "How the checks work"): the exact
// binary value rounded half to even, C's exponent width and %g layout.
function rc_cmpPow10(num, den, k) {
    const a = k >= 0 ? num : num * 10n ** BigInt(-k);
    const b = k >= 0 ? den * 10n ** BigInt(k) : den;
    return a < b ? -1 : a > b ? 1 : 0;
}
function rc_roundDecimal(x, sig) {
    const { m, e } = rc_binaryParts(x);
    const num = e >= 0 ? m << BigInt(e) : m;
    const den = e >= 0 ? 1n : 1n << BigInt(-e);
    let k = Math.floor(Math.log10(x));
    while (rc_cmpPow10(num, den, k) < 0)
        k--;
    while (rc_cmpPow10(num, den, k + 1) >= 0)
        k++;
    const shift = sig - 1 - k;
    const a = shift >= 0 ? num * 10n ** BigInt(shift) : num;
    const b = shift >= 0 ? den : den * 10n ** BigInt(-shift);
    let q = a / b;
    const twice = (a - q * b) * 2n;
    if (twice > b || (twice === b && (q & 1n) === 1n))
        q += 1n;
    if (q === 10n ** BigInt(sig)) {
        q /= 10n;
        k += 1;
    }
    return { digits: q.toString(), exp10: k };
}
function rc_special(x) {
    if (Number.isNaN(x))
        return { sign: '', text: 'nan' };
    const sign = x < 0 || Object.is(x, -0) ? '-' : '';
    return { sign, text: Number.isFinite(x) ? null : `${sign}inf` };
}
function rc_exponentText(exp10) {
    const n = Math.abs(exp10);
    return `e${exp10 < 0 ? '-' : '+'}${n < 10 ? '0' : ''}${n}`;
}
function rc_formatE(x, precision) {
    const s = rc_special(x);
    if (s.text !== null)
        return s.text;
    const r = x === 0 ? { digits: '0'.repeat(precision + 1), exp10: 0 } : rc_roundDecimal(Math.abs(x), precision + 1);
    const mantissa = precision > 0 ? `${r.digits[0]}.${r.digits.slice(1)}` : r.digits;
    return `${s.sign}${mantissa}${rc_exponentText(r.exp10)}`;
}
function rc_stripZeros(int, frac) {
    const f = frac.replace(/0+$/, '');
    return f === '' ? int : `${int}.${f}`;
}
function rc_formatG(x, precision) {
    const s = rc_special(x);
    if (s.text !== null)
        return s.text;
    const p = precision === 0 ? 1 : precision;
    if (x === 0)
        return `${s.sign}0`;
    const { digits, exp10 } = rc_roundDecimal(Math.abs(x), p);
    let body;
    if (exp10 < p && exp10 >= -4) {
        body =
            exp10 >= 0
                ? rc_stripZeros(digits.slice(0, exp10 + 1), digits.slice(exp10 + 1))
                : rc_stripZeros('0', '0'.repeat(-exp10 - 1) + digits);
    }
    else {
        body = rc_stripZeros(digits[0], digits.slice(1)) + rc_exponentText(exp10);
    }
    return s.sign + body;
}
