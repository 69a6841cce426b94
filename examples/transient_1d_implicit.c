/* transient_1d_implicit.c - the 1-D transient diffusion-reaction problem
 * of transient_1d.c (fv1d.c: invented scenario, DEMO ONLY) solved
 * implicitly: backward Euler in time, Newton's method on every step with
 * the flux derivatives from the library, next to the explicit solution.
 *
 * Unknowns: the mole fractions x_ik of every cell at the new time level.
 * Residual of cell k (a = dt / (c dz)):
 *   R_k = x_k - x_k^old - a (J_{k-1/2} - J_{k+1/2}) - dt nu r_k / c,
 * with the face flux J_f = J(x_f, g_f) of mcd_flux_compute at
 * x_f = (x_L + x_R)/2, g_f = (x_R - x_L)/dz (exact Maxwell-Stefan). Its
 * derivatives: dJ/dx from mcd_flux_jacobian (the derivative of what
 * mcd_flux_compute returns, its renormalisation x / sum x included), and
 * dJ/dg, linear in g,
 * column j = the flux for the unit gradient e_j (one mcd_flux_compute
 * each), so
 *   dJ_f/dx_L = A_f / 2 - G_f / dz,   dJ_f/dx_R = A_f / 2 + G_f / dz.
 * The Newton matrix is block tridiagonal (N x N blocks); it is solved by
 * block elimination with partially pivoted 5 x 5 solves. Newton stops
 * when the largest update is below 1e-12.
 *
 * Checks (exit 1 when one fails): the implicit run takes at least 50 times
 * fewer steps than the explicit stability limit allows; its final mole
 * fractions agree with the explicit run's within the stated tolerance
 * (TOL below: backward Euler is first order, its error at these steps is
 * a few 1e-4: 5.3e-4 at 50x with 40 cells, measured and printed); halving its step halves the
 * difference (first order, within 40 %); every cell sums to 1 and the
 * element inventories are kept to round-off.
 *
 * Usage: transient_1d_implicit [--cells N] [--ratio R]
 *   --cells N  cells (default 40); --ratio R  implicit step / explicit
 *   stable step (default 50, at least 50).
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "fv1d.h"

#define NS FV1D_NS
#define TOL 2e-3 /* |x_implicit - x_explicit| at t_end, see above */

static int failed(const char *what, mcd_status st)
{
    if (st == MCD_OK)
        return 0;
    fprintf(stderr, "transient_1d_implicit: %s: %s (%s)\n", what,
            mcd_status_string((int)st), mcd_last_error());
    return 1;
}

/* Solve the NS x NS system A X = B (row-major, m right-hand sides in the
 * columns of B), partial pivoting; A and B are overwritten (X in B). */
static int solve_small(double *A, double *B, size_t m)
{
    size_t i, j, k, c;
    for (k = 0; k < NS; k++) {
        size_t p = k;
        for (i = k + 1; i < NS; i++)
            if (fabs(A[i * NS + k]) > fabs(A[p * NS + k]))
                p = i;
        if (A[p * NS + k] == 0.0)
            return 1;
        if (p != k) {
            for (j = 0; j < NS; j++) {
                double t = A[k * NS + j];
                A[k * NS + j] = A[p * NS + j];
                A[p * NS + j] = t;
            }
            for (c = 0; c < m; c++) {
                double t = B[k * m + c];
                B[k * m + c] = B[p * m + c];
                B[p * m + c] = t;
            }
        }
        for (i = k + 1; i < NS; i++) {
            double f = A[i * NS + k] / A[k * NS + k];
            for (j = k; j < NS; j++)
                A[i * NS + j] -= f * A[k * NS + j];
            for (c = 0; c < m; c++)
                B[i * m + c] -= f * B[k * m + c];
        }
    }
    for (k = NS; k-- > 0;)
        for (c = 0; c < m; c++) {
            double s = B[k * m + c];
            for (j = k + 1; j < NS; j++)
                s -= A[k * NS + j] * B[j * m + c];
            B[k * m + c] = s / A[k * NS + k];
        }
    return 0;
}

/* Block tridiagonal solve: Lo[k] X_{k-1} + Di[k] X_k + Up[k] X_{k+1} = r_k
 * (blocks NS x NS row-major, r and the result NS per cell); destroys Di,
 * Up and r (the solution is left in r). */
static int solve_blocks(size_t n, double *Lo, double *Di, double *Up, double *r)
{
    double A[NS * NS], B[NS * (NS + 1)];
    size_t k, i, j, l;
    for (k = 0; k < n; k++) {
        if (k > 0) /* D_k -= L_k U'_{k-1}, r_k -= L_k r'_{k-1} */
            for (i = 0; i < NS; i++) {
                for (j = 0; j < NS; j++)
                    for (l = 0; l < NS; l++)
                        Di[(k * NS + i) * NS + j] -=
                            Lo[(k * NS + i) * NS + l] *
                            Up[((k - 1) * NS + l) * NS + j];
                for (l = 0; l < NS; l++)
                    r[k * NS + i] -=
                        Lo[(k * NS + i) * NS + l] * r[(k - 1) * NS + l];
            }
        /* [U'_k | r'_k] = D_k^{-1} [U_k | r_k] */
        memcpy(A, Di + k * NS * NS, sizeof A);
        for (i = 0; i < NS; i++) {
            for (j = 0; j < NS; j++)
                B[i * (NS + 1) + j] =
                    k + 1 < n ? Up[(k * NS + i) * NS + j] : 0.0;
            B[i * (NS + 1) + NS] = r[k * NS + i];
        }
        if (solve_small(A, B, NS + 1))
            return 1;
        for (i = 0; i < NS; i++) {
            for (j = 0; j < NS; j++)
                Up[(k * NS + i) * NS + j] = B[i * (NS + 1) + j];
            r[k * NS + i] = B[i * (NS + 1) + NS];
        }
    }
    for (k = n - 1; k-- > 0;) /* back substitution */
        for (i = 0; i < NS; i++)
            for (l = 0; l < NS; l++)
                r[k * NS + i] -=
                    Up[(k * NS + i) * NS + l] * r[(k + 1) * NS + l];
    return 0;
}

/* Flux of face f (cells f, f + 1) into J, its derivatives into dL, dR
 * (NS x NS, [i][j] = dJ_i/dx_{L or R, j}). */
static int face(mcd_workspace *ws, const fv1d_problem *p, const double *xL,
                const double *xR, double *J, double *dL, double *dR)
{
    double xf[NS], g[NS], A[NS * NS], G[NS * NS], e[NS], col[NS];
    mcd_state st = {0};
    size_t i, j;
    for (i = 0; i < NS; i++) {
        xf[i] = 0.5 * (xL[i] + xR[i]);
        g[i] = (xR[i] - xL[i]) / p->dz;
    }
    st.n_species = NS;
    st.n_dim = 1;
    st.comp_basis = MCD_BASIS_MOLE;
    st.c = p->c;
    st.M = p->M;
    st.Dij = p->Dij;
    st.comp = xf;
    st.grad = g;
    if (failed("face flux",
               mcd_flux_compute(ws, p->model, &st, MCD_BASIS_MOLE, J)) ||
        failed("flux Jacobian",
               mcd_flux_jacobian(ws, p->model, &st, MCD_BASIS_MOLE, A)))
        return 1;
    st.grad = e;
    for (j = 0; j < NS; j++) { /* dJ/dg_j: the flux of the unit gradient */
        for (i = 0; i < NS; i++)
            e[i] = i == j ? 1.0 : 0.0;
        if (failed("unit-gradient flux",
                   mcd_flux_compute(ws, p->model, &st, MCD_BASIS_MOLE, col)))
            return 1;
        for (i = 0; i < NS; i++)
            G[i * NS + j] = col[i];
    }
    for (i = 0; i < NS * NS; i++) {
        dL[i] = 0.5 * A[i] - G[i] / p->dz;
        dR[i] = 0.5 * A[i] + G[i] / p->dz;
    }
    return 0;
}

/* One backward Euler step from xo to x (n cells); Newton iterations into
 * *iters. Scratch: J (n-1 faces), blocks. */
static int be_step(mcd_workspace *ws, const fv1d_problem *p, double dt,
                   const double *xo, double *x, double *J, double *dL,
                   double *dR, double *Lo, double *Di, double *Up, double *r,
                   size_t *iters)
{
    const size_t n = p->n_cells;
    const double a = dt / (p->c * p->dz), cc = p->c * p->c;
    size_t it, k, i, j;
    for (it = 1; it <= 30; it++) {
        double big = 0.0;
        for (k = 0; k + 1 < n; k++)
            if (face(ws, p, x + k * NS, x + (k + 1) * NS, J + k * NS,
                     dL + k * NS * NS, dR + k * NS * NS))
                return 1;
        for (k = 0; k < n; k++) {
            const int cat = k >= p->zone_lo && k < p->zone_hi;
            const double *xk = x + k * NS;
            const double rate =
                cat ? p->k_rate * cc * xk[FV1D_CO] * xk[FV1D_H2O] : 0.0;
            for (i = 0; i < NS; i++) {
                double in = k > 0 ? J[(k - 1) * NS + i] : 0.0;
                double out = k + 1 < n ? J[k * NS + i] : 0.0;
                /* -R_k (the Newton right-hand side) */
                r[k * NS + i] = -(xk[i] - xo[k * NS + i] - a * (in - out) -
                                  dt * p->nu[i] * rate / p->c);
                for (j = 0; j < NS; j++) {
                    double dr = 0.0, d = i == j ? 1.0 : 0.0;
                    if (cat && j == FV1D_CO)
                        dr = p->k_rate * cc * xk[FV1D_H2O];
                    if (cat && j == FV1D_H2O)
                        dr = p->k_rate * cc * xk[FV1D_CO];
                    if (k > 0)
                        d -= a * dR[((k - 1) * NS + i) * NS + j];
                    if (k + 1 < n)
                        d += a * dL[(k * NS + i) * NS + j];
                    Di[(k * NS + i) * NS + j] = d - dt * p->nu[i] * dr / p->c;
                    Lo[(k * NS + i) * NS + j] =
                        k > 0 ? -a * dL[((k - 1) * NS + i) * NS + j] : 0.0;
                    Up[(k * NS + i) * NS + j] =
                        k + 1 < n ? a * dR[(k * NS + i) * NS + j] : 0.0;
                }
            }
        }
        if (solve_blocks(n, Lo, Di, Up, r)) {
            fprintf(stderr, "transient_1d_implicit: singular Newton "
                            "matrix\n");
            return 1;
        }
        for (k = 0; k < n * NS; k++) {
            x[k] += r[k];
            if (fabs(r[k]) > big)
                big = fabs(r[k]);
        }
        if (big < 1e-12) {
            *iters += it;
            return 0;
        }
    }
    fprintf(stderr, "transient_1d_implicit: Newton did not converge\n");
    return 1;
}

/* n_steps backward Euler steps from the initial state to p->t_end. */
static int run_implicit(const fv1d_problem *p, size_t n_steps, double *x,
                        size_t *iters)
{
    const size_t n = p->n_cells;
    mcd_workspace *ws = NULL;
    double *xo = malloc(n * NS * sizeof *xo), *J = malloc(n * NS * sizeof *J);
    double *dL = malloc(n * NS * NS * sizeof *dL);
    double *dR = malloc(n * NS * NS * sizeof *dR);
    double *Lo = malloc(n * NS * NS * sizeof *Lo);
    double *Di = malloc(n * NS * NS * sizeof *Di);
    double *Up = malloc(n * NS * NS * sizeof *Up);
    double *r = malloc(n * NS * sizeof *r);
    size_t s;
    int rc = 1;
    *iters = 0;
    if (!xo || !J || !dL || !dR || !Lo || !Di || !Up || !r ||
        failed("workspace", mcd_workspace_new(NS, &ws)))
        goto done;
    fv1d_initial(p, 0, n, x);
    for (s = 0; s < n_steps; s++) {
        memcpy(xo, x, n * NS * sizeof *x);
        if (be_step(ws, p, p->t_end / (double)n_steps, xo, x, J, dL, dR, Lo, Di,
                    Up, r, iters))
            goto done;
    }
    rc = 0;
done:
    mcd_workspace_free(ws);
    free(xo);
    free(J);
    free(dL);
    free(dR);
    free(Lo);
    free(Di);
    free(Up);
    free(r);
    return rc;
}

static double max_diff(size_t len, const double *a, const double *b)
{
    double m = 0.0;
    for (size_t i = 0; i < len; i++)
        if (fabs(a[i] - b[i]) > m)
            m = fabs(a[i] - b[i]);
    return m;
}

int main(int argc, char **argv)
{
    size_t n_cells = 40, ratio = 50, n_imp, it1 = 0, it2 = 0, k, i, e;
    fv1d_problem p;
    fv1d_solver s;
    double *xe, *xi, *xi2, extent, d1, d2, sum_err = 0.0, el_err = 0.0;
    double inv0[NS], inv1[NS], el0[FV1D_NE], el1[FV1D_NE];
    int a, rc = 1;
    for (a = 1; a < argc; a += 2) { /* option, value */
        char *end = NULL;
        unsigned long v = a + 1 < argc ? strtoul(argv[a + 1], &end, 10) : 0;
        if (!end || *end != '\0' || v == 0 || v > 100000) {
            fprintf(stderr, "usage: transient_1d_implicit [--cells N] "
                            "[--ratio R]\n");
            return 2;
        }
        if (strcmp(argv[a], "--cells") == 0 && v >= 3)
            n_cells = v;
        else if (strcmp(argv[a], "--ratio") == 0 && v >= 50)
            ratio = v;
        else {
            fprintf(stderr,
                    "transient_1d_implicit: %s %s: expected --cells "
                    ">= 3 or --ratio >= 50\n",
                    argv[a], argv[a + 1]);
            return 2;
        }
    }
    if (fv1d_problem_init(&p, n_cells, 0, 0.2, 1, MCD_MODEL_MAXWELL_STEFAN,
                          stderr))
        return 1;
    n_imp = p.n_steps / ratio > 0 ? p.n_steps / ratio : 1;
    xe = malloc(n_cells * NS * sizeof *xe);
    xi = malloc(n_cells * NS * sizeof *xi);
    xi2 = malloc(n_cells * NS * sizeof *xi2);
    if (!xe || !xi || !xi2 || fv1d_solver_init(&s, &p, n_cells, stderr))
        goto done;
    if (fv1d_run_serial(&s, &p, xe, &extent, stderr)) {
        fv1d_solver_free(&s);
        goto done;
    }
    fv1d_solver_free(&s);
    if (run_implicit(&p, n_imp, xi, &it1) ||
        run_implicit(&p, 2 * n_imp, xi2, &it2))
        goto done;
    d1 = max_diff(n_cells * NS, xi, xe);
    d2 = max_diff(n_cells * NS, xi2, xe);
    for (k = 0; k < n_cells; k++) {
        double sum = 0.0;
        for (i = 0; i < NS; i++)
            sum += xi[k * NS + i];
        sum_err = fmax(sum_err, fabs(sum - 1.0));
    }
    fv1d_initial(&p, 0, n_cells, xe); /* reuse xe for the initial state */
    fv1d_inventory(&p, n_cells, xe, inv0);
    fv1d_inventory(&p, n_cells, xi, inv1);
    fv1d_elements(&p, inv0, el0);
    fv1d_elements(&p, inv1, el1);
    for (e = 0; e < FV1D_NE; e++)
        el_err = fmax(el_err, fabs(el1[e] - el0[e]) / el0[e]);
    printf("explicit Euler: %zu steps of %.3g s (the stability limit)\n",
           p.n_steps, p.dt);
    printf("backward Euler + Newton: %zu steps of %.3g s (%zux longer), "
           "%zu Newton iterations\n",
           n_imp, p.t_end / (double)n_imp, p.n_steps / n_imp, it1);
    printf("largest |x_implicit - x_explicit| at t = %.3g s: %.2e (tolerance "
           "%.0e); with half the step: %.2e (%zu steps, %zu iterations)\n",
           p.t_end, d1, TOL, d2, 2 * n_imp, it2);
    printf("cell sums: %.1e from 1; element inventories: %.1e relative\n",
           sum_err, el_err);
    rc = 0;
    if (p.n_steps / n_imp < 50 || !(d1 <= TOL) ||
        !(fabs(d1 / d2 - 2.0) <= 0.8) || !(sum_err <= 1e-12) ||
        !(el_err <= 1e-11)) {
        fprintf(stderr, "transient_1d_implicit: a check failed\n");
        rc = 1;
    }
done:
    free(xe);
    free(xi);
    free(xi2);
    fv1d_problem_free(&p);
    return rc;
}
