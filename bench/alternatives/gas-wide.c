/* gas-wide (van der Waals, nitrogen, wider box): P V^3 - (P b + Rg T) V^2 + a V - a b = 0, float32. */
#define RC_T float
#define RC_INPUTS 2
#define RC_RELATIVE 1
#define RC_F32 1
#include RC_HEADER

static float rc_emitted_call(const float *in) { return n2_molar_volume_wide(in[0], in[1]); }
static void rc_coefficients(const float *in, float c[4])
{
    const float a = (float)RC_CONST_a, b = (float)RC_CONST_b, Rg = (float)RC_CONST_Rg;
    c[0] = -a * b;
    c[1] = a;
    c[2] = -(in[0] * b + Rg * in[1]);
    c[3] = in[0];
}
#include "cubic.h"
