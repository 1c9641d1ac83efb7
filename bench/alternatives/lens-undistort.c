/*
 * lens-undistort (radial model r_d = r (1 + k1 r^2 + k2 r^4)): the quintic
 * k2 r^5 + k1 r^3 + r - rd = 0 in float32. A quintic has no closed form in
 * radicals (Abel-Ruffini), so only Newton and bisection are compared.
 * bench/alternatives.js supplies RC_HEADER, RC_START, NEWTON_STEPS, BISECT_TOL.
 */
#define RC_T float
#define RC_INPUTS 3
#define RC_RELATIVE 0
#include RC_HEADER

/* The spec has no bracket: f(0) = -rd <= 0 and f(0.8) >= 0.8 - 0.1*0.512 - 0.02*0.328 - 0.7 > 0 over the box. */
#define LENS_LO 0.0f
#define LENS_HI 0.8f

float m_emitted(const float *in) __attribute__((noinline));
float m_emitted(const float *in) { return lens_undistort_radius(in[0], in[1], in[2]); }

static inline float newton(float rd, float k1, float k2, int steps)
{
    float r = (float)RC_START;
    int k;
    for (k = 0; k < steps; k++) {
        float r2 = r * r;
        r -= (((k2 * r2 + k1) * r2 + 1.0f) * r - rd) / ((5.0f * k2 * r2 + 3.0f * k1) * r2 + 1.0f);
    }
    return r;
}
float m_newton_steps(const float *in, int steps) __attribute__((noinline));
float m_newton_steps(const float *in, int steps) { return newton(in[0], in[1], in[2], steps); }
float m_newton(const float *in) __attribute__((noinline));
float m_newton(const float *in) { return newton(in[0], in[1], in[2], NEWTON_STEPS); }

float m_bisection(const float *in) __attribute__((noinline));
float m_bisection(const float *in)
{
    float rd = in[0], k1 = in[1], k2 = in[2];
    float lo = LENS_LO, hi = LENS_HI;
    float flo = -rd;
    while (hi - lo > 2.0f * (float)BISECT_TOL) {
        float mid = 0.5f * (lo + hi), m2 = mid * mid;
        float fm = ((k2 * m2 + k1) * m2 + 1.0f) * mid - rd;
        if (mid == lo || mid == hi) break;
        if ((fm > 0.0f) == (flo > 0.0f)) lo = mid; else hi = mid;
    }
    return 0.5f * (lo + hi);
}

#define RC_METHODS { { "emitted", m_emitted }, { "newton", m_newton }, { "bisection", m_bisection } }
