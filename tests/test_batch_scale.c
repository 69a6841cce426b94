/* test_batch_scale.c - the batched exact fluxes scale with the binary
 * diffusivities: J(2^k Đ) = 2^k J(Đ).
 *
 * Identity: the Maxwell-Stefan equations sum_j (x_i J_j - x_j J_i) /
 * (c Đ_ij) = d_i are linear in 1/Đ, so scaling every Đ_ij by lambda
 * scales every flux by lambda (Taylor and Krishna 1993, Multicomponent
 * Mass Transfer, ch. 2, for the equations). With lambda a power of two
 * every step of the batched solve scales exactly in binary arithmetic,
 * except where the kernel takes a different path for the scaled values:
 * on AVX-512 the reciprocal pivots of the factorisation (N <= 5) come from
 * an estimate refined by Newton steps when every pivot of a block lies in
 * [2^-1000, 2^1000] and from a division otherwise (kernel_ldl.h). Scales
 * 2^-990 and 2^1020 push every pivot out of that range, 2^-60 and 2^60
 * keep it inside, so the check compares the two paths; the tolerance
 * 1e-13 relative to the largest flux of each cell is the bound the kernel
 * promises for that change (a few ulp per reciprocal on systems with
 * condition ~1e2..1e4, Đ within a factor 20). Under MCDIFF_KERNEL_ISA=v3
 * and v1 both sides divide and the identity holds to the same bound.
 * Cells: N = 2..6 and 10, 37 cells (four full 8-lane blocks and a tail),
 * mole basis in and out, 3 directions, some cells with a trace species
 * (x_i = 0).
 */
#include <check.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

static sup_rng rng = SUP_RNG(SUP_SPLITMIX64, 0x5CA1E);

#define KC 37
#define NMAX 10

/* Random cells (SoA, stride KC): x >= 0.05 (or one trace species in every
 * fifth cell), symmetric Đ in [2e-6, 4e-5) m^2/s, gradients in [-1, 1)
 * summing to zero, c in [20, 60) mol/m^3. */
static void make_cells(size_t n, double *x, double *D, double *g, double *c)
{
    size_t k, i, j, d;
    for (k = 0; k < KC; k++) {
        double s = 0.0;
        for (i = 0; i < n; i++) {
            x[i * KC + k] =
                k % 5 == 1 && i == n - 1 ? 0.0 : sup_range(&rng, 0.05, 1);
            s += x[i * KC + k];
        }
        for (i = 0; i < n; i++)
            x[i * KC + k] /= s;
        for (i = 0; i < n; i++)
            for (j = 0; j <= i; j++) {
                const double v = i == j ? 1e-5 : sup_range(&rng, 2e-6, 4e-5);
                D[(i * n + j) * KC + k] = D[(j * n + i) * KC + k] = v;
            }
        for (d = 0; d < 3; d++) {
            double m = 0.0;
            for (i = 0; i < n; i++) {
                g[(i * 3 + d) * KC + k] = sup_range(&rng, -1.0, 1.0);
                m += g[(i * 3 + d) * KC + k];
            }
            for (i = 0; i < n; i++)
                g[(i * 3 + d) * KC + k] -= m / (double)n;
        }
        c[k] = sup_range(&rng, 20.0, 60.0);
    }
}

static void fluxes(mcd_workspace *ws, size_t n, const double *D,
                   const double *c, const double *x, const double *g, double *J)
{
    ck_assert_msg(mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, n, NULL, D,
                                     c,
                                     &(mcd_cells){.n_cells = KC,
                                                  .n_dim = 3,
                                                  .comp_basis = MCD_BASIS_MOLE,
                                                  .comp = x,
                                                  .grad = g},
                                     MCD_BASIS_MOLE, J) == MCD_OK,
                  "N=%zu: %s", n, mcd_last_error());
}

START_TEST(batch_exact_fluxes_scale_with_the_diffusivities)
{
    static const size_t Ns[] = {2, 3, 4, 5, 6, 10};
    static const int ks[] = {-990, -60, 60, 1020};
    static double x[NMAX * KC], D[NMAX * NMAX * KC], Ds[NMAX * NMAX * KC],
        g[3 * NMAX * KC], c[KC], J0[3 * NMAX * KC], J[3 * NMAX * KC];
    double worst = 0.0;
    mcd_workspace *ws;
    size_t ni, ki, n, q, k;
    ck_assert_int_eq(mcd_workspace_new(NMAX, &ws), MCD_OK);
    for (ni = 0; ni < sizeof Ns / sizeof Ns[0]; ni++) {
        n = Ns[ni];
        make_cells(n, x, D, g, c);
        fluxes(ws, n, D, c, x, g, J0);
        for (ki = 0; ki < sizeof ks / sizeof ks[0]; ki++) {
            const double lam = ldexp(1.0, ks[ki]);
            for (q = 0; q < n * n * KC; q++)
                Ds[q] = D[q] * lam;
            fluxes(ws, n, Ds, c, x, g, J);
            for (k = 0; k < KC; k++) {
                double big = 0.0, e = 0.0;
                for (q = 0; q < 3 * n; q++)
                    big = fmax(big, fabs(J0[q * KC + k]));
                ck_assert(big > 0.0);
                /* J / lambda is exact (a power of two, no underflow) */
                for (q = 0; q < 3 * n; q++)
                    e = fmax(e, fabs(J[q * KC + k] / lam - J0[q * KC + k]));
                e /= big;
                if (e > worst)
                    worst = e;
                ck_assert_msg(e <= 1e-13, "N=%zu scale 2^%d cell %zu: %.3g", n,
                              ks[ki], k, e);
            }
        }
    }
    fprintf(stderr, "batch_scale: largest relative difference %.3g\n", worst);
    mcd_workspace_free(ws);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:batch_scale");
    TCase *tc = tcase_create("batch_scale");
    tcase_add_test(tc, batch_exact_fluxes_scale_with_the_diffusivities);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
