/* spring-scale (a stiffening spring, k x + k3 x^3 = F): a cubic in x, float32. */
#define RC_T float
#define RC_INPUTS 1
#define RC_RELATIVE 0
#define RC_F32 1
#include RC_HEADER

static float rc_emitted_call(const float *in) { return spring_deflection_mm(in[0]); }
static void rc_coefficients(const float *in, float c[4])
{
    c[0] = -in[0];
    c[1] = (float)RC_CONST_k;
    c[2] = 0.0f;
    c[3] = (float)RC_CONST_k3;
}
#include "cubic.h"
