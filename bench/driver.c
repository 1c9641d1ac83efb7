/*
 * npm run bench: the C side of bench/alternatives.js. One program per example:
 * the example's file in bench/alternatives/ defines RC_T, RC_INPUTS, RC_RELATIVE
 * and the methods (each an extern noinline function `RC_T m_NAME(const RC_T *in)`
 * so objdump and callgrind can find it, and so no call is inlined into the
 * timing loop); this file reads the sample points and runs one mode:
 *
 *   errors FILE         worst error of every method against the reference roots
 *                       in FILE, and of Newton with 1..40 steps (the step search)
 *   time FILE REPS      median ns per call over 11 runs of REPS sweeps of FILE,
 *                       independent calls (throughput) and dependent calls (latency)
 *   calls FILE METHOD   one call of METHOD per point (for callgrind)
 *
 * FILE: one point per line, RC_INPUTS input values then the reference root as
 * a double-double (hi lo), all as 17-digit decimals (exact round trip).
 * Errors are taken in long double (64-bit significand on x86-64), far finer
 * than any error measured here.
 */
#define _POSIX_C_SOURCE 200112L
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include RC_ALTERNATIVES

typedef RC_T (*rc_method)(const RC_T *in);
struct rc_entry {
    const char *name;
    rc_method fn;
};
static const struct rc_entry METHODS[] = RC_METHODS;
static const size_t METHOD_COUNT = sizeof METHODS / sizeof METHODS[0];

static size_t n_points;
static RC_T *inputs;
static long double *reference;

static void load(const char *file)
{
    FILE *f = fopen(file, "r");
    size_t cap = 1024;
    double v[RC_INPUTS + 2];
    int j;
    if (!f) { perror(file); exit(2); }
    inputs = malloc(cap * RC_INPUTS * sizeof *inputs);
    reference = malloc(cap * sizeof *reference);
    for (;;) {
        for (j = 0; j < RC_INPUTS + 2; j++) if (fscanf(f, "%lf", &v[j]) != 1) break;
        if (j == 0) break;
        if (j != RC_INPUTS + 2) { fprintf(stderr, "%s: short line %lu\n", file, (unsigned long)n_points + 1); exit(2); }
        if (n_points == cap) {
            cap *= 2;
            inputs = realloc(inputs, cap * RC_INPUTS * sizeof *inputs);
            reference = realloc(reference, cap * sizeof *reference);
        }
        for (j = 0; j < RC_INPUTS; j++) inputs[n_points * RC_INPUTS + j] = (RC_T)v[j];
        reference[n_points] = (long double)v[RC_INPUTS] + (long double)v[RC_INPUTS + 1];
        n_points++;
    }
    fclose(f);
}

static long double error_of(RC_T x, size_t i)
{
    long double e = fabsl((long double)x - reference[i]);
    if (RC_RELATIVE) e /= fabsl(reference[i]);
    if (x != x) e = INFINITY;
    return e;
}

static long double worst(rc_method fn, int steps)
{
    long double w = 0;
    size_t i;
    for (i = 0; i < n_points; i++) {
        RC_T x = fn ? fn(&inputs[i * RC_INPUTS]) : m_newton_steps(&inputs[i * RC_INPUTS], steps);
        long double e = error_of(x, i);
        if (!(e <= w)) w = e;
    }
    return w;
}

static int by_value(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

static RC_T (*volatile rc_fp)(const RC_T *in);
volatile RC_T rc_sink;

/*
 * Median ns per call over 11 runs of `reps` sweeps, in thread CPU time (so
 * time the process spends descheduled on a busy machine is not counted).
 * Throughput: the calls are independent, so the processor may overlap them.
 * Latency (dependent): each call's input waits for the previous result
 * (x + (y - y), which no compiler may fold without -ffinite-math-only), as in
 * a control loop whose next reading depends on the last output.
 */
static double median_ns(long reps, int dependent)
{
    double ns[11];
    int run;
    for (run = 0; run < 11; run++) {
        struct timespec t0, t1;
        long r;
        size_t i;
        int j;
        RC_T acc = 0, y = 0, in[RC_INPUTS];
        clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t0);
        for (r = 0; r < reps; r++)
            for (i = 0; i < n_points; i++) {
                if (dependent) {
                    for (j = 0; j < RC_INPUTS; j++) in[j] = inputs[i * RC_INPUTS + j] + (y - y);
                    y = rc_fp(in);
                } else {
                    acc += rc_fp(&inputs[i * RC_INPUTS]);
                }
            }
        clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t1);
        rc_sink = acc + y;
        ns[run] = ((t1.tv_sec - t0.tv_sec) * 1e9 + (t1.tv_nsec - t0.tv_nsec)) / ((double)reps * (double)n_points);
    }
    qsort(ns, 11, sizeof ns[0], by_value);
    return ns[5];
}

int main(int argc, char **argv)
{
    size_t m;
    if (argc < 3) { fprintf(stderr, "usage: %s errors|time|calls FILE [REPS|METHOD]\n", argv[0]); return 2; }
    load(argv[2]);
    if (strcmp(argv[1], "errors") == 0) {
        int k;
        for (m = 0; m < METHOD_COUNT; m++) printf("method %s %.6Le\n", METHODS[m].name, worst(METHODS[m].fn, 0));
        for (k = 1; k <= 40; k++) printf("newton_steps %d %.6Le\n", k, worst(NULL, k));
        return 0;
    }
    if (strcmp(argv[1], "time") == 0 && argc == 4) {
        long reps = atol(argv[3]);
        for (m = 0; m < METHOD_COUNT; m++) {
            rc_fp = METHODS[m].fn;
            printf("time %s %.3f %.3f %lu\n", METHODS[m].name, median_ns(reps, 0), median_ns(reps, 1), (unsigned long)(reps * n_points));
        }
        return 0;
    }
    if (strcmp(argv[1], "calls") == 0 && argc == 4) {
        size_t i;
        for (m = 0; m < METHOD_COUNT; m++) if (strcmp(METHODS[m].name, argv[3]) == 0) rc_fp = METHODS[m].fn;
        if (!rc_fp) { fprintf(stderr, "no method %s\n", argv[3]); return 2; }
        for (i = 0; i < n_points; i++) rc_sink = rc_fp(&inputs[i * RC_INPUTS]);
        return 0;
    }
    fprintf(stderr, "unknown mode %s\n", argv[1]);
    return 2;
}
