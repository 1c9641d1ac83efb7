/* ease-in-out (CSS cubic-bezier(0.42, 0, 0.58, 1) inverted): a cubic in s, float32. */
#define RC_T float
#define RC_INPUTS 1
#define RC_RELATIVE 0
#define RC_F32 1
#include RC_HEADER

static float rc_emitted_call(const float *in) { return ease_in_out_param(in[0]); }
static void rc_coefficients(const float *in, float c[4])
{
    const float X1 = (float)RC_CONST_X1, X2 = (float)RC_CONST_X2;
    c[0] = -in[0];
    c[1] = 3.0f * X1;
    c[2] = 3.0f * X2 - 6.0f * X1;
    c[3] = 1.0f + 3.0f * X1 - 3.0f * X2;
}
#include "cubic.h"
