/* bench_util.h - the helpers every benchmark program (tests/bench_*.c)
 * shares: a monotonic clock, the comparison for qsort of samples (medians,
 * min, max) and a 64-byte aligned allocation that stops the program when
 * memory runs out. Include after the program's feature-test macro
 * (clock_gettime needs _POSIX_C_SOURCE >= 199309L or _GNU_SOURCE). */
#ifndef MCD_BENCH_UTIL_H
#define MCD_BENCH_UTIL_H

#include <stdio.h>
#include <stdlib.h>
#include <time.h>

/* Seconds on the monotonic clock. */
static inline double now_s(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return (double)t.tv_sec + 1e-9 * (double)t.tv_nsec;
}

/* Ascending order of doubles, for qsort. */
static inline int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

/* n doubles on a 64-byte boundary (free with free); exits on failure. */
static inline double *dalloc(size_t n)
{
    void *p = aligned_alloc(64, (n * sizeof(double) + 63) / 64 * 64);
    if (p == NULL) {
        fprintf(stderr, "benchmark: out of memory (%zu doubles)\n", n);
        exit(1);
    }
    return p;
}

#endif
