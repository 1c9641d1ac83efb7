/*
 * kiln-probe (Pt100, IEC 60751 Callendar-Van Dusen for 0..850 degC):
 * B T^2 + A T + c = 0 with c = 1 - R/R0, in float32, as a firmware developer
 * would write it by hand. bench/alternatives.js supplies RC_HEADER (the
 * emitted NAME.h), the spec's constants as RC_CONST_*, the bracket, RC_START
 * (the root at the box centre: the best fixed start), NEWTON_STEPS and
 * BISECT_TOL.
 */
#define RC_T float
#define RC_INPUTS 1
#define RC_RELATIVE 0
#include RC_HEADER

#define R0 ((float)RC_CONST_R0)
#define A ((float)RC_CONST_A)
#define B ((float)RC_CONST_B)

float m_emitted(const float *in) __attribute__((noinline));
float m_emitted(const float *in) { return kiln_probe_celsius(in[0]); }

/*
 * The quadratic formula in its cancellation-free form (Press et al.,
 * Numerical Recipes, 3rd ed., section 5.6): q = -(A + sgn(A) sqrt(D)) / 2,
 * roots q/B and c/q; the wanted root (near -c/A) is c/q. sqrtf from libm.
 */
float m_closed_form(const float *in) __attribute__((noinline));
float m_closed_form(const float *in)
{
    float c = 1.0f - in[0] / R0;
    float q = -0.5f * (A + sqrtf(A * A - 4.0f * B * c));
    return c / q;
}

/* Newton's method, a fixed number of steps from a fixed start. */
static inline float newton(float R, int steps)
{
    float c = 1.0f - R / R0;
    float T = (float)RC_START;
    int k;
    for (k = 0; k < steps; k++) T -= ((B * T + A) * T + c) / (2.0f * B * T + A);
    return T;
}
float m_newton_steps(const float *in, int steps) __attribute__((noinline));
float m_newton_steps(const float *in, int steps) { return newton(in[0], steps); }
float m_newton(const float *in) __attribute__((noinline));
float m_newton(const float *in) { return newton(in[0], NEWTON_STEPS); }

/* Bisection on the spec's bracket until it is narrower than 2 * BISECT_TOL; returns the midpoint. */
float m_bisection(const float *in) __attribute__((noinline));
float m_bisection(const float *in)
{
    float c = 1.0f - in[0] / R0;
    float lo = (float)RC_BRACKET_LO, hi = (float)RC_BRACKET_HI;
    float flo = (B * lo + A) * lo + c;
    while (hi - lo > 2.0f * (float)BISECT_TOL) {
        float mid = 0.5f * (lo + hi);
        float fm = (B * mid + A) * mid + c;
        if (mid == lo || mid == hi) break;
        if ((fm > 0.0f) == (flo > 0.0f)) lo = mid; else hi = mid;
    }
    return 0.5f * (lo + hi);
}

#define RC_METHODS { { "emitted", m_emitted }, { "closed_form", m_closed_form }, { "newton", m_newton }, { "bisection", m_bisection } }
