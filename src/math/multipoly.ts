/**
 * Exact multivariate polynomials with rational coefficients, kept sparse:
 * a map from the exponent vector to its coefficient (never zero). Used to
 * expand the recentred coefficients c'j(p) exactly, once per segment, so that
 * their range over a cell can be bounded without the dependency problem of
 * interval arithmetic (DESIGN.md 1.10; the range itself: src/math/bernstein.ts).
 */
import { Rational } from './rational.js';

export class MultiPoly {
  /** key (exponents joined by ',') -> [exponents, coefficient]. */
  private constructor(
    readonly vars: number,
    private readonly terms: ReadonlyMap<string, readonly [readonly number[], Rational]>,
  ) {}

  static constant(vars: number, c: Rational): MultiPoly {
    const terms = new Map<string, readonly [readonly number[], Rational]>();
    if (!c.isZero()) {
      const e = new Array<number>(vars).fill(0);
      terms.set(e.join(','), [e, c]);
    }
    return new MultiPoly(vars, terms);
  }

  static zero(vars: number): MultiPoly {
    return MultiPoly.constant(vars, Rational.ZERO);
  }

  /** The polynomial `offset + scale * x_i`. */
  static affine(vars: number, i: number, offset: Rational, scale: Rational): MultiPoly {
    const e = new Array<number>(vars).fill(0);
    e[i] = 1;
    return MultiPoly.constant(vars, offset).add(MultiPoly.fromTerms(vars, [[e, scale]]));
  }

  static fromTerms(vars: number, list: readonly (readonly [readonly number[], Rational])[]): MultiPoly {
    const terms = new Map<string, readonly [readonly number[], Rational]>();
    for (const [e, c] of list) {
      if (e.length !== vars) throw new RangeError('MultiPoly: exponent vector of the wrong length');
      const key = e.join(',');
      const sum = (terms.get(key)?.[1] ?? Rational.ZERO).add(c);
      if (sum.isZero()) terms.delete(key);
      else terms.set(key, [e, sum]);
    }
    return new MultiPoly(vars, terms);
  }

  /**
   * sum_m s_m p_m y^m in one more variable y (index `vars`, the last), with
   * parts[m] = [p_m, s_m] or null for a zero term: the same polynomial as
   * adding p_m.extend().mul(s_m y^m) one by one (no two parts share a power of y).
   */
  static powerSeriesIn(vars: number, parts: readonly (readonly [MultiPoly, Rational] | null)[]): MultiPoly {
    const terms = new Map<string, readonly [readonly number[], Rational]>();
    parts.forEach((part, m) => {
      if (!part || part[1].isZero()) return;
      const [p, s] = part;
      if (p.vars !== vars) throw new RangeError('MultiPoly: polynomial of the wrong number of variables');
      for (const [key, [e, c]] of p.terms) terms.set(`${key === '' ? '' : `${key},`}${m}`, [[...e, m], c.mul(s)]);
    });
    return new MultiPoly(vars + 1, terms);
  }

  /** Every (exponents, coefficient) pair, in a fixed order (by key). */
  entries(): (readonly [readonly number[], Rational])[] {
    return [...this.terms.keys()].sort().map((k) => this.terms.get(k)!);
  }

  isZero(): boolean {
    return this.terms.size === 0;
  }

  /** The constant value when the polynomial has no variable term, else null. */
  constantValue(): Rational | null {
    if (this.terms.size === 0) return Rational.ZERO;
    if (this.terms.size > 1) return null;
    const [e, c] = [...this.terms.values()][0]!;
    return e.every((x) => x === 0) ? c : null;
  }

  /** Highest power of each variable. */
  degrees(): number[] {
    const d = new Array<number>(this.vars).fill(0);
    for (const [e] of this.terms.values()) e.forEach((x, i) => (d[i] = Math.max(d[i]!, x)));
    return d;
  }

  add(o: MultiPoly): MultiPoly {
    return MultiPoly.fromTerms(this.vars, [...this.terms.values(), ...o.terms.values()]);
  }

  sub(o: MultiPoly): MultiPoly {
    return this.add(o.scale(Rational.ONE.neg()));
  }

  scale(s: Rational): MultiPoly {
    if (s.isZero()) return MultiPoly.zero(this.vars);
    return new MultiPoly(this.vars, new Map([...this.terms].map(([k, [e, c]]) => [k, [e, c.mul(s)] as const])));
  }

  mul(o: MultiPoly): MultiPoly {
    const list: [number[], Rational][] = [];
    for (const [ea, ca] of this.terms.values()) {
      for (const [eb, cb] of o.terms.values()) list.push([ea.map((x, i) => x + eb[i]!), ca.mul(cb)]);
    }
    return MultiPoly.fromTerms(this.vars, list);
  }

  pow(k: number): MultiPoly {
    let result = MultiPoly.constant(this.vars, Rational.ONE);
    let base: MultiPoly = this;
    for (let e = k; e > 0; e >>= 1) {
      if (e & 1) result = result.mul(base);
      if (e > 1) base = base.mul(base);
    }
    return result;
  }

  /** The same polynomial with one more variable (index `vars`), not occurring. */
  extend(): MultiPoly {
    return MultiPoly.fromTerms(
      this.vars + 1,
      [...this.terms.values()].map(([e, c]) => [[...e, 0], c] as const),
    );
  }

  /** Exact value at a point. */
  evaluate(x: readonly Rational[]): Rational {
    let s = Rational.ZERO;
    for (const [e, c] of this.terms.values()) {
      let t = c;
      e.forEach((k, i) => {
        if (k > 0) t = t.mul(x[i]!.pow(k));
      });
      s = s.add(t);
    }
    return s;
  }
}
