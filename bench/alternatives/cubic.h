/*
 * The hand-written alternatives for a cubic c3 x^3 + c2 x^2 + c1 x + c0 = 0,
 * shared by the cubic examples. The including file defines RC_T, RC_INPUTS,
 * RC_RELATIVE, RC_F32 (1 for float), includes the emitted header, and defines
 *     static RC_T rc_emitted_call(const RC_T *in);            the emitted function
 *     static void rc_coefficients(const RC_T *in, RC_T c[4]); c0..c3 from the inputs
 * bench/alternatives.js supplies RC_START, NEWTON_STEPS, BISECT_TOL and the
 * spec's bracket RC_BRACKET_LO/HI.
 */
#if RC_F32
#define RC_SQRT sqrtf
#define RC_CBRT cbrtf
#define RC_ACOS acosf
#define RC_COS cosf
#define RC_C(x) x##f
#else
#define RC_SQRT sqrt
#define RC_CBRT cbrt
#define RC_ACOS acos
#define RC_COS cos
#define RC_C(x) x
#endif

RC_T m_emitted(const RC_T *in) __attribute__((noinline));
RC_T m_emitted(const RC_T *in) { return rc_emitted_call(in); }

/*
 * Cardano's formula for one real root, in the cancellation-free form
 * u = cbrt(-q/2 - sgn(q) sqrt(D)), t = u - p/(3u) (Press et al., Numerical
 * Recipes, 3rd ed., section 5.6); the trigonometric (Viete) form when D <= 0
 * (three real roots: the largest is taken). libm sqrt, cbrt, acos, cos.
 */
RC_T m_closed_form(const RC_T *in) __attribute__((noinline));
RC_T m_closed_form(const RC_T *in)
{
    RC_T c[4];
    RC_T a2, a1, a0, p, q, D, t;
    rc_coefficients(in, c);
    a2 = c[2] / c[3];
    a1 = c[1] / c[3];
    a0 = c[0] / c[3];
    p = a1 - a2 * a2 / RC_C(3.0);
    q = RC_C(2.0) * a2 * a2 * a2 / RC_C(27.0) - a2 * a1 / RC_C(3.0) + a0;
    D = q * q / RC_C(4.0) + p * p * p / RC_C(27.0);
    if (D > RC_C(0.0)) {
        RC_T s = RC_SQRT(D);
        RC_T u = RC_CBRT(RC_C(-0.5) * q - (q >= RC_C(0.0) ? s : -s));
        t = u - p / (RC_C(3.0) * u);
    } else {
        RC_T r = RC_SQRT(-p / RC_C(3.0));
        t = RC_C(2.0) * r * RC_COS(RC_ACOS(RC_C(-0.5) * q / (r * r * r)) / RC_C(3.0));
    }
    return t - a2 / RC_C(3.0);
}

static inline RC_T rc_newton(const RC_T *in, int steps)
{
    RC_T c[4];
    RC_T x = (RC_T)RC_START;
    int k;
    rc_coefficients(in, c);
    for (k = 0; k < steps; k++) x -= (((c[3] * x + c[2]) * x + c[1]) * x + c[0]) / ((RC_C(3.0) * c[3] * x + RC_C(2.0) * c[2]) * x + c[1]);
    return x;
}
RC_T m_newton_steps(const RC_T *in, int steps) __attribute__((noinline));
RC_T m_newton_steps(const RC_T *in, int steps) { return rc_newton(in, steps); }
RC_T m_newton(const RC_T *in) __attribute__((noinline));
RC_T m_newton(const RC_T *in) { return rc_newton(in, NEWTON_STEPS); }

RC_T m_bisection(const RC_T *in) __attribute__((noinline));
RC_T m_bisection(const RC_T *in)
{
    RC_T c[4];
    RC_T lo = (RC_T)RC_BRACKET_LO, hi = (RC_T)RC_BRACKET_HI, flo;
    rc_coefficients(in, c);
    flo = ((c[3] * lo + c[2]) * lo + c[1]) * lo + c[0];
    while (hi - lo > RC_C(2.0) * (RC_T)BISECT_TOL) {
        RC_T mid = RC_C(0.5) * (lo + hi);
        RC_T fm = ((c[3] * mid + c[2]) * mid + c[1]) * mid + c[0];
        if (mid == lo || mid == hi) break;
        if ((fm > RC_C(0.0)) == (flo > RC_C(0.0))) lo = mid; else hi = mid;
    }
    return RC_C(0.5) * (lo + hi);
}

#define RC_METHODS { { "emitted", m_emitted }, { "closed_form", m_closed_form }, { "newton", m_newton }, { "bisection", m_bisection } }
