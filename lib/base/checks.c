/* checks.c - the argument checks of the calls that take a workspace.
 *
 * One wording everywhere: "argument <name>: <what is wrong>", entries
 * named by index ("entry 3", "entry (0,2)") and, in batched calls, the
 * message prefixed by "cell <k>: " (lib/batch.c). The status and the
 * message are set together by mcdi_fail. Every check writes nothing
 * but the message; kernels do no validation.
 */
#include <float.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/workspace.h"
#include "base/composition.h"
#include "base/checks.h"
#include "base/isa.h"

#if defined(MCDI_HAVE_KISA)
#include <immintrin.h>
#include <stdint.h>
#endif

int mcdi_M_span_ok(size_t n, const double *M)
{
    double lo = M[0], hi = M[0];
    size_t i;
    for (i = 1; i < n; i++) {
        lo = M[i] < lo ? M[i] : lo;
        hi = M[i] > hi ? M[i] : hi;
    }
    return hi <= MCDI_M_SPAN * lo;
}

mcd_status mcdi_check_ptr(mcd_workspace *ws, const void *p, const char *name)
{
    if (p == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    return MCD_OK;
}

mcd_status mcdi_check_ptrs(size_t count, const void *const *p,
                           const char *const *names)
{
    size_t k;
    for (k = 0; k < count; k++)
        if (p[k] == NULL)
            return mcdi_fail(MCD_EINVAL, "argument %s: NULL", names[k]);
    return MCD_OK;
}

mcd_status mcdi_check_species(mcd_workspace *ws, size_t n, size_t lo,
                              int max_is_einval, const char *name)
{
    if (n < lo || (max_is_einval && n > MCD_MAX_SPECIES))
        return mcdi_fail(MCD_EINVAL, "argument %s: %zu is not in %zu..%d", name,
                         n, lo, MCD_MAX_SPECIES);
    if (n > ws->cap)
        return mcdi_fail(MCD_EBADLEN,
                         "argument %s: %zu exceeds the workspace "
                         "capacity %zu",
                         name, n, ws->cap);
    return MCD_OK;
}

mcd_status mcdi_check_dim(mcd_workspace *ws, size_t nd)
{
    if (nd < 1 || nd > MCD_MAX_DIM)
        return mcdi_fail(MCD_EINVAL, "argument n_dim: %zu is not in 1..%d", nd,
                         MCD_MAX_DIM);
    return MCD_OK;
}

mcd_status mcdi_check_basis(mcd_workspace *ws, mcd_basis b, const char *name)
{
    if (b != MCD_BASIS_MOLE && b != MCD_BASIS_MASS)
        return mcdi_fail(MCD_EINVAL, "argument %s: unknown value %d", name,
                         (int)b);
    return MCD_OK;
}

mcd_status mcdi_check_model(mcd_workspace *ws, mcd_model model,
                            int iterative_ok)
{
    if (model != MCD_MODEL_MAXWELL_STEFAN &&
        model != MCD_MODEL_MIXTURE_AVERAGED &&
        !(iterative_ok && model == MCD_MODEL_ITERATIVE))
        return mcdi_fail(MCD_EINVAL, "argument model: unknown value %d",
                         (int)model);
    return MCD_OK;
}

mcd_status mcdi_check_positive(mcd_workspace *ws, double v, const char *name)
{
    if (!mcdi_finite(v))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite", name);
    if (!(v > 0))
        return mcdi_fail(MCD_EDOM, "argument %s: %g is not > 0", name, v);
    return MCD_OK;
}

mcd_status mcdi_check_positive2(double a, const char *name_a, double b,
                                const char *name_b)
{
    if (!mcdi_finite(a) || !mcdi_finite(b))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite",
                         mcdi_finite(a) ? name_b : name_a);
    if (!(a > 0) || !(b > 0))
        return mcdi_fail(MCD_EDOM, "argument %s: %g is not > 0",
                         a > 0 ? name_b : name_a, a > 0 ? b : a);
    return MCD_OK;
}

/* The rule of every pair (a, b) = (Dij(i,j), Dij(j,i)), i < j: both
 * finite and normal positive numbers (>= DBL_MIN) and equal to
 * MCDI_DIJ_SYM_TOL relative, |a - b| <= MCDI_DIJ_SYM_TOL max(a, b). One
 * branch-free pass over the pairs. */
static int dij_all_good_scalar(size_t n, const double *Dij)
{
    int good = 1;
    size_t i, j;
    for (i = 0; i < n; i++)
        for (j = i + 1; j < n; j++) {
            const double a = Dij[i * n + j], b = Dij[j * n + i];
            const double big = a > b ? a : b;
            good &= (a >= DBL_MIN) & (b >= DBL_MIN) & (big <= DBL_MAX) &
                    (fabs(a - b) <= MCDI_DIJ_SYM_TOL * big);
        }
    return good;
}

#if defined(MCDI_HAVE_KISA)
/* The same rule four pairs at a time with AVX2 (x86-64 GCC builds, used
 * where base/isa.c chose v3 or v4). Per pair |a - b| <= tol max(a, b)
 * (a NaN makes |a - b| NaN: the test fails, whatever max returns), and
 * the range tests once at the end on the smallest and the largest entry
 * seen (a NaN has already failed; min and max of the others are exact).
 * Row i of the upper triangle (contiguous) is tested against column i
 * (strided); the last step of a row starts at n - 4 and may repeat
 * entries. The last three rows (six pairs among the last four species)
 * are two gathered vectors. The scalar pass was 15 % of mcd_flux_compute
 * at N = 10. */
__attribute__((target("avx2"))) static int dij_all_good_v3(size_t n,
                                                           const double *Dij)
{
    const __m256d tol = _mm256_set1_pd(MCDI_DIJ_SYM_TOL);
    const __m256d absm = _mm256_castsi256_pd(_mm256_set1_epi64x(INT64_MAX));
    __m256d lo = _mm256_set1_pd(DBL_MAX), hi = _mm256_setzero_pd();
    __m256d ok = _mm256_castsi256_pd(_mm256_set1_epi64x(-1));
    const size_t q = n - 4;
    size_t i, j;
#define DIJ_PAIRS4(a, b)                                                       \
    do {                                                                       \
        const __m256d big_ = _mm256_max_pd(a, b);                              \
        const __m256d d_ = _mm256_and_pd(_mm256_sub_pd(a, b), absm);           \
        ok = _mm256_and_pd(                                                    \
            ok, _mm256_cmp_pd(d_, _mm256_mul_pd(tol, big_), _CMP_LE_OQ));      \
        lo = _mm256_min_pd(lo, _mm256_min_pd(a, b));                           \
        hi = _mm256_max_pd(hi, big_);                                          \
    } while (0)
#define D_(r, c) Dij[(r)*n + (c)]
    for (i = 0; i < q; i++) {
        const double *Ri = Dij + i * n, *Ci = Dij + i;
        for (j = i + 1; j < n; j += 4) {
            const size_t s = j + 4 <= n ? j : q;
            const __m256d a = _mm256_loadu_pd(Ri + s);
            const __m256d b = _mm256_set_pd(Ci[(s + 3) * n], Ci[(s + 2) * n],
                                            Ci[(s + 1) * n], Ci[s * n]);
            DIJ_PAIRS4(a, b);
        }
    }
    {
        const __m256d a1 = _mm256_set_pd(D_(q + 1, q + 2), D_(q, q + 3),
                                         D_(q, q + 2), D_(q, q + 1));
        const __m256d b1 = _mm256_set_pd(D_(q + 2, q + 1), D_(q + 3, q),
                                         D_(q + 2, q), D_(q + 1, q));
        const __m256d a2 = _mm256_set_pd(D_(q + 2, q + 3), D_(q + 2, q + 3),
                                         D_(q + 2, q + 3), D_(q + 1, q + 3));
        const __m256d b2 = _mm256_set_pd(D_(q + 3, q + 2), D_(q + 3, q + 2),
                                         D_(q + 3, q + 2), D_(q + 3, q + 1));
        DIJ_PAIRS4(a1, b1);
        DIJ_PAIRS4(a2, b2);
    }
#undef D_
#undef DIJ_PAIRS4
    ok = _mm256_and_pd(ok,
                       _mm256_cmp_pd(lo, _mm256_set1_pd(DBL_MIN), _CMP_GE_OQ));
    ok = _mm256_and_pd(ok,
                       _mm256_cmp_pd(hi, _mm256_set1_pd(DBL_MAX), _CMP_LE_OQ));
    return _mm256_movemask_pd(ok) == 0xF;
}
#endif

/* Whether every pair passes (the caller's data almost always do; the
 * loops of dij_locate then only name the first failure). */
static int dij_all_good(size_t n, const double *Dij)
{
#if defined(MCDI_HAVE_KISA)
    if (n >= 5 && mcdi_isa() >= 3)
        return dij_all_good_v3(n, Dij);
#endif
    return dij_all_good_scalar(n, Dij);
}

/* The first broken rule of an n x n Dij whose entry (i,j) is at
 * Dij[(i n + j) s], with its message (MCD_OK if none). */
static mcd_status dij_locate(mcd_workspace *ws, size_t n, const double *Dij,
                             size_t s, int upper)
{
    size_t i, j;
#define DIJ(i, j) Dij[((i)*n + (j)) * s]
/* the entries read: off the diagonal, or above it only (upper) */
#define READ(i, j) ((i) != (j) && (!upper || (j) > (i)))
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            if (READ(i, j) && !mcdi_finite(DIJ(i, j)))
                return mcdi_fail(MCD_EINVAL,
                                 "argument Dij: entry (%zu,%zu) is not finite",
                                 i, j);
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            if (READ(i, j) && !(DIJ(i, j) > 0.0))
                return mcdi_fail(
                    MCD_EDOM, "argument Dij: entry (%zu,%zu) = %g is not > 0",
                    i, j, DIJ(i, j));
    /* a positive subnormal Đ: 1/Đ overflows, and the single-state and
     * batched paths failed differently on it (OK with -0 fluxes against
     * ESING); both reject it here */
    for (i = 0; i < n; i++)
        for (j = 0; j < n; j++)
            if (READ(i, j) && !(DIJ(i, j) >= DBL_MIN))
                return mcdi_fail(MCD_EDOM,
                                 "argument Dij: entry (%zu,%zu) = %g is "
                                 "subnormal (< DBL_MIN; 1/Dij overflows)",
                                 i, j, DIJ(i, j));
    for (i = 0; i < n && !upper; i++)
        for (j = i + 1; j < n; j++) {
            double a = DIJ(i, j), b = DIJ(j, i);
            double big = a > b ? a : b;
            if (!(fabs(a - b) <= MCDI_DIJ_SYM_TOL * big))
                return mcdi_fail(MCD_EDOM,
                                 "argument Dij: entries (%zu,%zu) = %.17g and "
                                 "(%zu,%zu) = %.17g differ by more than 1e-12 "
                                 "relative (not symmetric)",
                                 i, j, a, j, i, b);
        }
#undef READ
#undef DIJ
    return MCD_OK;
}

mcd_status mcdi_check_dij(mcd_workspace *ws, size_t n, const double *Dij)
{
    if (Dij == NULL)
        return mcdi_fail(MCD_EINVAL, "argument Dij: NULL");
    if (dij_all_good(n, Dij))
        return MCD_OK;
    return dij_locate(ws, n, Dij, 1, 0);
}

mcd_status mcdi_check_dij_strided(mcd_workspace *ws, size_t n,
                                  const double *Dij, size_t stride)
{
    return dij_locate(ws, n, Dij, stride, 0);
}

mcd_status mcdi_check_dij_upper_strided(mcd_workspace *ws, size_t n,
                                        const double *Dij, size_t stride)
{
    return dij_locate(ws, n, Dij, stride, 1);
}

/* The first broken rule of fractions y[i s] (the order of
 * mcdi_comp_check: non-finite, negative, sum), with its message. */
static mcd_status comp_locate(mcd_workspace *ws, size_t n, const double *y,
                              size_t s, const char *name)
{
    double sum = 0.0;
    size_t i;
    for (i = 0; i < n; i++)
        if (!mcdi_finite(y[i * s]))
            return mcdi_fail(MCD_EINVAL, "argument %s: entry %zu is not finite",
                             name, i);
    for (i = 0; i < n; i++)
        if (!(y[i * s] >= 0.0))
            return mcdi_fail(MCD_EDOM,
                             "argument %s: entry %zu = %g is negative", name, i,
                             y[i * s]);
    for (i = 0; i < n; i++)
        sum += y[i * s];
    /* "1e-6" is MCD_SUM_TOL, written out for a readable message */
    if (!(fabs(sum - 1.0) <= MCD_SUM_TOL))
        return mcdi_fail(
            MCD_EDOM, "argument %s: sum %.10g differs from 1 by more than 1e-6",
            name, sum);
    return MCD_OK;
}

mcd_status mcdi_check_comp(mcd_workspace *ws, size_t n, const double *y,
                           const char *name)
{
    double s = 0.0;
    int good = 1;
    size_t i;
    if (y == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    /* one branch-free pass for the usual case (every entry finite and
     * >= 0, sum within MCD_SUM_TOL of 1) */
    for (i = 0; i < n; i++) {
        good &= (y[i] >= 0.0) & (y[i] <= DBL_MAX);
        s += y[i];
    }
    if (good & (fabs(s - 1.0) <= MCD_SUM_TOL))
        return MCD_OK;
    return comp_locate(ws, n, y, 1, name);
}

mcd_status mcdi_check_comp_strided(mcd_workspace *ws, size_t n, const double *y,
                                   size_t stride, const char *name)
{
    return comp_locate(ws, n, y, stride, name);
}

mcd_status mcdi_check_M(mcd_workspace *ws, size_t n, const double *M)
{
    size_t i;
    mcd_status st;
    if (M == NULL)
        return mcdi_fail(MCD_EINVAL,
                         "argument M: NULL but needed (mass basis or "
                         "pressure diffusion)");
    st = mcdi_comp_check_M(n, M);
    if (st == MCD_OK) {
        if (mcdi_M_span_ok(n, M))
            return MCD_OK;
        return mcdi_fail(MCD_EDOM,
                         "argument M: the molar masses span more than a "
                         "factor 1e12 (the basis conversions would lose "
                         "all precision)");
    }
    for (i = 0; i < n; i++)
        if (!mcdi_finite(M[i]))
            return mcdi_fail(st, "argument M: entry %zu is not finite", i);
    for (i = 0; i < n; i++)
        if (!(M[i] > 0.0))
            return mcdi_fail(st, "argument M: entry %zu = %g is not > 0", i,
                             M[i]);
    return mcdi_fail(st, "argument M: invalid");
}

/* The first non-finite entry (i,k) of p[(i cols + k) s], named. */
static mcd_status finite_locate(mcd_workspace *ws, size_t rows, size_t cols,
                                const double *p, size_t s, const char *name)
{
    size_t i, k;
    for (i = 0; i < rows; i++)
        for (k = 0; k < cols; k++)
            if (!mcdi_finite(p[(i * cols + k) * s]))
                return mcdi_fail(MCD_EINVAL,
                                 "argument %s: entry (%zu,%zu) is not finite",
                                 name, i, k);
    return MCD_OK;
}

mcd_status mcdi_check_finite(mcd_workspace *ws, size_t rows, size_t cols,
                             const double *p, const char *name)
{
    size_t i;
    double acc[4] = {0.0, 0.0, 0.0, 0.0};
    if (p == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    /* p * 0 is 0 for finite p and NaN for inf or NaN: one branch-free
     * pass, four independent sums rather than one chain (terms 0 or NaN:
     * the order does not matter); the loop below only names the entry */
    for (i = 0; i + 4 <= rows * cols; i += 4) {
        acc[0] += p[i] * 0.0;
        acc[1] += p[i + 1] * 0.0;
        acc[2] += p[i + 2] * 0.0;
        acc[3] += p[i + 3] * 0.0;
    }
    for (; i < rows * cols; i++)
        acc[0] += p[i] * 0.0;
    if ((acc[0] + acc[1]) + (acc[2] + acc[3]) == 0.0)
        return MCD_OK;
    return finite_locate(ws, rows, cols, p, 1, name);
}

/* The first non-finite entry i of p[i s], named "entry i". */
static mcd_status vec_locate(size_t n, const double *p, size_t s,
                             const char *name)
{
    size_t i;
    for (i = 0; i < n; i++)
        if (!mcdi_finite(p[i * s]))
            return mcdi_fail(MCD_EINVAL, "argument %s: entry %zu is not finite",
                             name, i);
    return MCD_OK;
}

mcd_status mcdi_check_finite_vec(mcd_workspace *ws, size_t n, const double *p,
                                 const char *name)
{
    if (p == NULL)
        return mcdi_fail(MCD_EINVAL, "argument %s: NULL", name);
    return vec_locate(n, p, 1, name);
}

mcd_status mcdi_check_finite_vec_strided(mcd_workspace *ws, size_t n,
                                         const double *p, size_t stride,
                                         const char *name)
{
    (void)ws;
    return vec_locate(n, p, stride, name);
}

mcd_status mcdi_check_finite_strided(mcd_workspace *ws, size_t rows,
                                     size_t cols, const double *p,
                                     size_t stride, const char *name)
{
    return finite_locate(ws, rows, cols, p, stride, name);
}

mcd_status mcdi_check_thermal(mcd_workspace *ws, size_t n, size_t nd,
                              const double *kT, const double *grad_lnT)
{
    if (kT == NULL && grad_lnT == NULL)
        return MCD_OK;
    if (kT == NULL || grad_lnT == NULL)
        return mcdi_fail(MCD_EINVAL,
                         "argument %s: NULL while %s is given (thermal "
                         "diffusion needs both)",
                         kT == NULL ? "kT" : "grad_lnT",
                         kT == NULL ? "grad_lnT" : "kT");
    return mcdi_check_thermal_strided(ws, n, nd, kT, grad_lnT, 1);
}

mcd_status mcdi_check_thermal_strided(mcd_workspace *ws, size_t n, size_t nd,
                                      const double *kT, const double *grad_lnT,
                                      size_t stride)
{
    mcd_status st = vec_locate(n, kT, stride, "kT");
    if (st != MCD_OK)
        return st;
    return finite_locate(ws, 1, nd, grad_lnT, stride, "grad_lnT");
}

mcd_status mcdi_check_conc(mcd_workspace *ws, double c, const char *name)
{
    if (!mcdi_finite(c))
        return mcdi_fail(MCD_EINVAL, "argument %s: not finite", name);
    /* A subnormal c (< DBL_MIN) is rejected: the fluxes would underflow
     * unevenly and lose the zero-sum. */
    if (!(c >= DBL_MIN))
        return mcdi_fail(MCD_EDOM,
                         "argument %s: %g is not a normal positive number",
                         name, c);
    return MCD_OK;
}
