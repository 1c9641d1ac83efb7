/*
 * gas-molar-volume (van der Waals, nitrogen): P V^3 - (P b + Rg T) V^2 + a V - a b = 0
 * in float64, as written by hand. bench/alternatives.js supplies RC_HEADER,
 * RC_CONST_*, the bracket, RC_START, NEWTON_STEPS and BISECT_TOL.
 */
#define RC_T double
#define RC_INPUTS 2
#define RC_RELATIVE 1
#include RC_HEADER

#define VA ((double)RC_CONST_a)
#define VB ((double)RC_CONST_b)
#define RG ((double)RC_CONST_Rg)

double m_emitted(const double *in) __attribute__((noinline));
double m_emitted(const double *in) { return n2_molar_volume(in[0], in[1]); }

/*
 * Cardano's formula for the one real root (above the critical temperature),
 * in the cancellation-free form u = cbrt(-q/2 - sgn(q) sqrt(D)), t = u - p/(3u);
 * the trigonometric (Viete) form when D < 0 (three real roots: the largest,
 * the gas). libm sqrt, cbrt, acos, cos.
 */
double m_closed_form(const double *in) __attribute__((noinline));
double m_closed_form(const double *in)
{
    double P = in[0], T = in[1];
    double a2 = -(P * VB + RG * T) / P, a1 = VA / P, a0 = -VA * VB / P;
    double p = a1 - a2 * a2 / 3.0;
    double q = 2.0 * a2 * a2 * a2 / 27.0 - a2 * a1 / 3.0 + a0;
    double D = q * q / 4.0 + p * p * p / 27.0;
    double t;
    if (D > 0.0) {
        double s = sqrt(D);
        double u = cbrt(-0.5 * q - (q >= 0.0 ? s : -s));
        t = u - p / (3.0 * u);
    } else {
        double r = sqrt(-p / 3.0);
        t = 2.0 * r * cos(acos(-0.5 * q / (r * r * r)) / 3.0);
    }
    return t - a2 / 3.0;
}

static inline double newton(double P, double T, int steps)
{
    double c2 = -(P * VB + RG * T);
    double V = (double)RC_START;
    int k;
    for (k = 0; k < steps; k++) V -= (((P * V + c2) * V + VA) * V - VA * VB) / ((3.0 * P * V + 2.0 * c2) * V + VA);
    return V;
}
double m_newton_steps(const double *in, int steps) __attribute__((noinline));
double m_newton_steps(const double *in, int steps) { return newton(in[0], in[1], steps); }
double m_newton(const double *in) __attribute__((noinline));
double m_newton(const double *in) { return newton(in[0], in[1], NEWTON_STEPS); }

double m_bisection(const double *in) __attribute__((noinline));
double m_bisection(const double *in)
{
    double P = in[0], c2 = -(P * VB + RG * in[1]);
    double lo = (double)RC_BRACKET_LO, hi = (double)RC_BRACKET_HI;
    double flo = ((P * lo + c2) * lo + VA) * lo - VA * VB;
    while (hi - lo > 2.0 * (double)BISECT_TOL) {
        double mid = 0.5 * (lo + hi);
        double fm = ((P * mid + c2) * mid + VA) * mid - VA * VB;
        if (mid == lo || mid == hi) break;
        if ((fm > 0.0) == (flo > 0.0)) lo = mid; else hi = mid;
    }
    return 0.5 * (lo + hi);
}

#define RC_METHODS { { "emitted", m_emitted }, { "closed_form", m_closed_form }, { "newton", m_newton }, { "bisection", m_bisection } }
