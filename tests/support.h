/* support.h - scaffolding shared by the test programs (tests/test_*.c and
 * tests/bench_flux.c). Header-only; include it after "mcdiff.h".
 *
 *  - random numbers: a generator whose state the caller holds (sup_rng),
 *    three fixed algorithms so that every file keeps the sequence it was
 *    written with, and a few draws built on them (uniform, log-uniform,
 *    mole fractions, binary diffusivity matrices, gradients);
 *  - relative differences and the largest magnitude of a vector;
 *  - guard values: fill an output with SUP_GUARD, check it is untouched;
 *    SUP_NAN and SUP_INF, the bad values the tests feed in, as doubles;
 *  - allocation counting (opt-in, see SUP_ALLOC_HOOK below);
 *  - sup_run: main()'s Check runner.
 *
 * Everything is static inline except the allocation counter, which
 * replaces malloc and its relatives and so exists only in the one file
 * that asks for it by defining SUP_ALLOC_HOOK before the #include.
 * A program that does not link Check (the benchmark) defines SUP_NO_CHECK
 * before the #include.
 */
#ifndef MCD_TESTS_SUPPORT_H
#define MCD_TESTS_SUPPORT_H

#include <math.h>
#include <stddef.h>
#include <stdint.h>
#include <stdlib.h>
#ifndef SUP_NO_CHECK
#include <check.h>
#endif

/* ------------------------------------------------------------------ */
/* Random numbers                                                       */
/* ------------------------------------------------------------------ */

/* The generators. Each file names the one its random cases were made
 * with; changing it (or a seed, or the order of the draws) changes the
 * cases.
 *  SUP_SPLITMIX64      the state advances by 0x9E3779B97F4A7C15 and is
 *                      then mixed (two xor-shift-multiply rounds); any
 *                      seed, 0 included, is fine.
 *  SUP_XORSHIFT64STAR  xorshift with shifts 12, 25, 27; the output is the
 *                      state times 0x2545F4914F6CDD1D. Seed must not be 0.
 *  SUP_XORSHIFT64      xorshift with shifts 13, 7, 17; the output is the
 *                      state itself. Seed must not be 0. */
typedef enum sup_gen {
    SUP_SPLITMIX64,
    SUP_XORSHIFT64STAR,
    SUP_XORSHIFT64
} sup_gen;

typedef struct sup_rng {
    uint64_t s;
    sup_gen gen;
} sup_rng;

/* Initializer: static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 1001); */
#define SUP_RNG(gen, seed)                                                     \
    {                                                                          \
        (uint64_t)(seed), (gen)                                                \
    }

/* Restart the generator's sequence from seed (the algorithm is kept). */
static inline void sup_seed(sup_rng *r, uint64_t seed) { r->s = seed; }

/* Next 64 random bits. */
static inline uint64_t sup_next(sup_rng *r)
{
    uint64_t z;
    switch (r->gen) {
    case SUP_SPLITMIX64:
        z = (r->s += 0x9E3779B97F4A7C15ull);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
        return z ^ (z >> 31);
    case SUP_XORSHIFT64STAR:
        r->s ^= r->s >> 12;
        r->s ^= r->s << 25;
        r->s ^= r->s >> 27;
        return r->s * 0x2545F4914F6CDD1Dull;
    case SUP_XORSHIFT64:
    default:
        r->s ^= r->s << 13;
        r->s ^= r->s >> 7;
        r->s ^= r->s << 17;
        return r->s;
    }
}

/* Uniform in [0, 1): the top 53 bits of one draw. */
static inline double sup_u01(sup_rng *r)
{
    return (double)(sup_next(r) >> 11) * 0x1p-53;
}

/* Uniform in [a, b). */
static inline double sup_range(sup_rng *r, double a, double b)
{
    return a + (b - a) * sup_u01(r);
}

/* 10^u with u uniform in [lo, hi): log-uniform over hi - lo decades. */
static inline double sup_decades(sup_rng *r, double lo, double hi)
{
    return pow(10.0, sup_range(r, lo, hi));
}

/* lo * ratio^u with u uniform in [0, 1): log-uniform in [lo, lo * ratio). */
static inline double sup_log_uniform(sup_rng *r, double lo, double ratio)
{
    return lo * exp(sup_u01(r) * log(ratio));
}

/* exp(u) with u uniform in [log a, log b): log-uniform in [a, b) (a
 * different rounding from sup_log_uniform, so a different sequence). */
static inline double sup_exp_range(sup_rng *r, double a, double b)
{
    return exp(sup_range(r, log(a), log(b)));
}

/* A molar mass log-uniform in [2e-3, 0.35) kg/mol (hydrogen to heavy
 * vapours). */
static inline double sup_molar_mass(sup_rng *r)
{
    return sup_log_uniform(r, 2e-3, 0.35 / 2e-3);
}

/* n mole fractions: lo + uniform [0, 1) each, then divided by their sum. */
static inline void sup_fractions(sup_rng *r, size_t n, double lo, double *x)
{
    double s = 0.0;
    for (size_t i = 0; i < n; i++) {
        x[i] = lo + sup_u01(r);
        s += x[i];
    }
    for (size_t i = 0; i < n; i++)
        x[i] /= s;
}

/* Symmetric n x n matrix (row-major) of binary diffusivities with a zero
 * diagonal; the upper triangle is drawn row by row, log-uniform over the
 * decades [lo, hi) (sup_decades). */
static inline void sup_dij_decades(sup_rng *r, size_t n, double *D, double lo,
                                   double hi)
{
    for (size_t i = 0; i < n; i++) {
        D[i * n + i] = 0.0;
        for (size_t j = i + 1; j < n; j++)
            D[i * n + j] = D[j * n + i] = sup_decades(r, lo, hi);
    }
}

/* The same with entries log-uniform in [lo, lo * ratio) (sup_log_uniform). */
static inline void sup_dij_log_uniform(sup_rng *r, size_t n, double *D,
                                       double lo, double ratio)
{
    for (size_t i = 0; i < n; i++) {
        D[i * n + i] = 0.0;
        for (size_t j = i + 1; j < n; j++)
            D[i * n + j] = D[j * n + i] = sup_log_uniform(r, lo, ratio);
    }
}

/* Gradients g[i * nd + d] of n species in nd directions, uniform in
 * [lo, hi), drawn direction by direction, then shifted so that each
 * direction has a zero mean over the species. */
static inline void sup_gradients_zero_mean(sup_rng *r, size_t n, size_t nd,
                                           double lo, double hi, double *g)
{
    for (size_t d = 0; d < nd; d++) {
        double m = 0.0;
        for (size_t i = 0; i < n; i++) {
            g[i * nd + d] = sup_range(r, lo, hi);
            m += g[i * nd + d];
        }
        m /= (double)n;
        for (size_t i = 0; i < n; i++)
            g[i * nd + d] -= m;
    }
}

/* ------------------------------------------------------------------ */
/* Differences                                                          */
/* ------------------------------------------------------------------ */

/* |a - b| / |b| */
static inline double sup_rel(double a, double b)
{
    return fabs(a - b) / fabs(b);
}

/* max |a_i| (0 for len 0) */
static inline double sup_max_abs(const double *a, size_t len)
{
    double m = 0.0;
    for (size_t i = 0; i < len; i++)
        if (fabs(a[i]) > m)
            m = fabs(a[i]);
    return m;
}

/* max_i |a_i - b_i| / max_i |b_i|, the denominator at least 1e-300: the
 * largest difference relative to the largest reference entry. */
static inline double sup_rel_diff(const double *a, const double *b, size_t len)
{
    double m = 0.0, s = sup_max_abs(b, len);
    if (s == 0.0)
        s = 1e-300;
    for (size_t i = 0; i < len; i++)
        if (fabs(a[i] - b[i]) / s > m)
            m = fabs(a[i] - b[i]) / s;
    return m;
}

/* ------------------------------------------------------------------ */
/* Guard values                                                         */
/* ------------------------------------------------------------------ */

/* Written into outputs before a call that must not touch them. */
#define SUP_GUARD 12345.678

/* A quiet NaN and +infinity as doubles. C's NAN and INFINITY are float
 * constants: with Clang, -Wdouble-promotion flags each use as a double. */
#define SUP_NAN ((double)NAN)
#define SUP_INF HUGE_VAL

static inline void sup_guard_fill(double *a, size_t len)
{
    for (size_t i = 0; i < len; i++)
        a[i] = SUP_GUARD;
}

/* 1 when every entry still holds SUP_GUARD. */
static inline int sup_guard_intact(const double *a, size_t len)
{
    for (size_t i = 0; i < len; i++)
        if (a[i] != SUP_GUARD)
            return 0;
    return 1;
}

/* ------------------------------------------------------------------ */
/* Allocation counting                                                  */
/* ------------------------------------------------------------------ */

/* With SUP_ALLOC_HOOK defined before the #include, on glibc and not under
 * AddressSanitizer, the program replaces malloc, calloc, realloc,
 * posix_memalign and free with versions that forward to glibc's __libc_*
 * entry points and count the calls made while the window is open.
 * SUP_HAVE_ALLOC_HOOK says whether the replacement is compiled in.
 * sup_alloc_close reports whether a probe allocation made inside the
 * window was counted, and a test asserts on the count only when it was
 * (under valgrind's memcheck it is: memcheck serves the __libc_* calls).
 *
 *   sup_alloc_open();
 *   ... calls that must not allocate (no Check assertion in here: Check
 *       allocates to report to its parent process) ...
 *   live = sup_alloc_close();   count in sup_alloc_count, the probe included
 */
#ifdef SUP_ALLOC_HOOK
#if defined(__GLIBC__) && !defined(__SANITIZE_ADDRESS__)
#define SUP_HAVE_ALLOC_HOOK 1
extern void *__libc_malloc(size_t size);
extern void *__libc_calloc(size_t n, size_t size);
extern void *__libc_realloc(void *p, size_t size);
extern void *__libc_memalign(size_t align, size_t size);
extern void __libc_free(void *p);
int posix_memalign(void **out, size_t align, size_t size); /* POSIX */
static volatile int sup_alloc_window;
static volatile long sup_alloc_count;
void *malloc(size_t size)
{
    if (sup_alloc_window)
        sup_alloc_count++;
    return __libc_malloc(size);
}
void *calloc(size_t n, size_t size)
{
    if (sup_alloc_window)
        sup_alloc_count++;
    return __libc_calloc(n, size);
}
void *realloc(void *p, size_t size)
{
    if (sup_alloc_window)
        sup_alloc_count++;
    return __libc_realloc(p, size);
}
int posix_memalign(void **out, size_t align, size_t size)
{
    void *p;
    if (sup_alloc_window)
        sup_alloc_count++;
    p = __libc_memalign(align, size);
    if (p == NULL)
        return 12; /* ENOMEM */
    *out = p;
    return 0;
}
void free(void *p) { __libc_free(p); }
#else
#define SUP_HAVE_ALLOC_HOOK 0
static volatile int sup_alloc_window;
static volatile long sup_alloc_count;
#endif

/* Zero the count and start counting. */
static inline void sup_alloc_open(void)
{
    sup_alloc_count = 0;
    sup_alloc_window = 1;
}

/* Make one probe allocation, stop counting, free the probe. Returns 1 when
 * the hook is compiled in and counted the probe (it is live), else 0. */
static inline int sup_alloc_close(void)
{
    void *volatile probe = malloc(16);
    int live = sup_alloc_count > 0;
    sup_alloc_window = 0;
    free(probe);
    return SUP_HAVE_ALLOC_HOOK && live;
}
#endif /* SUP_ALLOC_HOOK */

/* ------------------------------------------------------------------ */
/* main()                                                               */
/* ------------------------------------------------------------------ */

#ifndef SUP_NO_CHECK
/* Runs every test of s (Check takes its settings from the environment:
 * CK_FORK, CK_VERBOSITY, CK_RUN_CASE, ...), frees it, and returns the
 * program's exit status. */
static inline int sup_run(Suite *s)
{
    SRunner *sr = srunner_create(s);
    int failed;
    srunner_run_all(sr, CK_ENV);
    failed = srunner_ntests_failed(sr);
    srunner_free(sr);
    return failed == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}
#endif

#endif /* MCD_TESTS_SUPPORT_H */
