/* fv1d.c - 1-D finite-volume transient diffusion-reaction solver shared by
 * the serial and MPI examples. Uses only the public header mcdiff.h.
 *
 * DEMO ONLY. The scenario is invented: a closed 1-D gas gap, 1 cm long, at
 * 600 K and 1 atm holds carbon monoxide, water vapour, carbon dioxide,
 * hydrogen and nitrogen, with a shift-rich mixture on the left and a
 * hydrogen-rich one on the right. A catalyst strip covering 40-80 % of the
 * gap converts CO + H2O -> CO2 + H2 at the made-up rate
 *   r = k c_CO c_H2O,  k = 1 m^3/(mol s)   (invented, not real kinetics).
 * The binary diffusivities are Fuller-Schettler-Giddings estimates from the
 * built-in species table.
 *
 * Model. Species continuity on a fixed grid,
 *   d(c x_i)/dt + dN_i/dz = nu_i r,
 * for an isothermal, isobaric ideal gas: c = P/(R T) is constant in space
 * and time. Summing over the species: dN_t/dz = (sum_i nu_i) r. The shift
 * reaction is equimolar (sum_i nu_i = 0), and the walls at z = 0 and z = L
 * are closed (N_i = 0), so N_t = 0 everywhere and at all times: the
 * molar-average velocity is zero and N_i = J_i + x_i N_t = J_i, the molar
 * diffusion fluxes relative to the molar-average velocity that the library
 * returns. (With a non-equimolar reaction N_t would follow from the same
 * closed-system condition as N_t(z) = integral_0^z (sum nu_i) r dz', and the
 * convective part x_i N_t would have to be added at each face.)
 *
 * Discretisation. n_cells equal cells of width dz; cell averages x_ik. At
 * the face between cells L and R the state is the arithmetic mean
 * x_f = (x_L + x_R)/2 and the gradient (x_R - x_L)/dz; the library gives
 * J_f at that state (exact Maxwell-Stefan or mixture-averaged). Wall faces
 * carry zero flux. Explicit Euler in time:
 *   x_ik^{n+1} = x_ik^n + dt/(c dz) (J_{i,k-1/2} - J_{i,k+1/2})
 *                + dt nu_i r_k / c.
 * Each interior face flux leaves one cell and enters its neighbour, so the
 * species inventories sum_k c x_ik dz change only by the reaction, and the
 * element inventories not at all, up to round-off. Since sum_i J_i = 0 to
 * round-off at every face and sum_i nu_i = 0, sum_i x_ik stays 1.
 * Stability of explicit Euler: dt <= dz^2 / (2 lambda_max) with lambda_max
 * the largest eigenvalue of the Fick matrix; we take dt <= dz^2/(4 D*) with
 * D* the larger of the largest binary diffusivity and the largest Fick
 * eigenvalue found at the initial states (common practice, a factor 2 of
 * margin).
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include "fv1d.h"

#define NS FV1D_NS

static int lib_fail(FILE *err, const char *what, mcd_status st,
                    const mcd_workspace *ws)
{
    if (st == MCD_OK)
        return 0;
    fprintf(err, "fv1d: %s failed: %s", what, mcd_status_string((int)st));
    if (*mcd_last_error())
        fprintf(err, " (%s)", mcd_last_error());
    fputc('\n', err);
    return 1;
}

/* Invented initial compositions (DEMO ONLY): left and right halves. */
static const double x_left[NS] = {0.30, 0.30, 0.02, 0.02, 0.36};
static const double x_right[NS] = {0.02, 0.10, 0.20, 0.40, 0.28};

/* Largest real part of the eigenvalues of the exact Fick matrix at x. */
static int fick_lambda_max(mcd_workspace *ws, const fv1d_problem *p,
                           const double *x, double *out, FILE *err)
{
    double D[(NS - 1) * (NS - 1)], re[NS - 1], im[NS - 1];
    size_t dep;
    if (lib_fail(err, "Fick matrix",
                 mcd_fick_matrix(ws,
                                 &(mcd_state){.n_species = NS,
                                              .M = p->M,
                                              .Dij = p->Dij,
                                              .comp_basis = MCD_BASIS_MOLE,
                                              .comp = x},
                                 MCD_BASIS_MOLE, MCD_DEPENDENT_AUTO, D, &dep),
                 ws) ||
        lib_fail(err, "Fick eigenvalues",
                 mcd_fick_eigenvalues(ws, NS - 1, D, re, im), ws))
        return 1;
    *out = re[0]; /* sorted by decreasing real part */
    return 0;
}

int fv1d_problem_init(fv1d_problem *p, size_t n_cells, size_t n_steps,
                      double t_end, int react, mcd_model model, FILE *err)
{
    static const char *const names[NS] = {
        "carbon-monoxide", "water", "carbon-dioxide", "hydrogen", "nitrogen"};
    static const char *const shortn[NS] = {"CO", "H2O", "CO2", "H2", "N2"};
    static const char *const elem[FV1D_NE] = {"C", "H", "O", "N"};
    static const double nu[NS] = {-1.0, -1.0, 1.0, 1.0, 0.0};
    mcd_db *db = NULL;
    mcd_mixture *mix = NULL;
    mcd_workspace *ws = NULL;
    size_t i, j, e;
    double lam, x_mid[NS], d_star, dt_max;
    int rc = 1;

    memset(p, 0, sizeof *p);
    if (n_cells < 3) {
        fprintf(err, "fv1d: need at least 3 cells\n");
        return 1;
    }
    if (!(t_end > 0.0)) {
        fprintf(err, "fv1d: end time must be > 0\n");
        return 1;
    }
    p->n_cells = n_cells;
    p->L = 0.01; /* invented: 1 cm gap */
    p->dz = p->L / (double)n_cells;
    p->T = 600.0; /* invented */
    p->P = MCD_ATM;
    p->t_end = t_end;
    p->k_rate = react ? 1.0 : 0.0; /* invented rate constant */
    p->zone_lo = (2 * n_cells) / 5;
    p->zone_hi = (4 * n_cells) / 5;
    p->model = model;
    for (i = 0; i < NS; i++) {
        p->nu[i] = nu[i];
        p->names[i] = names[i];
        p->short_names[i] = shortn[i];
    }

    if (lib_fail(err, "opening the species table", mcd_db_new_builtin(&db),
                 NULL))
        goto done;
    if (mcd_mixture_new(db, NS, names, MCD_GAS_FSG, &mix) != MCD_OK) {
        fprintf(err, "fv1d: building the mixture failed: %s\n",
                mcd_last_error());
        goto done;
    }
    if (lib_fail(err, "molar masses", mcd_mixture_molar_masses(mix, p->M),
                 NULL) ||
        lib_fail(err, "binary diffusivities",
                 mcd_mixture_binaries(mix, p->T, p->P, p->Dij, NULL, NULL),
                 NULL) ||
        lib_fail(err, "concentration", mcd_comp_ideal_gas_c(p->T, p->P, &p->c),
                 NULL) ||
        lib_fail(err, "workspace", mcd_workspace_new(NS, &ws), NULL))
        goto done;

    /* Atom matrix from the formulas in the table. */
    for (i = 0; i < NS; i++) {
        int Z[8];
        long cnt[8];
        size_t n_el = 0, idx;
        const char *formula;
        if (lib_fail(err, "species lookup", mcd_db_find(db, names[i], &idx),
                     NULL))
            goto done;
        formula = mcd_db_formula(db, idx);
        if (mcd_formula_elements(formula, 8, Z, cnt, &n_el) != MCD_OK) {
            fprintf(err, "fv1d: formula %s: %s\n", formula, mcd_last_error());
            goto done;
        }
        for (j = 0; j < n_el; j++) {
            const char *sym = mcd_element_symbol(Z[j]);
            int found = 0;
            for (e = 0; e < FV1D_NE; e++)
                if (sym && strcmp(sym, elem[e]) == 0) {
                    p->atoms[e * NS + i] = (double)cnt[j];
                    found = 1;
                }
            if (!found) {
                fprintf(err, "fv1d: element %s not tracked\n", sym ? sym : "?");
                goto done;
            }
        }
    }

    for (i = 0; i < NS; i++)
        for (j = 0; j < NS; j++)
            if (i != j && p->Dij[i * NS + j] > p->D_max)
                p->D_max = p->Dij[i * NS + j];
    d_star = p->D_max;
    for (i = 0; i < NS; i++)
        x_mid[i] = 0.5 * (x_left[i] + x_right[i]);
    if (fick_lambda_max(ws, p, x_left, &lam, err))
        goto done;
    if (lam > d_star)
        d_star = lam;
    if (fick_lambda_max(ws, p, x_right, &lam, err))
        goto done;
    if (lam > d_star)
        d_star = lam;
    if (fick_lambda_max(ws, p, x_mid, &lam, err))
        goto done;
    if (lam > d_star)
        d_star = lam;

    p->D_star = d_star;
    dt_max = p->dz * p->dz / (4.0 * d_star);
    if (n_steps == 0)
        n_steps = (size_t)ceil(t_end / dt_max);
    p->n_steps = n_steps;
    p->dt = t_end / (double)n_steps;
    if (p->dt > dt_max) {
        fprintf(err,
                "fv1d: %zu steps give dt = %.3g s, above the stable %.3g s; "
                "use at least %.0f steps\n",
                n_steps, p->dt, dt_max, ceil(t_end / dt_max));
        goto done;
    }
    p->mix = mix; /* kept: the batched call takes the mixture */
    mix = NULL;
    rc = 0;
done:
    mcd_workspace_free(ws);
    mcd_mixture_free(mix);
    mcd_db_free(db);
    return rc;
}

void fv1d_problem_free(fv1d_problem *p)
{
    mcd_mixture_free(p->mix);
    p->mix = NULL;
}

void fv1d_initial(const fv1d_problem *p, size_t first, size_t n, double *x)
{
    size_t k, i;
    for (k = 0; k < n; k++) {
        const double *src = (2 * (first + k) < p->n_cells) ? x_left : x_right;
        for (i = 0; i < NS; i++)
            x[k * NS + i] = src[i];
    }
}

int fv1d_solver_init(fv1d_solver *s, const fv1d_problem *p, size_t max_cells,
                     FILE *err)
{
    size_t nf = max_cells + 1, f;
    memset(s, 0, sizeof *s);
    if (lib_fail(err, "workspace", mcd_workspace_new(NS, &s->ws), NULL))
        return 1;
    s->max_faces = nf;
    s->face_index = malloc(nf * sizeof *s->face_index);
    s->face_T = malloc(nf * sizeof *s->face_T);
    s->face_P = malloc(nf * sizeof *s->face_P);
    s->face_x = malloc(nf * NS * sizeof *s->face_x);
    s->face_grad = malloc(nf * NS * sizeof *s->face_grad);
    s->face_flux = malloc(nf * NS * sizeof *s->face_flux);
    s->flux = malloc(nf * NS * sizeof *s->flux);
    if (!s->face_index || !s->face_T || !s->face_P || !s->face_x ||
        !s->face_grad || !s->face_flux || !s->flux) {
        fprintf(err, "fv1d: out of memory\n");
        fv1d_solver_free(s);
        return 1;
    }
    for (f = 0; f < nf; f++) {
        s->face_T[f] = p->T;
        s->face_P[f] = p->P;
    }
    return 0;
}

void fv1d_solver_free(fv1d_solver *s)
{
    mcd_workspace_free(s->ws);
    free(s->face_index);
    free(s->face_T);
    free(s->face_P);
    free(s->face_x);
    free(s->face_grad);
    free(s->face_flux);
    free(s->flux);
    memset(s, 0, sizeof *s);
}

/* Fluxes at the nf face states gathered in s->face_x / s->face_grad
 * (structure of arrays: species i of face f at [i * nf + f]) into
 * s->face_flux (same layout). The normal path is ONE batched library call
 * for all faces; p->per_face makes one single-state call per face instead
 * (kept to compare results and speed). */
static int face_fluxes(fv1d_solver *s, const fv1d_problem *p, size_t nf,
                       FILE *err)
{
    size_t f, i;
    if (nf == 0)
        return 0;
    if (!p->per_face) {
        /* The binary diffusivities of every face come from the mixture at
         * the face's T and P, and c = P/(R T): the same numbers as p->Dij
         * and p->c up to round-off. */
        s->calls++;
        return lib_fail(
            err, "batched face fluxes",
            mcd_flux_batch(s->ws, p->mix, p->model, s->face_T, s->face_P,
                           &(mcd_cells){.n_cells = nf,
                                        .n_dim = 1,
                                        .comp_basis = MCD_BASIS_MOLE,
                                        .comp = s->face_x,
                                        .grad = s->face_grad},
                           MCD_BASIS_MOLE, s->face_flux),
            s->ws);
    }
    for (f = 0; f < nf; f++) {
        double xf[NS], gf[NS], Jf[NS];
        mcd_status st;
        for (i = 0; i < NS; i++) {
            xf[i] = s->face_x[i * nf + f];
            gf[i] = s->face_grad[i * nf + f];
        }
        st = mcd_flux_compute(s->ws, p->model,
                              &(mcd_state){.n_species = NS,
                                           .n_dim = 1,
                                           .M = p->M,
                                           .Dij = p->Dij,
                                           .c = p->c,
                                           .comp_basis = MCD_BASIS_MOLE,
                                           .comp = xf,
                                           .grad = gf},
                              MCD_BASIS_MOLE, Jf);
        s->calls++;
        if (lib_fail(err, "face flux", st, s->ws))
            return 1;
        for (i = 0; i < NS; i++)
            s->face_flux[i * nf + f] = Jf[i];
    }
    return 0;
}

int fv1d_step(fv1d_solver *s, const fv1d_problem *p, size_t first,
              size_t n_local, int has_left, int has_right, double *x,
              double *inout_extent, FILE *err)
{
    const double inv_dz = 1.0 / p->dz;
    const double a = p->dt / (p->c * p->dz);
    size_t f, k, i, n, nf;
    double extent = 0.0;

    if (n_local == 0 || n_local + 1 > s->max_faces) {
        fprintf(err,
                "fv1d: block of %zu cells is empty or larger than the "
                "solver's\n",
                n_local);
        return 1;
    }
    /* Face f lies between ghost-indexed cells f and f + 1; the wall faces
     * of a block without a neighbour carry no flux and are not computed. */
    nf = n_local + 1 - (has_left ? 0 : 1) - (has_right ? 0 : 1);
    n = 0;
    for (f = 0; f <= n_local; f++) {
        const double *xl = x + f * NS, *xr = x + (f + 1) * NS;
        if ((f == 0 && !has_left) || (f == n_local && !has_right))
            continue;
        for (i = 0; i < NS; i++) {
            s->face_x[i * nf + n] = 0.5 * (xl[i] + xr[i]);
            s->face_grad[i * nf + n] = (xr[i] - xl[i]) * inv_dz;
        }
        s->face_index[n++] = f;
    }
    if (face_fluxes(s, p, nf, err))
        return 1;
    memset(s->flux, 0, (n_local + 1) * NS * sizeof *s->flux);
    for (n = 0; n < nf; n++)
        for (i = 0; i < NS; i++)
            s->flux[s->face_index[n] * NS + i] = s->face_flux[i * nf + n];

    for (k = 1; k <= n_local; k++) {
        double *xk = x + k * NS;
        const double *Fl = s->flux + (k - 1) * NS, *Fr = s->flux + k * NS;
        size_t g = first + k - 1;
        double r = 0.0;
        if (g >= p->zone_lo && g < p->zone_hi)
            r = p->k_rate * (p->c * xk[FV1D_CO]) * (p->c * xk[FV1D_H2O]);
        for (i = 0; i < NS; i++)
            xk[i] += a * (Fl[i] - Fr[i]) + p->dt * p->nu[i] * r / p->c;
        extent += r * p->dz * p->dt;
    }
    *inout_extent += extent;
    return 0;
}

void fv1d_inventory(const fv1d_problem *p, size_t n, const double *x,
                    double *out_inv)
{
    size_t k, i;
    for (i = 0; i < NS; i++)
        out_inv[i] = 0.0;
    for (k = 0; k < n; k++)
        for (i = 0; i < NS; i++)
            out_inv[i] += p->c * x[k * NS + i] * p->dz;
}

void fv1d_elements(const fv1d_problem *p, const double *inv, double *out_el)
{
    size_t e, i;
    for (e = 0; e < FV1D_NE; e++) {
        out_el[e] = 0.0;
        for (i = 0; i < NS; i++)
            out_el[e] += p->atoms[e * NS + i] * inv[i];
    }
}

int fv1d_run_serial(fv1d_solver *s, const fv1d_problem *p, double *x_out,
                    double *out_extent, FILE *err)
{
    const size_t n = p->n_cells;
    double *x = calloc((n + 2) * NS, sizeof *x);
    size_t step;
    int rc = 1;

    *out_extent = 0.0;
    if (!x) {
        fprintf(err, "fv1d: out of memory\n");
        return 1;
    }
    fv1d_initial(p, 0, n, x + NS);
    for (step = 0; step < p->n_steps; step++)
        if (fv1d_step(s, p, 0, n, 0, 0, x, out_extent, err))
            goto done;
    memcpy(x_out, x + NS, n * NS * sizeof *x);
    rc = 0;
done:
    free(x);
    return rc;
}
