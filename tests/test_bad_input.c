/* test_bad_input.c - every public function against bad input.
 *
 * One table row per bad input: the function, what is wrong, the mutation of a
 * valid fixture that produces it, the documented status code and the word
 * the error detail (mcd_last_error) must contain, such as the argument's
 * name. Every failing call must leave a detail (a detail planted before
 * the call must have been cleared), every succeeding one none. For every
 * row the driver also checks
 *  - every output the call could write is unchanged (all output arrays and
 *    out-pointers live in one block filled with a guard pattern: doubles
 *    12345.678, everything else the byte 0x5A; the block is compared byte
 *    for byte after the call);
 *  - the inputs are unchanged (const arguments stay const);
 *  - on failure the database and the mixture are unchanged (fingerprint of
 *    every name, formula and parameter; binaries of the mixture).
 * Each function also has a "valid baseline" row: the unmutated fixture must
 * succeed, which proves that each failure comes from its mutation alone.
 *
 * Functions that return no status (getters, free) are checked through a
 * pseudo-status describing what came back: R_NULL, R_VALUE, R_ZERO, R_NAN,
 * R_EMPTY or R_VOID.
 *
 * Coverage: bad_input_table_covers_every_public_function parses
 * include/mcdiff.h (found from MCD_TEST_DATA/../../include) and fails if a
 * function declared MCD_API has no row, or no bad-input row when it takes
 * arguments. bad_input_library_imports_no_abort_exit_print runs nm on the
 * shared library next to this test (../lib/libmcdiff.so) and fails if it
 * imports abort, exit, assert, longjmp or any printing function.
 */
#define _POSIX_C_SOURCE 200809L
#include <check.h>
#include <ctype.h>
#include <limits.h>
#include <math.h>
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "mcdiff.h"
#include "support.h"

#define NA 8 /* room in every input array (n = 3 in the fixture) */
#define PROBE ((size_t)-2)  /* index placeholder: the probe species */
#define PROBE2 ((size_t)-3) /* index placeholder: the light probe species */

/* Pseudo-status codes of calls without a status. */
enum { R_NULL = 1000, R_VALUE, R_ZERO, R_NAN, R_EMPTY, R_VOID };

/* Which argument a null-bit replaces by NULL. */
enum {
    NB_WS,
    NB_DB,
    NB_MIX,
    NB_M,
    NB_X,
    NB_X2,
    NB_Y,
    NB_GRAD,
    NB_D,
    NB_GAMMA,
    NB_GLNP,
    NB_VALS,
    NB_VBAR,
    NB_J,
    NB_NF,
    NB_Z,
    NB_T,
    NB_F,
    NB_FORMULA,
    NB_NAME,
    NB_TEXT,
    NB_PATH,
    NB_NAMES,
    NB_ALLOC,
    NB_O1,
    NB_O2,
    NB_O3,
    NB_OZ,
    NB_OI,
    NB_OL,
    NB_OU,
    NB_ODB,
    NB_OMIX,
    NB_OWS,
    NB_OM,
    NB_LIQ,
    NB_OLIQ,
    NB_CIJ,
    NB_LIQ2,
    NB_PORE,
    NB_DGM
};

/* Every output of every call (guarded as one block). */
typedef struct outs {
    double o1[NA * NA], o2[NA * NA], o3[NA * NA];
    size_t oz[4];
    int oi[NA];
    long ol[NA];
    unsigned ou[NA * NA];
    mcd_db *odb;
    mcd_mixture *omix;
    mcd_workspace *ows;
    mcd_method om;
    mcd_liquid *oliq;
} outs;

typedef struct ctx {
    /* objects */
    mcd_workspace *ws;
    mcd_db *db;
    mcd_mixture *mix;
    mcd_liquid *liq;  /* NRTL, 3 species, every parameter set */
    mcd_liquid *liq2; /* ideal, 2 species with water's vapour pressure */
    mcd_allocator al;
    size_t probe;  /* database index of a species lacking params */
    size_t probe2; /* a species with M = 1e-5 kg/mol (0.01 g/mol) */
    /* sizes and indices */
    size_t n, nd, m, cap, i, j, k, dep, species, np, nt, ga, gb, sol, solv;
    /* scalars */
    double T, P, c, L, V1, V2, A, tol_diag, tol_ode, value, Tstar;
    double MA, MB, VA, VB, sigA, sigB, epsA, epsB, mu, Ms, phi, Vb;
    double dipA, VbB, TbA; /* Brokaw: species A polar, B fixed nonpolar */
    double D_ref, T_ref, P_ref, expo, conc, Tlo, Thi, tol_it;
    double cij[3], alpha, Tmin, Tmax, Din1, Din2; /* liquid setters */
    double antA, antB, antC, rhoL, xl2[2];
    int lmodel, lparam;
    size_t K, max_iter, nthreads;
    int use_small_ws;
    mcd_workspace *ws2; /* capacity 2 < n */
    double Tc[NA], Pc[NA], cc[NA];
    /* enums and ints */
    int model, basis, basis2, kind, method, param, n_rings, Z, film_method;
    int status, use_gamma, use_glnp, fail_alloc;
    int use_kT;   /* bit 0: kT, bit 1: grad_lnT */
    int dij_mode; /* mcd_workspace_set_dij_read (0 in the baseline) */
    unsigned bit;
    unsigned long long nul; /* NB_* bits */
    /* arrays */
    double M[NA], x[NA], x2[NA], y[NA], grad[NA * 3], D[NA * NA];
    double Gamma[NA * NA], glnP[3], vals[NA], Vbar[NA], J[NA * 3], Nf[NA];
    double zz[NA], tt[NA], F[NA * NA];
    double kT[NA], glnT[3], DT[NA];
    /* porous media: pore structure, gas viscosity and species viscosities,
     * pressure gradient (used when use_gp), total flux, a Knudsen
     * diffusivity */
    mcd_pore pore;
    double mug, mus[NA], gP[3], Nt[3], Dk;
    double zr[NA]; /* slab flux ratios, A + B -> C: (1, 1, -1) */
    int use_gp;
    const char *formula, *name, *text, *path, *mname, *mol, *find;
    const char *names[NA];
    /* results */
    outs o;
} ctx;

#define NUL_(b) ((c->nul >> (b)) & 1u)
#define ARG(f, b) (NUL_(b) ? NULL : c->f)
#define OUT(f, b) (NUL_(b) ? NULL : c->o.f)
#define OUTP(f, b) (NUL_(b) ? NULL : &c->o.f)
#define WS (NUL_(NB_WS) ? NULL : c->use_small_ws ? c->ws2 : c->ws)
#define IDX(v) ((v) == PROBE ? c->probe : (v) == PROBE2 ? c->probe2 : (v))

static const char *g_datadir;

static void *fail_alloc_fn(void *ud, size_t size)
{
    (void)ud;
    (void)size;
    return NULL;
}
static void *ok_alloc_fn(void *ud, size_t size)
{
    (void)ud;
    return malloc(size);
}
static void ok_free_fn(void *ud, void *p)
{
    (void)ud;
    free(p);
}

static const char *full_path(ctx *c, char *buf, size_t len)
{
    if (NUL_(NB_PATH))
        return NULL;
    if (c->path[0] == '/')
        return c->path;
    snprintf(buf, len, "%s/%s", g_datadir, c->path);
    return buf;
}

/* ------------------------------------------------------------------ */
/* One call function per public function                              */
/* ------------------------------------------------------------------ */

static int ptr_kind(const void *p) { return p == NULL ? R_NULL : R_VALUE; }

static int call_mcd_version_number(ctx *c)
{
    (void)c;
    return mcd_version_number() ? R_VALUE : R_ZERO;
}
static int call_mcd_version_string(ctx *c)
{
    (void)c;
    return ptr_kind(mcd_version_string());
}
static int call_mcd_status_string(ctx *c)
{
    return ptr_kind(mcd_status_string(c->status));
}
static int call_mcd_formula_molar_mass(ctx *c)
{
    return mcd_formula_molar_mass(ARG(formula, NB_FORMULA), OUT(o1, NB_O1));
}
static int call_mcd_formula_elements(ctx *c)
{
    return mcd_formula_elements(ARG(formula, NB_FORMULA), c->cap,
                                OUT(oi, NB_OI), OUT(ol, NB_OL), OUT(oz, NB_OZ));
}
static int call_mcd_formula_diffusion_volume(ctx *c)
{
    return mcd_formula_diffusion_volume(ARG(formula, NB_FORMULA), c->n_rings,
                                        OUT(o1, NB_O1));
}
static int call_mcd_formula_molecule_volume(ctx *c)
{
    return mcd_formula_molecule_volume(ARG(mol, NB_FORMULA), OUT(o1, NB_O1));
}
static int call_mcd_element_symbol(ctx *c)
{
    return ptr_kind(mcd_element_symbol(c->Z));
}
static int call_mcd_element_weight(ctx *c)
{
    return mcd_element_weight(c->Z, OUT(o1, NB_O1));
}
static int call_mcd_param_name(ctx *c)
{
    return ptr_kind(mcd_param_name((mcd_param)c->param));
}
static int call_mcd_param_unit(ctx *c)
{
    return ptr_kind(mcd_param_unit((mcd_param)c->param));
}
static int call_mcd_db_new(ctx *c)
{
    int r = mcd_db_new(OUTP(odb, NB_ODB));
    if (r == MCD_OK) {
        mcd_db_free(c->o.odb);
        c->o.odb = NULL;
    }
    return r;
}
static int call_mcd_db_new_builtin(ctx *c)
{
    int r = mcd_db_new_builtin(OUTP(odb, NB_ODB));
    if (r == MCD_OK) {
        mcd_db_free(c->o.odb);
        c->o.odb = NULL;
    }
    return r;
}
static int call_mcd_db_free(ctx *c)
{
    mcd_db_free(ARG(db, NB_DB));
    if (!NUL_(NB_DB))
        c->db = NULL;
    return R_VOID;
}
static int call_mcd_db_species_count(ctx *c)
{
    return mcd_db_species_count(ARG(db, NB_DB)) ? R_VALUE : R_ZERO;
}
static int call_mcd_db_find(ctx *c)
{
    return mcd_db_find(ARG(db, NB_DB), ARG(find, NB_NAME), OUT(oz, NB_OZ));
}
static int call_mcd_db_name(ctx *c)
{
    return ptr_kind(mcd_db_name(ARG(db, NB_DB), IDX(c->i)));
}
static int call_mcd_db_formula(ctx *c)
{
    return ptr_kind(mcd_db_formula(ARG(db, NB_DB), IDX(c->i)));
}
static int call_mcd_db_source(ctx *c)
{
    return ptr_kind(
        mcd_db_source(ARG(db, NB_DB), IDX(c->i), (mcd_param)c->param));
}
static int call_mcd_db_param(ctx *c)
{
    return mcd_db_param(ARG(db, NB_DB), IDX(c->i), (mcd_param)c->param,
                        OUT(o1, NB_O1));
}
static int call_mcd_db_add(ctx *c)
{
    return mcd_db_add(ARG(db, NB_DB), ARG(name, NB_NAME),
                      ARG(formula, NB_FORMULA), c->n_rings, OUT(oz, NB_OZ));
}
static int call_mcd_db_set_param(ctx *c)
{
    return mcd_db_set_param(ARG(db, NB_DB), IDX(c->i), (mcd_param)c->param,
                            c->value);
}
static int call_mcd_db_load_file(ctx *c)
{
    char buf[1024];
    return mcd_db_load_file(ARG(db, NB_DB), full_path(c, buf, sizeof buf));
}
static int call_mcd_db_load_string(ctx *c)
{
    return mcd_db_load_string(ARG(db, NB_DB), ARG(text, NB_TEXT));
}
static int call_mcd_comp_normalize(ctx *c)
{
    return mcd_comp_normalize(c->n, ARG(x, NB_X), OUT(o1, NB_O1));
}
static int call_mcd_comp_x_to_w(ctx *c)
{
    return mcd_comp_x_to_w(c->n, ARG(M, NB_M), ARG(x, NB_X), OUT(o1, NB_O1));
}
static int call_mcd_comp_w_to_x(ctx *c)
{
    return mcd_comp_w_to_x(c->n, ARG(M, NB_M), ARG(y, NB_Y), OUT(o1, NB_O1));
}
static int call_mcd_comp_mean_molar_mass_x(ctx *c)
{
    return mcd_comp_mean_molar_mass_x(c->n, ARG(M, NB_M), ARG(x, NB_X),
                                      OUT(o1, NB_O1));
}
static int call_mcd_comp_mean_molar_mass_w(ctx *c)
{
    return mcd_comp_mean_molar_mass_w(c->n, ARG(M, NB_M), ARG(y, NB_Y),
                                      OUT(o1, NB_O1));
}
static int call_mcd_comp_x_to_c(ctx *c)
{
    return mcd_comp_x_to_c(c->n, c->c, ARG(x, NB_X), OUT(o1, NB_O1));
}
static int call_mcd_comp_c_to_x(ctx *c)
{
    /* the concentrations are taken from vals */
    return mcd_comp_c_to_x(c->n, ARG(vals, NB_VALS), OUT(o1, NB_O1),
                           OUT(o2, NB_O2));
}
static int call_mcd_comp_ideal_gas_c(ctx *c)
{
    return mcd_comp_ideal_gas_c(c->T, c->P, OUT(o1, NB_O1));
}
static int call_mcd_comp_grad_x_to_w(ctx *c)
{
    return mcd_comp_grad_x_to_w(c->n, c->nd, ARG(M, NB_M), ARG(x, NB_X),
                                ARG(grad, NB_GRAD), OUT(o1, NB_O1));
}
static int call_mcd_comp_grad_w_to_x(ctx *c)
{
    return mcd_comp_grad_w_to_x(c->n, c->nd, ARG(M, NB_M), ARG(y, NB_Y),
                                ARG(grad, NB_GRAD), OUT(o1, NB_O1));
}
static int call_mcd_method_name(ctx *c)
{
    return ptr_kind(mcd_method_name((mcd_method)c->method));
}
static int call_mcd_method_from_name(ctx *c)
{
    return mcd_method_from_name(ARG(mname, NB_NAME), OUTP(om, NB_OM));
}
static int call_mcd_method_typical_error(ctx *c)
{
    return isnan(mcd_method_typical_error((mcd_method)c->method)) ? R_NAN
                                                                  : R_VALUE;
}
static int call_mcd_warning_string(ctx *c)
{
    return ptr_kind(mcd_warning_string(c->bit));
}
static int call_mcd_binary_fsg(ctx *c)
{
    return mcd_binary_fsg(c->T, c->P, c->MA, c->MB, c->VA, c->VB,
                          OUT(o1, NB_O1));
}
static int call_mcd_binary_chapman_enskog(ctx *c)
{
    return mcd_binary_chapman_enskog(c->T, c->P, c->MA, c->MB, c->sigA, c->sigB,
                                     c->epsA, c->epsB, OUT(o1, NB_O1));
}
static int call_mcd_binary_wilke_lee(ctx *c)
{
    return mcd_binary_wilke_lee(c->T, c->P, c->MA, c->MB, c->sigA, c->sigB,
                                c->epsA, c->epsB, OUT(o1, NB_O1));
}
static int call_mcd_binary_brokaw(ctx *c)
{
    return mcd_binary_brokaw(c->T, c->P, c->MA, c->MB, c->dipA, 0.0, c->Vb,
                             c->VbB, c->TbA, 77.35, OUT(o1, NB_O1));
}
static int call_mcd_binary_wilke_chang(ctx *c)
{
    return mcd_binary_wilke_chang(c->T, c->mu, c->Ms, c->phi, c->Vb,
                                  OUT(o1, NB_O1));
}
static int call_mcd_binary_omega_d(ctx *c)
{
    return mcd_binary_omega_d(c->Tstar, OUT(o1, NB_O1));
}
static int call_mcd_binary_scale(ctx *c)
{
    return mcd_binary_scale(c->D_ref, c->T_ref, c->P_ref, c->T, c->P, c->expo,
                            OUT(o1, NB_O1));
}
static int call_mcd_db_binary_gas(ctx *c)
{
    return mcd_db_binary_gas(ARG(db, NB_DB), IDX(c->ga), IDX(c->gb),
                             (mcd_gas_method)c->method, c->T, c->P,
                             OUT(o1, NB_O1), OUT(o2, NB_O2), OUT(ou, NB_OU));
}
static int call_mcd_db_binary_liquid(ctx *c)
{
    return mcd_db_binary_liquid(ARG(db, NB_DB), IDX(c->sol), IDX(c->solv), c->T,
                                c->mu, OUT(o1, NB_O1), OUT(o2, NB_O2),
                                OUT(ou, NB_OU));
}
static int call_mcd_typical_error_widened(ctx *c)
{
    return mcd_typical_error_widened((mcd_method)c->method, c->bit,
                                     OUT(o1, NB_O1));
}
static int call_mcd_db_binary_explain(ctx *c)
{
    /* o1 holds NA * NA >= MCD_EXPLAIN_COUNT doubles */
    return mcd_db_binary_explain(ARG(db, NB_DB), IDX(c->ga), IDX(c->gb),
                                 (mcd_method)c->method, c->T, c->P, c->mu,
                                 OUT(o1, NB_O1));
}
static int call_mcd_mixture_new(ctx *c)
{
    int r;
    r = mcd_mixture_new(ARG(db, NB_DB), c->n, NUL_(NB_NAMES) ? NULL : c->names,
                        (mcd_gas_method)c->method, OUTP(omix, NB_OMIX));
    if (r == MCD_OK) {
        mcd_mixture_free(c->o.omix);
        c->o.omix = NULL;
    }
    return r;
}
static int call_mcd_mixture_free(ctx *c)
{
    mcd_mixture_free(ARG(mix, NB_MIX));
    if (!NUL_(NB_MIX))
        c->mix = NULL;
    return R_VOID;
}
static int call_mcd_mixture_species_count(ctx *c)
{
    return mcd_mixture_species_count(ARG(mix, NB_MIX)) ? R_VALUE : R_ZERO;
}
static int call_mcd_mixture_name(ctx *c)
{
    return ptr_kind(mcd_mixture_name(ARG(mix, NB_MIX), c->i));
}
static int call_mcd_mixture_molar_masses(ctx *c)
{
    return mcd_mixture_molar_masses(ARG(mix, NB_MIX), OUT(o1, NB_O1));
}
static int call_mcd_mixture_set_method(ctx *c)
{
    return mcd_mixture_set_method(ARG(mix, NB_MIX), c->i, c->j,
                                  (mcd_gas_method)c->method);
}
static int call_mcd_mixture_pair_method(ctx *c)
{
    return mcd_mixture_pair_method(ARG(mix, NB_MIX), c->i, c->j,
                                   OUTP(om, NB_OM));
}
static int call_mcd_mixture_set_binary(ctx *c)
{
    return mcd_mixture_set_binary(ARG(mix, NB_MIX), c->i, c->j, c->value,
                                  c->T_ref, c->P_ref);
}
static int call_mcd_mixture_binaries(ctx *c)
{
    return mcd_mixture_binaries(ARG(mix, NB_MIX), c->T, c->P, OUT(o1, NB_O1),
                                OUT(o2, NB_O2), OUT(ou, NB_OU));
}
static int call_mcd_liquid_new(ctx *c)
{
    int r = mcd_liquid_new(c->n, (mcd_activity_model)c->lmodel,
                           OUTP(oliq, NB_OLIQ));
    if (r == MCD_OK) {
        mcd_liquid_free(c->o.oliq);
        c->o.oliq = NULL;
    }
    return r;
}
static int call_mcd_liquid_free(ctx *c)
{
    mcd_liquid_free(ARG(liq, NB_LIQ));
    if (!NUL_(NB_LIQ))
        c->liq = NULL;
    return R_VOID;
}
static int call_mcd_liquid_set_species(ctx *c)
{
    return mcd_liquid_set_species(ARG(liq, NB_LIQ), c->i,
                                  (mcd_liquid_param)c->lparam, c->value);
}
static int call_mcd_liquid_set_pair(ctx *c)
{
    return mcd_liquid_set_pair(ARG(liq, NB_LIQ), c->i, c->j, ARG(cij, NB_CIJ),
                               c->cij, c->alpha, c->Tmin, c->Tmax);
}
static int call_mcd_liquid_set_dinf(ctx *c)
{
    return mcd_liquid_set_dinf(ARG(liq, NB_LIQ), c->i, c->j, c->Din1, c->Din2);
}
static int call_mcd_liquid_eval(ctx *c)
{
    return mcd_liquid_eval(WS, ARG(liq, NB_LIQ), c->T, ARG(x, NB_X),
                           OUT(o1, NB_O1), OUT(o2, NB_O2), OUT(o3, NB_O3),
                           OUT(ou, NB_OU));
}
/* mcd_liquid_flux_batch: the liquid (3 species, NRTL) at one cell (K =
 * 1: the cell's arrays are the fixture's vectors), partial molar volumes
 * Vbar = 1 / c (c = cc[0] = the fixture's c) */
static int call_mcd_liquid_flux_batch(ctx *c)
{
    return mcd_liquid_flux_batch(
        WS, ARG(liq, NB_LIQ), (mcd_model)c->model, ARG(Tc, NB_T),
        ARG(cc, NB_VALS), ARG(M, NB_M), ARG(Vbar, NB_VBAR),
        &(mcd_cells){.n_cells = c->K,
                     .n_dim = c->nd,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o1, NB_O1), OUT(ou, NB_OU));
}
static int call_mcd_liquid_set_antoine(ctx *c)
{
    return mcd_liquid_set_antoine(ARG(liq, NB_LIQ), c->i, c->antA, c->antB,
                                  c->antC, c->Tmin, c->Tmax);
}
static int call_mcd_liquid_vle(ctx *c)
{
    return mcd_liquid_vle(WS, ARG(liq, NB_LIQ), c->T, ARG(x, NB_X),
                          OUT(o1, NB_O1), OUT(ou, NB_OU));
}
static int call_mcd_liquid_evaporation(ctx *c)
{
    mcd_film gas = {
        .n_species = c->n, .c = c->c, .L = c->L, .Dij = c->D, .xL = c->x2};
    return mcd_liquid_evaporation(
        WS, ARG(liq2, NB_LIQ2), &gas, c->T, c->P, ARG(xl2, NB_X), ARG(M, NB_M),
        c->rhoL, OUT(o1, NB_O1), OUT(o2, NB_O2), OUT(o3, NB_O3),
        OUT(o3, NB_O3) + 1, OUT(ou, NB_OU));
}
static int call_mcd_binary_tyn_calus(ctx *c)
{
    return mcd_binary_tyn_calus(c->T, c->mu, c->Vb, c->VA * 1e-6,
                                OUT(o1, NB_O1));
}
static int call_mcd_method_temperature_range(ctx *c)
{
    /* method counts from the fixture's default (MCD_METHOD_FSG), so that
     * the default is MCD_METHOD_WILKE_CHANG */
    return mcd_method_temperature_range(
        (mcd_method)(c->method - MCD_METHOD_FSG + MCD_METHOD_WILKE_CHANG), c->T,
        OUT(o1, NB_O1), OUT(o2, NB_O2), OUT(ou, NB_OU));
}
static int call_mcd_binary_hayduk_minhas(ctx *c)
{
    return mcd_binary_hayduk_minhas(c->T, c->mu, c->Vb, OUT(o1, NB_O1));
}
static int call_mcd_workspace_new(ctx *c)
{
    int r = mcd_workspace_new(c->n, OUTP(ows, NB_OWS));
    if (r == MCD_OK) {
        mcd_workspace_free(c->o.ows);
        c->o.ows = NULL;
    }
    return r;
}
static int call_mcd_workspace_new_with(ctx *c)
{
    int r;
    c->al.alloc = c->fail_alloc ? fail_alloc_fn : ok_alloc_fn;
    c->al.free = ok_free_fn;
    r = mcd_workspace_new_with(c->n, NUL_(NB_ALLOC) ? NULL : &c->al,
                               OUTP(ows, NB_OWS));
    if (r == MCD_OK) {
        mcd_workspace_free(c->o.ows);
        c->o.ows = NULL;
    }
    return r;
}
static int call_mcd_workspace_free(ctx *c)
{
    mcd_workspace_free(ARG(ws, NB_WS));
    if (!NUL_(NB_WS))
        c->ws = NULL;
    return R_VOID;
}
static int call_mcd_workspace_capacity(ctx *c)
{
    return mcd_workspace_capacity(ARG(ws, NB_WS)) ? R_VALUE : R_ZERO;
}
static int call_mcd_last_error(ctx *c)
{
    const char *s = mcd_last_error();
    (void)c;
    return s == NULL ? R_NULL : s[0] == '\0' ? R_EMPTY : R_VALUE;
}
static int call_mcd_flux_compute(ctx *c)
{
    return mcd_flux_compute(
        WS, (mcd_model)c->model,
        &(mcd_state){.n_species = c->n,
                     .n_dim = c->nd,
                     .M = ARG(M, NB_M),
                     .Dij = ARG(D, NB_D),
                     .c = c->c,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .Gamma = c->use_gamma ? c->Gamma : NULL,
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o1, NB_O1));
}
static int call_mcd_flux_jacobian_comp(ctx *c)
{
    return mcd_flux_jacobian_comp(
        WS,
        &(mcd_state){.n_species = c->n,
                     .n_dim = c->nd,
                     .M = ARG(M, NB_M),
                     .Dij = ARG(D, NB_D),
                     .c = c->c,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL},
        OUT(o1, NB_O1));
}
static int call_mcd_thermal_ratios(ctx *c)
{
    return mcd_thermal_ratios(WS,
                              &(mcd_state){.n_species = c->n,
                                           .M = ARG(M, NB_M),
                                           .Dij = ARG(D, NB_D),
                                           .c = c->c,
                                           .comp_basis = (mcd_basis)c->basis,
                                           .comp = ARG(x, NB_X)},
                              ARG(DT, NB_VALS), OUT(o1, NB_O1));
}
static int call_mcd_fick_matrix(ctx *c)
{
    return mcd_fick_matrix(
        WS,
        &(mcd_state){.n_species = c->n,
                     .M = ARG(M, NB_M),
                     .Dij = ARG(D, NB_D),
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .Gamma = c->use_gamma ? c->Gamma : NULL},
        (mcd_basis)c->basis2, c->dep, OUT(o1, NB_O1), OUT(oz, NB_OZ));
}
static int call_mcd_fick_fluxes(ctx *c)
{
    return mcd_fick_fluxes(c->n, c->nd, ARG(F, NB_F), c->dep, c->conc,
                           ARG(grad, NB_GRAD), OUT(o1, NB_O1));
}
static int call_mcd_fick_eigenvalues(ctx *c)
{
    return mcd_fick_eigenvalues(WS, c->m, ARG(F, NB_F), OUT(o1, NB_O1),
                                OUT(o2, NB_O2));
}
static int call_mcd_flux_convert(ctx *c)
{
    return mcd_flux_convert(c->n, c->nd, ARG(M, NB_M), ARG(x, NB_X),
                            (mcd_basis)c->basis, ARG(J, NB_J),
                            (mcd_basis)c->basis2, OUT(o1, NB_O1));
}
static int call_mcd_flux_to_volume_frame(ctx *c)
{
    return mcd_flux_to_volume_frame(c->n, c->nd, c->c, ARG(x, NB_X),
                                    ARG(Vbar, NB_VBAR), ARG(J, NB_J),
                                    OUT(o1, NB_O1));
}
static int call_mcd_flux_to_species_frame(ctx *c)
{
    return mcd_flux_to_species_frame(c->n, c->nd, ARG(x, NB_X), ARG(J, NB_J),
                                     c->k, OUT(o1, NB_O1));
}
static int call_mcd_flux_total(ctx *c)
{
    return mcd_flux_total(c->n, c->nd, (mcd_basis)c->basis, ARG(x, NB_X),
                          ARG(J, NB_J), (mcd_bootstrap)c->kind, c->species,
                          ARG(vals, NB_VALS), OUT(o1, NB_O1), OUT(o2, NB_O2));
}
static int call_mcd_flux_velocity_difference(ctx *c)
{
    return mcd_flux_velocity_difference(c->n, c->nd, ARG(M, NB_M), c->c,
                                        ARG(x, NB_X), ARG(J, NB_J),
                                        OUT(o1, NB_O1));
}
static int call_mcd_flux_project(ctx *c)
{
    /* in-out array: o1 (its guard values are a valid flux set) */
    return mcd_flux_project(c->n, c->nd, ARG(vals, NB_VALS), OUT(o1, NB_O1),
                            OUT(o2, NB_O2));
}
static int call_mcd_flux_diagnose(ctx *c)
{
    return mcd_flux_diagnose(c->n, c->nd, ARG(grad, NB_GRAD), ARG(J, NB_J),
                             c->tol_diag, OUT(ou, NB_OU));
}
static int call_mcd_film_solve(ctx *c)
{
    return mcd_film_solve(WS,
                          &(mcd_film){.n_species = c->n,
                                      .c = c->c,
                                      .L = c->L,
                                      .Dij = ARG(D, NB_D),
                                      .x0 = ARG(x, NB_X),
                                      .xL = ARG(x2, NB_X2)},
                          (mcd_film_bootstrap)c->kind, c->species,
                          ARG(vals, NB_VALS), (mcd_film_method)c->film_method,
                          OUT(o1, NB_O1), OUT(oz, NB_OZ), OUT(o2, NB_O2));
}
static int call_mcd_film_profile(ctx *c)
{
    return mcd_film_profile(WS,
                            &(mcd_film){.n_species = c->n,
                                        .c = c->c,
                                        .L = c->L,
                                        .Dij = ARG(D, NB_D),
                                        .x0 = ARG(x, NB_X)},
                            ARG(Nf, NB_NF), c->np, ARG(zz, NB_Z),
                            OUT(o1, NB_O1));
}
static int call_mcd_bulbs_linearized(ctx *c)
{
    return mcd_bulbs_linearized(WS,
                                &(mcd_bulbs){.n_species = c->n,
                                             .c = c->c,
                                             .V1 = c->V1,
                                             .V2 = c->V2,
                                             .A = c->A,
                                             .L = c->L,
                                             .Dij = ARG(D, NB_D),
                                             .x1_0 = ARG(x, NB_X),
                                             .x2_0 = ARG(x2, NB_X2)},
                                c->nt, ARG(tt, NB_T), OUT(o1, NB_O1),
                                OUT(o2, NB_O2));
}
static int call_mcd_bulbs_integrate(ctx *c)
{
    return mcd_bulbs_integrate(WS,
                               &(mcd_bulbs){.n_species = c->n,
                                            .c = c->c,
                                            .V1 = c->V1,
                                            .V2 = c->V2,
                                            .A = c->A,
                                            .L = c->L,
                                            .Dij = ARG(D, NB_D),
                                            .x1_0 = ARG(x, NB_X),
                                            .x2_0 = ARG(x2, NB_X2)},
                               c->nt, ARG(tt, NB_T), c->tol_ode, OUT(o1, NB_O1),
                               OUT(o2, NB_O2));
}

static int call_mcd_flux_batch(ctx *c)
{
    return mcd_flux_batch(
        WS, ARG(mix, NB_MIX), (mcd_model)c->model, ARG(Tc, NB_T),
        ARG(Pc, NB_VBAR),
        &(mcd_cells){.n_cells = c->K,
                     .n_dim = c->nd,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o1, NB_O1));
}
static mcd_state flux_state_of(ctx *c)
{
    return (mcd_state){.n_species = c->n,
                       .n_dim = c->nd,
                       .M = ARG(M, NB_M),
                       .Dij = ARG(D, NB_D),
                       .c = c->c,
                       .comp_basis = (mcd_basis)c->basis,
                       .comp = ARG(x, NB_X),
                       .grad = ARG(grad, NB_GRAD),
                       .grad_lnP = c->use_glnp ? c->glnP : NULL};
}
static int call_mcd_flux_jacobian(ctx *c)
{
    mcd_state st = flux_state_of(c);
    return mcd_flux_jacobian(WS, (mcd_model)c->model, &st, (mcd_basis)c->basis2,
                             OUT(o1, NB_O1));
}
/* dDij/dT and dDij/dP: the fixture's Gamma (finite), NULL by NB_GAMMA and
 * NB_F */
static int call_mcd_flux_jacobian_tp(ctx *c)
{
    mcd_state st = flux_state_of(c);
    return mcd_flux_jacobian_tp(
        WS, (mcd_model)c->model, &st, (mcd_basis)c->basis2, c->T, c->P,
        ARG(Gamma, NB_GAMMA), NUL_(NB_F) ? NULL : c->Gamma, OUT(o1, NB_O1),
        OUT(o2, NB_O2));
}
static int call_mcd_flux_batch_jacobian(ctx *c)
{
    return mcd_flux_batch_jacobian(
        WS, (mcd_model)c->model, c->n, ARG(M, NB_M), ARG(D, NB_D),
        ARG(cc, NB_VALS),
        &(mcd_cells){.n_cells = c->K,
                     .n_dim = c->nd,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o2, NB_O2), OUT(o1, NB_O1));
}
static int call_mcd_flux_batch_dij(ctx *c)
{
    return mcd_flux_batch_dij(
        WS, (mcd_model)c->model, c->n, ARG(M, NB_M), ARG(D, NB_D),
        ARG(cc, NB_VALS),
        &(mcd_cells){.n_cells = c->K,
                     .n_dim = c->nd,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o1, NB_O1));
}
static int call_mcd_flux_batch_aos(ctx *c)
{
    return mcd_flux_batch_aos(
        WS, ARG(mix, NB_MIX), (mcd_model)c->model, ARG(Tc, NB_T),
        ARG(Pc, NB_VBAR),
        &(mcd_cells){.n_cells = c->K,
                     .n_dim = c->nd,
                     .comp_basis = (mcd_basis)c->basis,
                     .comp = ARG(x, NB_X),
                     .grad = ARG(grad, NB_GRAD),
                     .grad_lnP = c->use_glnp ? c->glnP : NULL,
                     .kT = (c->use_kT & 1) ? c->kT : NULL,
                     .grad_lnT = (c->use_kT & 2) ? c->glnT : NULL},
        (mcd_basis)c->basis2, OUT(o1, NB_O1));
}
static int call_mcd_workspace_set_iterative(ctx *c)
{
    return mcd_workspace_set_iterative(WS, c->max_iter, c->tol_it);
}
static int call_mcd_workspace_iterative_outcome(ctx *c)
{
    return mcd_workspace_iterative_outcome(WS, OUT(o1, NB_O1), OUT(oz, NB_OZ));
}
static int call_mcd_workspace_set_threads(ctx *c)
{
    return mcd_workspace_set_threads(WS, c->nthreads);
}
static int call_mcd_workspace_set_dij_read(ctx *c)
{
    return mcd_workspace_set_dij_read(WS, (mcd_dij_read)c->dij_mode);
}
static int call_mcd_mixture_set_temperature_fit(ctx *c)
{
    return mcd_mixture_set_temperature_fit(ARG(mix, NB_MIX), c->Tlo, c->Thi,
                                           OUT(o1, NB_O1));
}
static int call_mcd_mixture_temperature_fit(ctx *c)
{
    return mcd_mixture_temperature_fit(ARG(mix, NB_MIX), OUT(o1, NB_O1),
                                       OUT(o2, NB_O2), OUT(o3, NB_O3));
}

static int call_mcd_viscosity_omega22(ctx *c)
{
    return mcd_viscosity_omega22(c->Tstar, OUT(o1, NB_O1));
}
static int call_mcd_viscosity_chapman_enskog(ctx *c)
{
    return mcd_viscosity_chapman_enskog(c->T, c->MA, c->sigA, c->epsA,
                                        OUT(o1, NB_O1));
}
static int call_mcd_viscosity_wilke(ctx *c)
{
    return mcd_viscosity_wilke(c->n, ARG(M, NB_M), ARG(mus, NB_VALS),
                               ARG(x, NB_X), OUT(o1, NB_O1));
}
static int call_mcd_db_viscosity_gas(ctx *c)
{
    return mcd_db_viscosity_gas(ARG(db, NB_DB), IDX(c->ga), c->T,
                                OUT(o1, NB_O1), OUT(o2, NB_O2), OUT(ou, NB_OU));
}
static int call_mcd_mixture_viscosities(ctx *c)
{
    return mcd_mixture_viscosities(ARG(mix, NB_MIX), c->T, OUT(o1, NB_O1),
                                   OUT(ou, NB_OU));
}
static int call_mcd_lj_collision_integrals(ctx *c)
{
    return mcd_lj_collision_integrals(c->Tstar, OUT(o1, NB_O1), OUT(o2, NB_O2));
}
static int call_mcd_thermal_factor_kinetic(ctx *c)
{
    return mcd_thermal_factor_kinetic(c->MA, c->MB, c->x[0], 1.1, 1.2, 0.9, 1.0,
                                      1.0, OUT(o1, NB_O1));
}
static int call_mcd_thermal_factor_ce(ctx *c)
{
    return mcd_thermal_factor_ce(c->T, c->MA, c->MB, c->sigA, c->sigB, c->epsA,
                                 c->epsB, c->x[0], OUT(o1, NB_O1),
                                 OUT(ou, NB_OU));
}
static int call_mcd_db_thermal_factor(ctx *c)
{
    return mcd_db_thermal_factor(ARG(db, NB_DB), IDX(c->ga), IDX(c->gb), c->T,
                                 c->x[0], OUT(o1, NB_O1), OUT(o2, NB_O2),
                                 OUT(ou, NB_OU));
}
static int call_mcd_mixture_thermal_ratios(ctx *c)
{
    return mcd_mixture_thermal_ratios(ARG(mix, NB_MIX), c->T, ARG(x, NB_X),
                                      OUT(o1, NB_O1), OUT(o2, NB_O2),
                                      OUT(o3, NB_O3), OUT(ou, NB_OU));
}
static int call_mcd_dufour_heat_flux(ctx *c)
{
    return mcd_dufour_heat_flux(c->n, c->nd, ARG(x, NB_X), ARG(M, NB_M),
                                ARG(vals, NB_VALS), c->T, MCD_BASIS_MASS,
                                ARG(J, NB_J), OUT(o1, NB_O1));
}
static int call_mcd_dufour_heat_flux_batch(ctx *c)
{
    return mcd_dufour_heat_flux_batch(
        c->n, c->K, c->nd, ARG(x, NB_X), ARG(M, NB_M), ARG(vals, NB_VALS),
        ARG(Tc, NB_T), MCD_BASIS_MASS, ARG(J, NB_J), OUT(o1, NB_O1));
}
#define PORE (NUL_(NB_PORE) ? NULL : &c->pore)
static int call_mcd_pore_permeability(ctx *c)
{
    return mcd_pore_permeability(PORE, OUT(o1, NB_O1));
}
static int call_mcd_pore_effective(ctx *c)
{
    return mcd_pore_effective(PORE, c->D_ref, OUT(o1, NB_O1));
}
static int call_mcd_knudsen_diffusivity(ctx *c)
{
    return mcd_knudsen_diffusivity(c->T, c->MA, c->pore.d_pore, OUT(o1, NB_O1));
}
static int call_mcd_bosanquet(ctx *c)
{
    return mcd_bosanquet(c->D_ref, c->Dk, OUT(o1, NB_O1));
}
/* The Dusty Gas Model state of the fixture (NULL with NB_DGM). */
static const mcd_dgm *dgm_of(ctx *c, mcd_dgm *g)
{
    *g = (mcd_dgm){.n_species = c->n,
                   .n_dim = c->nd,
                   .T = c->T,
                   .P = c->P,
                   .mu = c->mug,
                   .M = ARG(M, NB_M),
                   .Dij = ARG(D, NB_D),
                   .x = ARG(x, NB_X),
                   .grad_x = ARG(grad, NB_GRAD),
                   .grad_P = c->use_gp ? c->gP : NULL};
    return NUL_(NB_DGM) ? NULL : g;
}
static int call_mcd_dgm_fluxes(ctx *c)
{
    mcd_dgm g;
    return mcd_dgm_fluxes(WS, PORE, dgm_of(c, &g), OUT(o1, NB_O1));
}
static int call_mcd_dgm_closed(ctx *c)
{
    mcd_dgm g;
    return mcd_dgm_closed(WS, PORE, dgm_of(c, &g), ARG(Nt, NB_NF),
                          OUT(o1, NB_O1), OUT(o2, NB_O2));
}
static int call_mcd_dgm_gradients(ctx *c)
{
    mcd_dgm g;
    return mcd_dgm_gradients(WS, PORE, dgm_of(c, &g), ARG(J, NB_J),
                             OUT(o1, NB_O1), OUT(o2, NB_O2));
}

static int call_mcd_dgm_fluxes_batch(ctx *c)
{
    /* one cell: the fixture's state in SoA layout with K = 1 */
    return mcd_dgm_fluxes_batch(
        WS, PORE, c->n, ARG(M, NB_M),
        NUL_(NB_DGM) ? NULL
                     : &(mcd_dgm_cells){.n_cells = c->K,
                                        .n_dim = c->nd,
                                        .T = ARG(Tc, NB_T),
                                        .P = c->Pc,
                                        .mu = c->mus,
                                        .Dij = ARG(D, NB_D),
                                        .x = ARG(x, NB_X),
                                        .grad_x = ARG(grad, NB_GRAD),
                                        .grad_P = c->use_gp ? c->gP : NULL},
        OUT(o1, NB_O1));
}
static const mcd_slab *slab_of(ctx *c, mcd_slab *sl)
{
    *sl = (mcd_slab){.n_species = c->n,
                     .T = c->T,
                     .mu = c->mug,
                     .L = c->L,
                     .P_ref = c->P_ref,
                     .M = ARG(M, NB_M),
                     .Dij = ARG(D, NB_D),
                     .x0 = ARG(x, NB_X),
                     .P0 = c->P,
                     .xL = ARG(x2, NB_X2),
                     .PL = c->Pc[1]};
    return NUL_(NB_DGM) ? NULL : sl;
}
static int call_mcd_slab_solve(ctx *c)
{
    mcd_slab sl;
    /* kind counts from the fixture's default (MCD_BOOT_EQUIMOLAR), so
     * that the default is MCD_SLAB_PRESSURES */
    return mcd_slab_solve(WS, PORE, slab_of(c, &sl),
                          (mcd_slab_kind)(c->kind - MCD_BOOT_EQUIMOLAR),
                          c->species, c->value, OUT(o1, NB_O1), OUT(o2, NB_O2),
                          OUT(oz, NB_OZ));
}
static int call_mcd_slab_solve_ratios(ctx *c)
{
    mcd_slab sl;
    return mcd_slab_solve_ratios(WS, PORE, slab_of(c, &sl), c->species,
                                 ARG(zr, NB_VALS), OUT(o1, NB_O1),
                                 OUT(o2, NB_O2), OUT(oz, NB_OZ));
}
static int call_mcd_slab_profile(ctx *c)
{
    mcd_slab sl;
    return mcd_slab_profile(WS, PORE, slab_of(c, &sl), ARG(Nt, NB_NF), c->np,
                            ARG(zz, NB_Z), OUT(o1, NB_O1), OUT(o2, NB_O2));
}

/* ------------------------------------------------------------------ */
/* The table                                                          */
/* ------------------------------------------------------------------ */

enum { MUT_END, MUT_D, MUT_Z, MUT_I, MUT_U, MUT_S, MUT_NULL };
typedef struct mut {
    int kind;
    size_t off;
    union {
        double d;
        size_t z;
        int i;
        unsigned u;
        const char *s;
    } v;
} mut;

typedef struct bcase {
    const char *fn;
    int (*call)(ctx *);
    const char *what;
    mut m[6];
    int expect;
    const char *word; /* must appear as a whole word in the message */
} bcase;

#define MD(f, val)                                                             \
    {                                                                          \
        MUT_D, offsetof(ctx, f), { .d = (val) }                                \
    }
#define MDA(f, ix, val)                                                        \
    {                                                                          \
        MUT_D, offsetof(ctx, f) + (size_t)(ix) * sizeof(double),               \
        {                                                                      \
            .d = (val)                                                         \
        }                                                                      \
    }
#define MZ(f, val)                                                             \
    {                                                                          \
        MUT_Z, offsetof(ctx, f), { .z = (val) }                                \
    }
#define MI(f, val)                                                             \
    {                                                                          \
        MUT_I, offsetof(ctx, f), { .i = (val) }                                \
    }
#define MU(f, val)                                                             \
    {                                                                          \
        MUT_U, offsetof(ctx, f), { .u = (val) }                                \
    }
#define MS(f, val)                                                             \
    {                                                                          \
        MUT_S, offsetof(ctx, f), { .s = (val) }                                \
    }
#define MSA(f, ix, val)                                                        \
    {                                                                          \
        MUT_S, offsetof(ctx, f) + (size_t)(ix) * sizeof(char *),               \
        {                                                                      \
            .s = (val)                                                         \
        }                                                                      \
    }
#define MN(b)                                                                  \
    {                                                                          \
        MUT_NULL, (b), { .z = 0 }                                              \
    }
#define C(fn, what, exp, word, ...)                                            \
    {                                                                          \
#fn, call_##fn, what, {__VA_ARGS__ }, exp, word                        \
    }
#define B(fn, exp)                                                             \
    {                                                                          \
#fn, call_##fn, "valid baseline",                                      \
            {{MUT_END, 0, {.z = 0 } } }, exp, NULL                             \
    }

#define BIG (MCD_MAX_SPECIES + 1)
#define EINVAL_ MCD_EINVAL
#define EDOM_ MCD_EDOM

/* Species files: a valid header and one block; each bad text breaks one
 * rule. */
#define HDR "mcdiff-species 1\n"

static const bcase cases[] = {
    /* ---- version and status ---- */
    B(mcd_version_number, R_VALUE),
    B(mcd_version_string, R_VALUE),
    B(mcd_status_string, R_VALUE),
    C(mcd_status_string, "code -1", R_VALUE, NULL, MI(status, -1)),
    C(mcd_status_string, "code 999", R_VALUE, NULL, MI(status, 999)),
    C(mcd_status_string, "code INT_MIN", R_VALUE, NULL, MI(status, INT_MIN)),

    /* ---- formulas ---- */
    B(mcd_formula_molar_mass, MCD_OK),
    C(mcd_formula_molar_mass, "formula NULL", EINVAL_, NULL, MN(NB_FORMULA)),
    C(mcd_formula_molar_mass, "out_M NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_formula_molar_mass, "empty formula", MCD_EPARSE, NULL,
      MS(formula, "")),
    C(mcd_formula_molar_mass, "lower-case start", MCD_EPARSE, NULL,
      MS(formula, "h2o")),
    C(mcd_formula_molar_mass, "space", MCD_EPARSE, NULL, MS(formula, "H2 O")),
    C(mcd_formula_molar_mass, "count 0", MCD_EPARSE, NULL, MS(formula, "H0")),
    C(mcd_formula_molar_mass, "unclosed group", MCD_EPARSE, NULL,
      MS(formula, "(CH3")),
    C(mcd_formula_molar_mass, "stray close", MCD_EPARSE, NULL,
      MS(formula, "CH3)2")),
    C(mcd_formula_molar_mass, "empty group", MCD_EPARSE, NULL,
      MS(formula, "()2")),
    C(mcd_formula_molar_mass, "nesting 9 deep", MCD_EPARSE, NULL,
      MS(formula, "(((((((((C)))))))))")),
    C(mcd_formula_molar_mass, "huge count", MCD_EPARSE, NULL,
      MS(formula, "C99999999999999999999999")),
    C(mcd_formula_molar_mass, "charge", MCD_EPARSE, NULL, MS(formula, "NH4+")),
    C(mcd_formula_molar_mass, "hydrate dot", MCD_EPARSE, NULL,
      MS(formula, "CuSO4.5H2O")),
    C(mcd_formula_molar_mass, "non-ASCII", MCD_EPARSE, NULL,
      MS(formula, "C\xc3\xa9")),
    C(mcd_formula_molar_mass, "unknown element", MCD_ENOTFOUND, "Xx",
      MS(formula, "Xx2")),
    B(mcd_formula_elements, MCD_OK),
    C(mcd_formula_elements, "formula NULL", EINVAL_, NULL, MN(NB_FORMULA)),
    C(mcd_formula_elements, "out_Z NULL", EINVAL_, NULL, MN(NB_OI)),
    C(mcd_formula_elements, "out_count NULL", EINVAL_, NULL, MN(NB_OL)),
    C(mcd_formula_elements, "out_n NULL", EINVAL_, NULL, MN(NB_OZ)),
    C(mcd_formula_elements, "cap 2 < 3 elements", MCD_EBADLEN, NULL,
      MZ(cap, 2)),
    C(mcd_formula_elements, "cap 0", MCD_EBADLEN, NULL, MZ(cap, 0)),
    C(mcd_formula_elements, "malformed", MCD_EPARSE, NULL, MS(formula, "C3(H")),
    C(mcd_formula_elements, "unknown element", MCD_ENOTFOUND, "Qq",
      MS(formula, "CQq")),
    B(mcd_formula_diffusion_volume, MCD_OK),
    C(mcd_formula_diffusion_volume, "formula NULL", EINVAL_, NULL,
      MN(NB_FORMULA)),
    C(mcd_formula_diffusion_volume, "out_V NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_formula_diffusion_volume, "n_rings -1", EINVAL_, NULL,
      MI(n_rings, -1)),
    C(mcd_formula_diffusion_volume, "n_rings INT_MIN", EINVAL_, NULL,
      MI(n_rings, INT_MIN)),
    C(mcd_formula_diffusion_volume, "malformed", MCD_EPARSE, NULL,
      MS(formula, "C)")),
    C(mcd_formula_diffusion_volume, "unknown element", MCD_ENOTFOUND, NULL,
      MS(formula, "Zz")),
    C(mcd_formula_diffusion_volume, "Si has no increment", MCD_ENODATA, "Si",
      MS(formula, "SiH4")),
    B(mcd_formula_molecule_volume, MCD_OK),
    C(mcd_formula_molecule_volume, "formula NULL", EINVAL_, NULL,
      MN(NB_FORMULA)),
    C(mcd_formula_molecule_volume, "out_V NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_formula_molecule_volume, "not tabulated", MCD_ENOTFOUND, NULL,
      MS(mol, "C6H6")),
    C(mcd_formula_molecule_volume, "empty", MCD_ENOTFOUND, NULL, MS(mol, "")),
    C(mcd_formula_molecule_volume, "lower case", MCD_ENOTFOUND, NULL,
      MS(mol, "co2")),
    B(mcd_element_symbol, R_VALUE),
    C(mcd_element_symbol, "Z 0", R_NULL, NULL, MI(Z, 0)),
    C(mcd_element_symbol, "Z -1", R_NULL, NULL, MI(Z, -1)),
    C(mcd_element_symbol, "Z 119", R_NULL, NULL, MI(Z, 119)),
    C(mcd_element_symbol, "Z INT_MAX", R_NULL, NULL, MI(Z, INT_MAX)),
    B(mcd_element_weight, MCD_OK),
    C(mcd_element_weight, "Z 0", MCD_ENOTFOUND, NULL, MI(Z, 0)),
    C(mcd_element_weight, "Z 119", MCD_ENOTFOUND, NULL, MI(Z, 119)),
    C(mcd_element_weight, "Z INT_MIN", MCD_ENOTFOUND, NULL, MI(Z, INT_MIN)),
    C(mcd_element_weight, "Tc has no standard weight", MCD_ENOTFOUND, NULL,
      MI(Z, 43)),
    C(mcd_element_weight, "out NULL", EINVAL_, NULL, MN(NB_O1)),

    /* ---- parameters and database ---- */
    B(mcd_param_name, R_VALUE),
    C(mcd_param_name, "p -1", R_NULL, NULL, MI(param, -1)),
    C(mcd_param_name, "p COUNT", R_NULL, NULL, MI(param, MCD_PARAM_COUNT)),
    B(mcd_param_unit, R_VALUE),
    C(mcd_param_unit, "p -1", R_NULL, NULL, MI(param, -1)),
    C(mcd_param_unit, "p COUNT", R_NULL, NULL, MI(param, MCD_PARAM_COUNT)),
    B(mcd_db_new, MCD_OK),
    C(mcd_db_new, "out_db NULL", EINVAL_, NULL, MN(NB_ODB)),
    B(mcd_db_new_builtin, MCD_OK),
    C(mcd_db_new_builtin, "out_db NULL", EINVAL_, NULL, MN(NB_ODB)),
    B(mcd_db_free, R_VOID),
    C(mcd_db_free, "NULL is a no-op", R_VOID, NULL, MN(NB_DB)),
    B(mcd_db_species_count, R_VALUE),
    C(mcd_db_species_count, "NULL", R_ZERO, NULL, MN(NB_DB)),
    B(mcd_db_find, MCD_OK),
    C(mcd_db_find, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_find, "name NULL", EINVAL_, NULL, MN(NB_NAME)),
    C(mcd_db_find, "out NULL", EINVAL_, NULL, MN(NB_OZ)),
    C(mcd_db_find, "unknown species", MCD_ENOTFOUND, NULL,
      MS(find, "unobtainium")),
    C(mcd_db_find, "empty name", MCD_ENOTFOUND, NULL, MS(find, "")),
    B(mcd_db_name, R_VALUE),
    C(mcd_db_name, "db NULL", R_NULL, NULL, MN(NB_DB)),
    C(mcd_db_name, "i out of range", R_NULL, NULL, MZ(i, 100000)),
    C(mcd_db_name, "i SIZE_MAX", R_NULL, NULL, MZ(i, SIZE_MAX)),
    B(mcd_db_formula, R_VALUE),
    C(mcd_db_formula, "db NULL", R_NULL, NULL, MN(NB_DB)),
    C(mcd_db_formula, "i out of range", R_NULL, NULL, MZ(i, 100000)),
    B(mcd_db_source, R_VALUE),
    C(mcd_db_source, "db NULL", R_NULL, NULL, MN(NB_DB)),
    C(mcd_db_source, "i out of range", R_NULL, NULL, MZ(i, 100000)),
    C(mcd_db_source, "p -1", R_NULL, NULL, MI(param, -1)),
    C(mcd_db_source, "p COUNT", R_NULL, NULL, MI(param, MCD_PARAM_COUNT)),
    B(mcd_db_param, MCD_OK),
    C(mcd_db_param, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_param, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_db_param, "i out of range", EINVAL_, NULL, MZ(i, 100000)),
    C(mcd_db_param, "p -1", EINVAL_, NULL, MI(param, -1)),
    C(mcd_db_param, "p COUNT", EINVAL_, NULL, MI(param, MCD_PARAM_COUNT)),
    C(mcd_db_param, "sigma unknown", MCD_ENODATA, NULL, MZ(i, PROBE),
      MI(param, MCD_PARAM_LJ_SIGMA)),
    B(mcd_db_add, MCD_OK),
    C(mcd_db_add, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_add, "name NULL", EINVAL_, NULL, MN(NB_NAME)),
    C(mcd_db_add, "formula NULL", EINVAL_, NULL, MN(NB_FORMULA)),
    C(mcd_db_add, "empty name", MCD_EPARSE, NULL, MS(name, "")),
    C(mcd_db_add, "name with space", MCD_EPARSE, NULL, MS(name, "my gas")),
    C(mcd_db_add, "name starts with -", MCD_EPARSE, NULL, MS(name, "-gas")),
    C(mcd_db_add, "name 64 characters", MCD_EPARSE, NULL,
      MS(name,
         "a123456789012345678901234567890123456789012345678901234567890123")),
    C(mcd_db_add, "malformed formula", MCD_EPARSE, NULL, MS(formula, "C2H(")),
    C(mcd_db_add, "unknown element", MCD_ENOTFOUND, NULL, MS(formula, "C2Yy")),
    C(mcd_db_add, "n_rings -1", EINVAL_, NULL, MI(n_rings, -1)),
    C(mcd_db_add, "rings on a tabulated molecule", EINVAL_, NULL,
      MS(formula, "CO2"), MI(n_rings, 1)),
    B(mcd_db_set_param, MCD_OK),
    C(mcd_db_set_param, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_set_param, "i out of range", EINVAL_, NULL, MZ(i, 100000)),
    C(mcd_db_set_param, "p COUNT", EINVAL_, NULL, MI(param, MCD_PARAM_COUNT)),
    C(mcd_db_set_param, "p -1", EINVAL_, NULL, MI(param, -1)),
    C(mcd_db_set_param, "value NaN", EINVAL_, NULL, MD(value, SUP_NAN)),
    C(mcd_db_set_param, "value inf", EINVAL_, NULL, MD(value, SUP_INF)),
    C(mcd_db_set_param, "M = 0", EDOM_, NULL, MD(value, 0.0)),
    C(mcd_db_set_param, "M < 0", EDOM_, NULL, MD(value, -0.028)),
    C(mcd_db_set_param, "sigma subnormal-negative", EDOM_, NULL,
      MI(param, MCD_PARAM_LJ_SIGMA), MD(value, -4.9e-324)),
    C(mcd_db_set_param, "dipole < 0", EDOM_, NULL, MI(param, MCD_PARAM_DIPOLE),
      MD(value, -1e-30)),
    B(mcd_db_load_file, MCD_OK),
    C(mcd_db_load_file, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_load_file, "path NULL", EINVAL_, NULL, MN(NB_PATH)),
    C(mcd_db_load_file, "missing file", MCD_EIO, NULL,
      MS(path, "no-such-file.txt")),
    C(mcd_db_load_file, "a directory", MCD_EIO, NULL, MS(path, "/")),
    C(mcd_db_load_file, "bad unit", MCD_EPARSE, "5",
      MS(path, "species-bad-unit.txt")),
    C(mcd_db_load_file, "duplicate key", MCD_EPARSE, NULL,
      MS(path, "species-duplicate-key.txt")),
    C(mcd_db_load_file, "missing formula", MCD_EPARSE, NULL,
      MS(path, "species-missing-formula.txt")),
    B(mcd_db_load_string, MCD_OK),
    C(mcd_db_load_string, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_load_string, "text NULL", EINVAL_, NULL, MN(NB_TEXT)),
    C(mcd_db_load_string, "empty text", MCD_EPARSE, NULL, MS(text, "")),
    C(mcd_db_load_string, "no header", MCD_EPARSE, "1",
      MS(text, "species foo\n formula N2\n")),
    C(mcd_db_load_string, "wrong version", MCD_EPARSE, "1",
      MS(text, "mcdiff-species 99\n")),
    C(mcd_db_load_string, "key outside a block", MCD_EPARSE, "2",
      MS(text, HDR "formula N2\n")),
    C(mcd_db_load_string, "unknown key", MCD_EPARSE, "3",
      MS(text, HDR "species foo\n colour blue\n formula N2\n")),
    C(mcd_db_load_string, "value not a number", MCD_EPARSE, "4",
      MS(text, HDR "species foo\n formula N2\n sigma abc angstrom\n")),
    C(mcd_db_load_string, "value NaN", MCD_EPARSE, "4",
      MS(text, HDR "species foo\n formula N2\n sigma nan angstrom\n")),
    C(mcd_db_load_string, "value overflows", MCD_EPARSE, "4",
      MS(text, HDR "species foo\n formula N2\n Tb 1e999 K\n")),
    C(mcd_db_load_string, "negative sigma", EDOM_, "4",
      MS(text, HDR "species foo\n formula N2\n sigma -3.7 angstrom\n")),
    C(mcd_db_load_string, "zero Tc", EDOM_, "4",
      MS(text, HDR "species foo\n formula N2\n Tc 0 K\n")),
    C(mcd_db_load_string, "unknown element", MCD_ENOTFOUND, "3",
      MS(text, HDR "species foo\n formula C2Xy\n")),
    C(mcd_db_load_string, "second block bad: all or nothing", MCD_EPARSE, "5",
      MS(text,
         HDR "species good-one\n formula N2\nspecies bad-one\n formula N2(\n")),
    C(mcd_db_load_string, "bad species name", MCD_EPARSE, "2",
      MS(text, HDR "species bad name here\n formula N2\n")),
    C(mcd_db_load_string, "missing formula", MCD_EPARSE, NULL,
      MS(text, HDR "species foo\n Tb 300 K\n")),
    C(mcd_db_load_string, "embedded control byte", MCD_EPARSE, "2",
      MS(text, HDR "species f\001oo\n formula N2\n")),

/* ---- compositions ---- */
#define COMP_COMMON(fn, xf, nbx)                                               \
    B(fn, MCD_OK), C(fn, "n 0", EINVAL_, NULL, MZ(n, 0)),                      \
        C(fn, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),           \
        C(fn, "n SIZE_MAX", EINVAL_, NULL, MZ(n, SIZE_MAX)),                   \
        C(fn, "fractions NULL", EINVAL_, NULL, MN(nbx)),                       \
        C(fn, "out NULL", EINVAL_, NULL, MN(NB_O1)),                           \
        C(fn, "fraction NaN", EINVAL_, NULL, MDA(xf, 1, SUP_NAN)),             \
        C(fn, "fraction inf", EINVAL_, NULL, MDA(xf, 0, SUP_INF)),             \
        C(fn, "fraction negative", EDOM_, NULL, MDA(xf, 1, -0.1),              \
          MDA(xf, 0, 0.9)),                                                    \
        C(fn, "sum 0.9", EDOM_, NULL, MDA(xf, 0, 0.4)),                        \
        C(fn, "sum 1 + 1e-5", EDOM_, NULL, MDA(xf, 2, 0.2 + 1e-5))
    COMP_COMMON(mcd_comp_normalize, x, NB_X),
    C(mcd_comp_normalize, "all zero", EDOM_, NULL, MDA(x, 0, 0.0),
      MDA(x, 1, 0.0), MDA(x, 2, 0.0)),
#define MASS_COMMON(fn)                                                        \
    C(fn, "M NULL", EINVAL_, NULL, MN(NB_M)),                                  \
        C(fn, "M NaN", EINVAL_, NULL, MDA(M, 2, SUP_NAN)),                     \
        C(fn, "M 0", EDOM_, NULL, MDA(M, 1, 0.0)),                             \
        C(fn, "M negative", EDOM_, NULL, MDA(M, 0, -0.028))
    COMP_COMMON(mcd_comp_x_to_w, x, NB_X),
    MASS_COMMON(mcd_comp_x_to_w),
    COMP_COMMON(mcd_comp_w_to_x, y, NB_Y),
    MASS_COMMON(mcd_comp_w_to_x),
    COMP_COMMON(mcd_comp_mean_molar_mass_x, x, NB_X),
    MASS_COMMON(mcd_comp_mean_molar_mass_x),
    COMP_COMMON(mcd_comp_mean_molar_mass_w, y, NB_Y),
    MASS_COMMON(mcd_comp_mean_molar_mass_w),
    COMP_COMMON(mcd_comp_x_to_c, x, NB_X),
    C(mcd_comp_x_to_c, "c NaN", EINVAL_, NULL, MD(c, SUP_NAN)),
    C(mcd_comp_x_to_c, "c inf", EINVAL_, NULL, MD(c, SUP_INF)),
    C(mcd_comp_x_to_c, "c 0", EDOM_, NULL, MD(c, 0.0)),
    C(mcd_comp_x_to_c, "c negative", EDOM_, NULL, MD(c, -1.0)),
    B(mcd_comp_c_to_x, MCD_OK),
    C(mcd_comp_c_to_x, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_comp_c_to_x, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_comp_c_to_x, "c NULL", EINVAL_, NULL, MN(NB_VALS)),
    C(mcd_comp_c_to_x, "out_x NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_comp_c_to_x, "out_c_total NULL", EINVAL_, NULL, MN(NB_O2)),
    C(mcd_comp_c_to_x, "c_i NaN", EINVAL_, NULL, MDA(vals, 1, SUP_NAN)),
    C(mcd_comp_c_to_x, "c_i -inf", EINVAL_, NULL, MDA(vals, 1, -SUP_INF)),
    C(mcd_comp_c_to_x, "c_i negative", EDOM_, NULL, MDA(vals, 2, -1.0)),
    C(mcd_comp_c_to_x, "all zero", EDOM_, NULL, MDA(vals, 0, 0.0),
      MDA(vals, 1, 0.0), MDA(vals, 2, 0.0)),
    B(mcd_comp_ideal_gas_c, MCD_OK),
    C(mcd_comp_ideal_gas_c, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_comp_ideal_gas_c, "P inf", EINVAL_, NULL, MD(P, SUP_INF)),
    C(mcd_comp_ideal_gas_c, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_comp_ideal_gas_c, "T negative", EDOM_, NULL, MD(T, -300.0)),
    C(mcd_comp_ideal_gas_c, "P 0", EDOM_, NULL, MD(P, 0.0)),
    C(mcd_comp_ideal_gas_c, "P -0", EDOM_, NULL, MD(P, -0.0)),
    C(mcd_comp_ideal_gas_c, "out NULL", EINVAL_, NULL, MN(NB_O1)),
#define GRAD_COMMON(fn, xf, nbx)                                               \
    COMP_COMMON(fn, xf, nbx), MASS_COMMON(fn),                                 \
        C(fn, "n_dim 0", EINVAL_, NULL, MZ(nd, 0)),                            \
        C(fn, "n_dim 4", EINVAL_, NULL, MZ(nd, 4)),                            \
        C(fn, "grad NULL", EINVAL_, NULL, MN(NB_GRAD)),                        \
        C(fn, "grad NaN", EINVAL_, NULL, MDA(grad, 3, SUP_NAN)),               \
        C(fn, "grad inf", EINVAL_, NULL, MDA(grad, 0, -SUP_INF))
    GRAD_COMMON(mcd_comp_grad_x_to_w, x, NB_X),
    GRAD_COMMON(mcd_comp_grad_w_to_x, y, NB_Y),

    /* ---- methods and binary estimates ---- */
    B(mcd_method_name, R_VALUE),
    C(mcd_method_name, "m 0", R_NULL, NULL, MI(method, 0)),
    C(mcd_method_name, "m 9", R_NULL, NULL, MI(method, 9)),
    C(mcd_method_name, "m -1", R_NULL, NULL, MI(method, -1)),
    B(mcd_method_from_name, MCD_OK),
    C(mcd_method_from_name, "name NULL", EINVAL_, NULL, MN(NB_NAME)),
    C(mcd_method_from_name, "out NULL", EINVAL_, NULL, MN(NB_OM)),
    C(mcd_method_from_name, "unknown", MCD_ENOTFOUND, NULL,
      MS(mname, "guesswork")),
    C(mcd_method_from_name, "empty", MCD_ENOTFOUND, NULL, MS(mname, "")),
    C(mcd_method_from_name, "prefix only", MCD_ENOTFOUND, NULL,
      MS(mname, "fs")),
    B(mcd_method_typical_error, R_VALUE),
    C(mcd_method_typical_error, "USER", R_NAN, NULL,
      MI(method, MCD_METHOD_USER)),
    C(mcd_method_typical_error, "m 0", R_NAN, NULL, MI(method, 0)),
    C(mcd_method_typical_error, "m 99", R_NAN, NULL, MI(method, 99)),
    B(mcd_warning_string, R_VALUE),
    C(mcd_warning_string, "bit 0", R_NULL, NULL, MU(bit, 0u)),
    C(mcd_warning_string, "bit 0x80", R_NULL, NULL, MU(bit, 0x80u)),
    C(mcd_warning_string, "two bits", R_NULL, NULL, MU(bit, 0x3u)),
#define TP_COMMON(fn)                                                          \
    B(fn, MCD_OK), C(fn, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),              \
        C(fn, "T inf", EINVAL_, NULL, MD(T, SUP_INF)),                         \
        C(fn, "P NaN", EINVAL_, NULL, MD(P, SUP_NAN)),                         \
        C(fn, "T 0", EDOM_, NULL, MD(T, 0.0)),                                 \
        C(fn, "T negative", EDOM_, NULL, MD(T, -10.0)),                        \
        C(fn, "P 0", EDOM_, NULL, MD(P, 0.0)),                                 \
        C(fn, "P negative", EDOM_, NULL, MD(P, -1e5)),                         \
        C(fn, "out NULL", EINVAL_, NULL, MN(NB_O1)),                           \
        C(fn, "MA NaN", EINVAL_, NULL, MD(MA, SUP_NAN)),                       \
        C(fn, "MB 0", EDOM_, NULL, MD(MB, 0.0)),                               \
        C(fn, "MA negative", EDOM_, NULL, MD(MA, -0.028))
    TP_COMMON(mcd_binary_fsg),
    C(mcd_binary_fsg, "VA 0", EDOM_, NULL, MD(VA, 0.0)),
    C(mcd_binary_fsg, "T subnormal: D underflows to 0", EDOM_, NULL,
      MD(T, 4.9e-324)),
    C(mcd_binary_fsg, "T 1e300: D overflows", EDOM_, NULL, MD(T, 1e300)),
    C(mcd_binary_fsg, "VB inf", EINVAL_, NULL, MD(VB, SUP_INF)),
    TP_COMMON(mcd_binary_chapman_enskog),
    C(mcd_binary_chapman_enskog, "sigA 0", EDOM_, NULL, MD(sigA, 0.0)),
    C(mcd_binary_chapman_enskog, "sigB NaN", EINVAL_, NULL, MD(sigB, SUP_NAN)),
    C(mcd_binary_chapman_enskog, "epsA negative", EDOM_, NULL, MD(epsA, -10.0)),
    C(mcd_binary_chapman_enskog, "epsB inf", EINVAL_, NULL, MD(epsB, SUP_INF)),
    C(mcd_binary_chapman_enskog, "P subnormal: D overflows", EDOM_, NULL,
      MD(P, 4.9e-324)),
    TP_COMMON(mcd_binary_wilke_lee),
    C(mcd_binary_wilke_lee, "sigA negative", EDOM_, NULL, MD(sigA, -3e-10)),
    C(mcd_binary_wilke_lee, "epsB 0", EDOM_, NULL, MD(epsB, 0.0)),
    C(mcd_binary_wilke_lee, "M_AB 0.01 g/mol: negative correlation", EDOM_,
      NULL, MD(MA, 1e-5), MD(MB, 1e-5)),
    TP_COMMON(mcd_binary_brokaw),
    C(mcd_binary_brokaw, "dipA negative", EDOM_, NULL, MD(dipA, -1e-30)),
    C(mcd_binary_brokaw, "dipA NaN", EINVAL_, NULL, MD(dipA, SUP_NAN)),
    C(mcd_binary_brokaw, "VbA 0", EDOM_, NULL, MD(Vb, 0.0)),
    C(mcd_binary_brokaw, "VbB inf", EINVAL_, NULL, MD(VbB, SUP_INF)),
    C(mcd_binary_brokaw, "TbA negative", EDOM_, NULL, MD(TbA, -300.0)),
    B(mcd_binary_wilke_chang, MCD_OK),
    C(mcd_binary_wilke_chang, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_binary_wilke_chang, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_binary_wilke_chang, "mu 0", EDOM_, NULL, MD(mu, 0.0)),
    C(mcd_binary_wilke_chang, "mu inf", EINVAL_, NULL, MD(mu, SUP_INF)),
    C(mcd_binary_wilke_chang, "M_solvent negative", EDOM_, NULL,
      MD(Ms, -0.018)),
    C(mcd_binary_wilke_chang, "phi 0", EDOM_, NULL, MD(phi, 0.0)),
    C(mcd_binary_wilke_chang, "Vb NaN", EINVAL_, NULL, MD(Vb, SUP_NAN)),
    C(mcd_binary_wilke_chang, "Vb 0", EDOM_, NULL, MD(Vb, 0.0)),
    C(mcd_binary_wilke_chang, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    B(mcd_binary_omega_d, MCD_OK),
    C(mcd_binary_omega_d, "T* 0", EDOM_, NULL, MD(Tstar, 0.0)),
    C(mcd_binary_omega_d, "T* negative", EDOM_, NULL, MD(Tstar, -1.0)),
    C(mcd_binary_omega_d, "T* NaN", EINVAL_, NULL, MD(Tstar, SUP_NAN)),
    C(mcd_binary_omega_d, "T* inf", EINVAL_, NULL, MD(Tstar, SUP_INF)),
    C(mcd_binary_omega_d, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    B(mcd_binary_scale, MCD_OK),
    C(mcd_binary_scale, "D_ref 0", EDOM_, NULL, MD(D_ref, 0.0)),
    C(mcd_binary_scale, "D_ref NaN", EINVAL_, NULL, MD(D_ref, SUP_NAN)),
    C(mcd_binary_scale, "T_ref negative", EDOM_, NULL, MD(T_ref, -298.0)),
    C(mcd_binary_scale, "P_ref 0", EDOM_, NULL, MD(P_ref, 0.0)),
    C(mcd_binary_scale, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_binary_scale, "P inf", EINVAL_, NULL, MD(P, SUP_INF)),
    C(mcd_binary_scale, "exponent NaN", EINVAL_, NULL, MD(expo, SUP_NAN)),
    C(mcd_binary_scale, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_binary_scale, "result overflows", EDOM_, NULL, MD(expo, 400.0),
      MD(T, 3000.0)),
    B(mcd_db_binary_gas, MCD_OK),
    C(mcd_db_binary_gas, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_binary_gas, "out_D NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_db_binary_gas, "a out of range", MCD_ENOTFOUND, NULL, MZ(ga, 100000)),
    C(mcd_db_binary_gas, "b SIZE_MAX", MCD_ENOTFOUND, NULL, MZ(gb, SIZE_MAX)),
    C(mcd_db_binary_gas, "method WILKE_CHANG", EINVAL_, NULL,
      MI(method, MCD_METHOD_WILKE_CHANG)),
    C(mcd_db_binary_gas, "method USER", EINVAL_, NULL,
      MI(method, MCD_METHOD_USER)),
    C(mcd_db_binary_gas, "method 99", EINVAL_, NULL, MI(method, 99)),
    C(mcd_db_binary_gas, "method RECOMMENDED (mixtures only)", EINVAL_,
      "method", MI(method, MCD_GAS_RECOMMENDED)),
    C(mcd_db_binary_gas, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_db_binary_gas, "P NaN", EINVAL_, NULL, MD(P, SUP_NAN)),
    C(mcd_db_binary_gas, "T -inf", EINVAL_, NULL, MD(T, -SUP_INF)),
    C(mcd_db_binary_gas, "sigma missing", MCD_ENODATA, NULL, MZ(ga, PROBE),
      MI(method, MCD_METHOD_CHAPMAN_ENSKOG)),
    C(mcd_db_binary_gas, "Wilke-Lee below M_AB 0.105 g/mol", EDOM_, NULL,
      MZ(ga, PROBE2), MZ(gb, PROBE2), MI(method, MCD_METHOD_WILKE_LEE)),
    B(mcd_db_binary_liquid, MCD_OK),
    C(mcd_db_binary_liquid, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_binary_liquid, "out_D NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_db_binary_liquid, "solute out of range", MCD_ENOTFOUND, NULL,
      MZ(sol, 100000)),
    C(mcd_db_binary_liquid, "solvent out of range", MCD_ENOTFOUND, NULL,
      MZ(solv, 100000)),
    C(mcd_db_binary_liquid, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_db_binary_liquid, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_db_binary_liquid, "mu 0", EDOM_, NULL, MD(mu, 0.0)),
    C(mcd_db_binary_liquid, "mu negative", EDOM_, NULL, MD(mu, -1e-3)),
    C(mcd_db_binary_liquid, "solute without Vb", MCD_ENODATA, NULL,
      MZ(sol, PROBE)),
    B(mcd_typical_error_widened, MCD_OK),
    C(mcd_typical_error_widened, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_typical_error_widened, "m 0", EINVAL_, "m", MI(method, 0)),
    C(mcd_typical_error_widened, "bit 0x80", EINVAL_, "warn", MU(bit, 0x80u)),
    B(mcd_db_binary_explain, MCD_OK),
    C(mcd_db_binary_explain, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_db_binary_explain, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_db_binary_explain, "method USER", EINVAL_, "method",
      MI(method, MCD_METHOD_USER)),
    C(mcd_db_binary_explain, "method 99", EINVAL_, "method", MI(method, 99)),
    C(mcd_db_binary_explain, "a out of range", MCD_ENOTFOUND, NULL,
      MZ(ga, 100000)),
    C(mcd_db_binary_explain, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_db_binary_explain, "P 0", EDOM_, NULL, MD(P, 0.0)),
    C(mcd_db_binary_explain, "sigma missing", MCD_ENODATA, NULL, MZ(ga, PROBE),
      MI(method, MCD_METHOD_CHAPMAN_ENSKOG)),
    C(mcd_db_binary_explain, "Wilke-Chang mu 0", EDOM_, NULL,
      MI(method, MCD_METHOD_WILKE_CHANG), MD(mu, 0.0)),

    /* ---- mixtures ---- */
    B(mcd_mixture_new, MCD_OK),
    C(mcd_mixture_new, "db NULL", EINVAL_, NULL, MN(NB_DB)),
    C(mcd_mixture_new, "names NULL", EINVAL_, NULL, MN(NB_NAMES)),
    C(mcd_mixture_new, "out_mix NULL", EINVAL_, NULL, MN(NB_OMIX)),
    C(mcd_mixture_new, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_mixture_new, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_mixture_new, "a name NULL", EINVAL_, NULL, MSA(names, 1, NULL)),
    C(mcd_mixture_new, "unknown species", MCD_ENOTFOUND, "kryptonite",
      MSA(names, 2, "kryptonite")),
    C(mcd_mixture_new, "species twice", EINVAL_, "oxygen",
      MSA(names, 2, "oxygen")),
    C(mcd_mixture_new, "method WILKE_CHANG", EINVAL_, NULL,
      MI(method, MCD_METHOD_WILKE_CHANG)),
    C(mcd_mixture_new, "method USER", EINVAL_, NULL,
      MI(method, MCD_METHOD_USER)),
    C(mcd_mixture_new, "method 0", EINVAL_, NULL, MI(method, 0)),
    B(mcd_mixture_free, R_VOID),
    C(mcd_mixture_free, "NULL is a no-op", R_VOID, NULL, MN(NB_MIX)),
    B(mcd_mixture_species_count, R_VALUE),
    C(mcd_mixture_species_count, "NULL", R_ZERO, NULL, MN(NB_MIX)),
    B(mcd_mixture_name, R_VALUE),
    C(mcd_mixture_name, "NULL", R_NULL, NULL, MN(NB_MIX)),
    C(mcd_mixture_name, "i = n", R_NULL, NULL, MZ(i, 3)),
    C(mcd_mixture_name, "i SIZE_MAX", R_NULL, NULL, MZ(i, SIZE_MAX)),
    B(mcd_mixture_molar_masses, MCD_OK),
    C(mcd_mixture_molar_masses, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_molar_masses, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    B(mcd_mixture_set_method, MCD_OK),
    C(mcd_mixture_set_method, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_set_method, "i == j", EINVAL_, NULL, MZ(j, 0)),
    C(mcd_mixture_set_method, "i = n", MCD_EBADLEN, NULL, MZ(i, 3)),
    C(mcd_mixture_set_method, "j SIZE_MAX", MCD_EBADLEN, NULL, MZ(j, SIZE_MAX)),
    C(mcd_mixture_set_method, "method 99", EINVAL_, NULL, MI(method, 99)),
    C(mcd_mixture_set_method, "USER without a value", EINVAL_, NULL,
      MI(method, MCD_METHOD_USER)),
    C(mcd_mixture_set_method, "liquid method", EINVAL_, NULL,
      MI(method, MCD_METHOD_WILKE_CHANG)),
    B(mcd_mixture_pair_method, MCD_OK),
    C(mcd_mixture_pair_method, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_pair_method, "out NULL", EINVAL_, NULL, MN(NB_OM)),
    C(mcd_mixture_pair_method, "i == j", EINVAL_, "i, j", MZ(j, 0)),
    C(mcd_mixture_pair_method, "i = n", MCD_EBADLEN, "argument i", MZ(i, 3)),
    C(mcd_mixture_pair_method, "j SIZE_MAX", MCD_EBADLEN, "argument j",
      MZ(j, SIZE_MAX)),
    B(mcd_mixture_set_binary, MCD_OK),
    C(mcd_mixture_set_binary, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_set_binary, "i == j", EINVAL_, NULL, MZ(j, 0)),
    C(mcd_mixture_set_binary, "i = n", MCD_EBADLEN, NULL, MZ(i, 3)),
    C(mcd_mixture_set_binary, "D NaN", EINVAL_, NULL, MD(value, SUP_NAN)),
    C(mcd_mixture_set_binary, "D 0", EDOM_, NULL, MD(value, 0.0)),
    C(mcd_mixture_set_binary, "D negative", EDOM_, NULL, MD(value, -1e-5)),
    C(mcd_mixture_set_binary, "T_ref negative", EDOM_, NULL, MD(T_ref, -1.0)),
    C(mcd_mixture_set_binary, "P_ref 0", EDOM_, NULL, MD(P_ref, 0.0)),
    C(mcd_mixture_set_binary, "P_ref inf", EINVAL_, NULL, MD(P_ref, SUP_INF)),
    B(mcd_mixture_binaries, MCD_OK),
    C(mcd_mixture_binaries, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_binaries, "out_D NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_mixture_binaries, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_mixture_binaries, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_mixture_binaries, "P negative", EDOM_, NULL, MD(P, -1.0)),
    C(mcd_mixture_binaries, "P inf", EINVAL_, NULL, MD(P, SUP_INF)),

    /* ---- workspaces ---- */
    B(mcd_workspace_new, MCD_OK),
    C(mcd_workspace_new, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_workspace_new, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_workspace_new, "n SIZE_MAX", EINVAL_, NULL, MZ(n, SIZE_MAX)),
    C(mcd_workspace_new, "out NULL", EINVAL_, NULL, MN(NB_OWS)),
    B(mcd_workspace_new_with, MCD_OK),
    C(mcd_workspace_new_with, "allocator fails", MCD_ENOMEM, NULL,
      MI(fail_alloc, 1)),
    C(mcd_workspace_new_with, "allocator NULL", EINVAL_, NULL, MN(NB_ALLOC)),
    C(mcd_workspace_new_with, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_workspace_new_with, "n above MCD_MAX_SPECIES", EINVAL_, NULL,
      MZ(n, BIG)),
    C(mcd_workspace_new_with, "out NULL", EINVAL_, NULL, MN(NB_OWS)),
    B(mcd_workspace_free, R_VOID),
    C(mcd_workspace_free, "NULL is a no-op", R_VOID, NULL, MN(NB_WS)),
    B(mcd_workspace_capacity, R_VALUE),
    C(mcd_workspace_capacity, "NULL", R_ZERO, NULL, MN(NB_WS)),
    /* the driver plants a detail before each call: a getter leaves it */
    B(mcd_last_error, R_VALUE),

/* ---- fluxes ---- */
#define FLUX_COMMON(fn)                                                        \
    B(fn, MCD_OK), C(fn, "ws NULL", EINVAL_, NULL, MN(NB_WS)),                 \
        C(fn, "n 0", EINVAL_, "n_species", MZ(n, 0)),                          \
        C(fn, "n above capacity", MCD_EBADLEN, "n_species", MZ(n, 4)),         \
        C(fn, "n above MCD_MAX_SPECIES", MCD_EBADLEN, "n_species",             \
          MZ(n, BIG)),                                                         \
        C(fn, "n SIZE_MAX", MCD_EBADLEN, "n_species", MZ(n, SIZE_MAX)),        \
        C(fn, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),                           \
        C(fn, "comp NULL", EINVAL_, "comp", MN(NB_X)),                         \
        C(fn, "comp NaN", EINVAL_, "comp", MDA(x, 1, SUP_NAN)),                \
        C(fn, "comp negative", EDOM_, "comp", MDA(x, 1, -0.1),                 \
          MDA(x, 0, 0.9)),                                                     \
        C(fn, "comp sum 0.5", EDOM_, "comp", MDA(x, 0, 0.0)),                  \
        C(fn, "comp sum 1.1", EDOM_, "comp", MDA(x, 0, 0.6)),                  \
        C(fn, "x_i = 1 + 1e-3", EDOM_, "comp", MDA(x, 0, 1.001),               \
          MDA(x, 1, 0.0), MDA(x, 2, 0.0)),                                     \
        C(fn, "Dij NaN", EINVAL_, "Dij", MDA(D, 1, SUP_NAN),                   \
          MDA(D, 3, SUP_NAN)),                                                 \
        C(fn, "Dij inf", EINVAL_, "Dij", MDA(D, 5, SUP_INF),                   \
          MDA(D, 7, SUP_INF)),                                                 \
        C(fn, "Dij 0", EDOM_, "Dij", MDA(D, 1, 0.0), MDA(D, 3, 0.0)),          \
        C(fn, "Dij negative", EDOM_, "Dij", MDA(D, 2, -1.6e-5),                \
          MDA(D, 6, -1.6e-5)),                                                 \
        C(fn, "Dij not symmetric", EDOM_, "Dij", MDA(D, 1, 2.1e-5)),           \
        C(fn, "Dij asymmetric by 1e-9", EDOM_, "Dij",                          \
          MDA(D, 1, 2.0e-5 * (1 + 1e-9))),                                     \
        C(fn, "Gamma NaN", EINVAL_, "Gamma", MI(use_gamma, 1),                 \
          MDA(Gamma, 4, SUP_NAN)),                                             \
        C(fn, "comp basis 7", EINVAL_, NULL, MI(basis, 7)),                    \
        C(fn, "mass comp without M", EINVAL_, "M", MI(basis, MCD_BASIS_MASS),  \
          MN(NB_M)),                                                           \
        C(fn, "M NaN (mass comp)", EINVAL_, "M", MI(basis, MCD_BASIS_MASS),    \
          MDA(M, 1, SUP_NAN)),                                                 \
        C(fn, "M 0 (mass comp)", EDOM_, "M", MI(basis, MCD_BASIS_MASS),        \
          MDA(M, 2, 0.0)),                                                     \
        C(fn, "M span > 1e12 (mass comp)", EDOM_, "span",                      \
          MI(basis, MCD_BASIS_MASS), MDA(M, 2, 1e-20))
    FLUX_COMMON(mcd_flux_compute),
    /* a positive subnormal Đ is outside the domain (>= DBL_MIN): 1/Đ
     * overflows; EDOM naming it, also for a pure component, where the
     * solve would not have noticed (and the batched call did) */
    C(mcd_flux_compute, "Dij subnormal", EDOM_, "subnormal",
      MDA(D, 1, 4.9e-324), MDA(D, 3, 4.9e-324)),
    C(mcd_flux_compute, "Dij subnormal, pure component", EDOM_, "subnormal",
      MDA(D, 1, 1e-310), MDA(D, 3, 1e-310), MDA(x, 0, 1.0), MDA(x, 1, 0.0),
      MDA(x, 2, 0.0)),
    C(mcd_flux_compute, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),
    C(mcd_flux_compute, "n_dim 4", EINVAL_, "n_dim", MZ(nd, 4)),
    C(mcd_flux_compute, "model 9", EINVAL_, "model", MI(model, 9)),
    C(mcd_flux_compute, "flux basis -1", EINVAL_, NULL, MI(basis2, -1)),
    C(mcd_flux_compute, "grad NULL", EINVAL_, "grad", MN(NB_GRAD)),
    C(mcd_flux_compute, "out NULL", EINVAL_, "out_flux", MN(NB_O1)),
    C(mcd_flux_compute, "grad NaN", EINVAL_, "grad", MDA(grad, 2, SUP_NAN)),
    C(mcd_flux_compute, "grad inf", EINVAL_, "grad", MDA(grad, 5, SUP_INF)),
    C(mcd_flux_compute, "grad_lnP NaN", EINVAL_, "grad_lnP", MI(use_glnp, 1),
      MDA(glnP, 1, SUP_NAN)),
    C(mcd_flux_compute, "kT without grad_lnT", EINVAL_, "grad_lnT",
      MI(use_kT, 1)),
    C(mcd_flux_compute, "grad_lnT without kT", EINVAL_, "kT", MI(use_kT, 2)),
    C(mcd_flux_compute, "kT NaN", EINVAL_, "kT", MI(use_kT, 3),
      MDA(kT, 1, SUP_NAN)),
    C(mcd_flux_compute, "grad_lnT inf", EINVAL_, "grad_lnT", MI(use_kT, 3),
      MDA(glnT, 1, SUP_INF)),
    C(mcd_flux_compute, "MA model, kT inf", EINVAL_, "kT", MI(use_kT, 3),
      MI(model, MCD_MODEL_MIXTURE_AVERAGED), MDA(kT, 2, -SUP_INF)),
    C(mcd_flux_compute, "c NaN", EINVAL_, "c", MD(c, SUP_NAN)),
    C(mcd_flux_compute, "c inf", EINVAL_, "c", MD(c, SUP_INF)),
    C(mcd_flux_compute, "c 0", EDOM_, "c", MD(c, 0.0)),
    C(mcd_flux_compute, "c negative", EDOM_, "c", MD(c, -40.0)),
    C(mcd_flux_compute, "c subnormal", EDOM_, "c", MD(c, 4.9e-324)),
    C(mcd_flux_compute, "mass flux without M", EINVAL_, "M",
      MI(basis2, MCD_BASIS_MASS), MN(NB_M)),
    C(mcd_flux_compute, "pressure gradient without M", EINVAL_, "M",
      MI(use_glnp, 1), MN(NB_M)),
    C(mcd_flux_compute, "MA model, Dij NaN", EINVAL_, "Dij",
      MI(model, MCD_MODEL_MIXTURE_AVERAGED), MDA(D, 1, SUP_NAN),
      MDA(D, 3, SUP_NAN)),
    C(mcd_flux_compute, "MA model, comp negative", EDOM_, "comp",
      MI(model, MCD_MODEL_MIXTURE_AVERAGED), MDA(x, 1, -0.1), MDA(x, 0, 0.9)),
    C(mcd_flux_compute, "MA model, c 0", EDOM_, "c",
      MI(model, MCD_MODEL_MIXTURE_AVERAGED), MD(c, 0.0)),
    B(mcd_flux_jacobian_comp, MCD_OK),
    C(mcd_flux_jacobian_comp, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_flux_jacobian_comp, "mass basis", EINVAL_, "comp_basis",
      MI(basis, MCD_BASIS_MASS)),
    C(mcd_flux_jacobian_comp, "out NULL", EINVAL_, "out_dJ", MN(NB_O1)),
    C(mcd_flux_jacobian_comp, "n above capacity", MCD_EBADLEN, "n_species",
      MZ(n, 4)),
    C(mcd_flux_jacobian_comp, "comp negative", EDOM_, "comp", MDA(x, 1, -0.1),
      MDA(x, 0, 0.9)),
    C(mcd_flux_jacobian_comp, "Dij 0", EDOM_, "Dij", MDA(D, 1, 0.0),
      MDA(D, 3, 0.0)),
    C(mcd_flux_jacobian_comp, "grad NaN", EINVAL_, "grad",
      MDA(grad, 2, SUP_NAN)),
    C(mcd_flux_jacobian_comp, "c 0", EDOM_, "c", MD(c, 0.0)),
    C(mcd_flux_jacobian_comp, "pressure gradient without M", EINVAL_, "M",
      MI(use_glnp, 1), MN(NB_M)),
    B(mcd_flux_jacobian, MCD_OK),
    C(mcd_flux_jacobian, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_flux_jacobian, "iterative model", EINVAL_, "model",
      MI(model, MCD_MODEL_ITERATIVE)),
    C(mcd_flux_jacobian, "model 9", EINVAL_, "model", MI(model, 9)),
    C(mcd_flux_jacobian, "flux basis 5", EINVAL_, "flux_basis", MI(basis2, 5)),
    C(mcd_flux_jacobian, "out NULL", EINVAL_, "out_dflux", MN(NB_O1)),
    C(mcd_flux_jacobian, "n above capacity", MCD_EBADLEN, "n_species",
      MZ(n, 4)),
    C(mcd_flux_jacobian, "comp negative", EDOM_, "comp", MDA(x, 1, -0.1),
      MDA(x, 0, 0.9)),
    C(mcd_flux_jacobian, "Dij 0", EDOM_, "Dij", MDA(D, 1, 0.0), MDA(D, 3, 0.0)),
    C(mcd_flux_jacobian, "c 0", EDOM_, "c", MD(c, 0.0)),
    C(mcd_flux_jacobian, "mass fluxes without M", EINVAL_, "M",
      MI(basis2, MCD_BASIS_MASS), MN(NB_M)),
    B(mcd_flux_jacobian_tp, MCD_OK),
    C(mcd_flux_jacobian_tp, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_flux_jacobian_tp, "iterative model", EINVAL_, "model",
      MI(model, MCD_MODEL_ITERATIVE)),
    C(mcd_flux_jacobian_tp, "both outputs NULL", EINVAL_, "out_dT", MN(NB_O1),
      MN(NB_O2)),
    C(mcd_flux_jacobian_tp, "T 0", EDOM_, "argument T", MD(T, 0.0)),
    C(mcd_flux_jacobian_tp, "P NaN", EINVAL_, "argument P", MD(P, SUP_NAN)),
    C(mcd_flux_jacobian_tp, "dDij_dT NULL", EINVAL_, "dDij_dT", MN(NB_GAMMA)),
    C(mcd_flux_jacobian_tp, "dDij_dP NULL", EINVAL_, "dDij_dP", MN(NB_F)),
    C(mcd_flux_jacobian_tp, "comp negative", EDOM_, "comp", MDA(x, 1, -0.1),
      MDA(x, 0, 0.9)),
    B(mcd_flux_batch_jacobian, MCD_OK),
    C(mcd_flux_batch_jacobian, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_flux_batch_jacobian, "iterative model", EINVAL_, "model",
      MI(model, MCD_MODEL_ITERATIVE)),
    C(mcd_flux_batch_jacobian, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),
    C(mcd_flux_batch_jacobian, "out_jac NULL", EINVAL_, "out_jac", MN(NB_O1)),
    C(mcd_flux_batch_jacobian, "comp NULL", EINVAL_, "comp", MN(NB_X)),
    C(mcd_flux_batch_jacobian, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),
    C(mcd_flux_batch_jacobian, "c NULL", EINVAL_, "c", MN(NB_VALS)),
    C(mcd_flux_batch_jacobian, "capacity 2 < N", MCD_EBADLEN, NULL,
      MI(use_small_ws, 1)),
    C(mcd_flux_batch_jacobian, "comp negative", EDOM_, "cell 0: argument comp",
      MDA(x, 1, -0.1), MDA(x, 0, 0.9)),
    C(mcd_flux_batch_jacobian, "kT without grad_lnT", EINVAL_, "grad_lnT",
      MI(use_kT, 1)),
    C(mcd_flux_batch_jacobian, "mass fluxes without M", EINVAL_, "M",
      MI(basis2, MCD_BASIS_MASS), MN(NB_M)),
    B(mcd_thermal_ratios, MCD_OK),
    C(mcd_thermal_ratios, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_thermal_ratios, "n 0", EINVAL_, "n_species", MZ(n, 0)),
    C(mcd_thermal_ratios, "n above capacity", MCD_EBADLEN, "n_species",
      MZ(n, 4)),
    C(mcd_thermal_ratios, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_thermal_ratios, "M 0", EDOM_, "M", MDA(M, 1, 0.0)),
    C(mcd_thermal_ratios, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),
    C(mcd_thermal_ratios, "Dij 0", EDOM_, "Dij", MDA(D, 1, 0.0),
      MDA(D, 3, 0.0)),
    C(mcd_thermal_ratios, "comp NaN", EINVAL_, "comp", MDA(x, 1, SUP_NAN)),
    C(mcd_thermal_ratios, "comp sum 0.5", EDOM_, "comp", MDA(x, 0, 0.0)),
    C(mcd_thermal_ratios, "c 0", EDOM_, "c", MD(c, 0.0)),
    C(mcd_thermal_ratios, "DT NULL", EINVAL_, "DT", MN(NB_VALS)),
    C(mcd_thermal_ratios, "DT NaN", EINVAL_, "DT", MDA(DT, 2, SUP_NAN)),
    C(mcd_thermal_ratios, "out NULL", EINVAL_, "out_kT", MN(NB_O1)),
    C(mcd_thermal_ratios, "comp basis 7", EINVAL_, "comp_basis", MI(basis, 7)),
    FLUX_COMMON(mcd_fick_matrix),
    /* as above */
    C(mcd_fick_matrix, "Dij subnormal", EDOM_, "subnormal", MDA(D, 1, 4.9e-324),
      MDA(D, 3, 4.9e-324)),
    C(mcd_fick_matrix, "out_D NULL", EINVAL_, "out_D", MN(NB_O1)),
    C(mcd_fick_matrix, "dependent = n", EINVAL_, "dependent", MZ(dep, 3)),
    C(mcd_fick_matrix, "dependent SIZE_MAX-1", EINVAL_, "dependent",
      MZ(dep, SIZE_MAX - 1)),
    C(mcd_fick_matrix, "result basis 5", EINVAL_, "basis", MI(basis2, 5)),
    C(mcd_fick_matrix, "mass result without M", EINVAL_, "M",
      MI(basis2, MCD_BASIS_MASS), MN(NB_M)),
    B(mcd_fick_fluxes, MCD_OK),
    C(mcd_fick_fluxes, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_fick_fluxes, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_fick_fluxes, "n SIZE_MAX", EINVAL_, NULL, MZ(n, SIZE_MAX)),
    C(mcd_fick_fluxes, "n_dim 0", EINVAL_, NULL, MZ(nd, 0)),
    C(mcd_fick_fluxes, "n_dim 4", EINVAL_, NULL, MZ(nd, 4)),
    C(mcd_fick_fluxes, "dependent AUTO", EINVAL_, NULL,
      MZ(dep, MCD_DEPENDENT_AUTO)),
    C(mcd_fick_fluxes, "dependent = n", EINVAL_, NULL, MZ(dep, 3)),
    C(mcd_fick_fluxes, "D NULL", EINVAL_, NULL, MN(NB_F)),
    C(mcd_fick_fluxes, "grad NULL", EINVAL_, NULL, MN(NB_GRAD)),
    C(mcd_fick_fluxes, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_fick_fluxes, "D NaN", EINVAL_, NULL, MDA(F, 3, SUP_NAN)),
    C(mcd_fick_fluxes, "grad NaN (independent row)", EINVAL_, NULL,
      MDA(grad, 3, SUP_NAN)),
    C(mcd_fick_fluxes, "grad NaN in the ignored dependent row", MCD_OK, NULL,
      MDA(grad, 0, SUP_NAN), MDA(grad, 1, SUP_INF)),
    C(mcd_fick_fluxes, "conc NaN", EINVAL_, NULL, MD(conc, SUP_NAN)),
    C(mcd_fick_fluxes, "finite inputs, fluxes overflow", EDOM_, NULL,
      MDA(F, 0, 1e300), MDA(grad, 2, 1e300)),
    C(mcd_fick_fluxes, "conc 0", EDOM_, NULL, MD(conc, 0.0)),
    C(mcd_fick_fluxes, "conc negative", EDOM_, NULL, MD(conc, -1.0)),
    B(mcd_fick_eigenvalues, MCD_OK),
    C(mcd_fick_eigenvalues, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_fick_eigenvalues, "order = capacity", MCD_EBADLEN, "order", MZ(m, 3)),
    C(mcd_fick_eigenvalues, "order SIZE_MAX", MCD_EBADLEN, "order",
      MZ(m, SIZE_MAX)),
    C(mcd_fick_eigenvalues, "D NULL", EINVAL_, "D", MN(NB_F)),
    C(mcd_fick_eigenvalues, "out_re NULL", EINVAL_, "out_re", MN(NB_O1)),
    C(mcd_fick_eigenvalues, "out_im NULL", EINVAL_, "out_im", MN(NB_O2)),
    C(mcd_fick_eigenvalues, "D NaN", EINVAL_, "D", MDA(F, 1, SUP_NAN)),
    C(mcd_fick_eigenvalues, "D inf", EINVAL_, "D", MDA(F, 0, SUP_INF)),

/* ---- frames ---- */
#define FRAME_COMMON(fn, xlen_ok)                                              \
    B(fn, MCD_OK), C(fn, "n 0", EINVAL_, NULL, MZ(n, 0)),                      \
        C(fn, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),           \
        C(fn, "n SIZE_MAX", EINVAL_, NULL, MZ(n, SIZE_MAX)),                   \
        C(fn, "n_dim 0", EINVAL_, NULL, MZ(nd, 0)),                            \
        C(fn, "n_dim 4", EINVAL_, NULL, MZ(nd, 4)),                            \
        C(fn, "x NULL", EINVAL_, NULL, MN(NB_X)),                              \
        C(fn, "out NULL", EINVAL_, NULL, MN(NB_O1)),                           \
        C(fn, "x NaN", EINVAL_, NULL, MDA(x, 2, SUP_NAN)),                     \
        C(fn, "x negative", EDOM_, NULL, MDA(x, 2, -0.2), MDA(x, 0, 0.9)),     \
        C(fn, "x sum 0.8", EDOM_, NULL, MDA(x, 2, 0.0)),                       \
        C(fn, "J NULL", EINVAL_, NULL, MN(NB_J)),                              \
        C(fn, "J NaN", EINVAL_, NULL, MDA(J, 4, SUP_NAN)),                     \
        C(fn, "J inf", EINVAL_, NULL, MDA(J, 1, -SUP_INF))
    FRAME_COMMON(mcd_flux_convert, 1),
    C(mcd_flux_convert, "M NULL", EINVAL_, NULL, MN(NB_M)),
    C(mcd_flux_convert, "M 0", EDOM_, NULL, MDA(M, 0, 0.0)),
    C(mcd_flux_convert, "M NaN", EINVAL_, NULL, MDA(M, 0, SUP_NAN)),
    C(mcd_flux_convert, "from 3", EINVAL_, NULL, MI(basis, 3)),
    C(mcd_flux_convert, "to -1", EINVAL_, NULL, MI(basis2, -1)),
    C(mcd_flux_convert, "j/M overflows", EDOM_, NULL, MI(basis, MCD_BASIS_MASS),
      MDA(J, 0, 1e307)),
    FRAME_COMMON(mcd_flux_to_volume_frame, 1),
    C(mcd_flux_to_volume_frame, "Vbar NULL", EINVAL_, NULL, MN(NB_VBAR)),
    C(mcd_flux_to_volume_frame, "Vbar NaN", EINVAL_, NULL,
      MDA(Vbar, 1, SUP_NAN)),
    C(mcd_flux_to_volume_frame, "sum x Vbar != 1/c", EDOM_, NULL,
      MDA(Vbar, 0, 0.05)),
    C(mcd_flux_to_volume_frame, "c 0", EDOM_, NULL, MD(c, 0.0)),
    C(mcd_flux_to_volume_frame, "c NaN", EINVAL_, NULL, MD(c, SUP_NAN)),
    C(mcd_flux_to_volume_frame, "sum Vbar J overflows", EDOM_, NULL,
      MDA(J, 0, 1.7e308), MDA(J, 2, 1.7e308), MDA(J, 4, 1.7e308)),
    FRAME_COMMON(mcd_flux_to_species_frame, 1),
    C(mcd_flux_to_species_frame, "k = n", EINVAL_, NULL, MZ(k, 3)),
    C(mcd_flux_to_species_frame, "k SIZE_MAX", EINVAL_, NULL, MZ(k, SIZE_MAX)),
    C(mcd_flux_to_species_frame, "x_k = 0", EDOM_, NULL, MZ(k, 2),
      MDA(x, 2, 0.0), MDA(x, 0, 0.7)),
    C(mcd_flux_to_species_frame, "J_k / x_k overflows", EDOM_, NULL, MZ(k, 2),
      MDA(x, 2, 1e-300), MDA(x, 0, 0.7), MDA(J, 4, 1e10)),
    FRAME_COMMON(mcd_flux_total, 1),
    C(mcd_flux_total, "basis 2", EINVAL_, NULL, MI(basis, 2)),
    C(mcd_flux_total, "kind 4 (no such condition)", EINVAL_, NULL, MI(kind, 4)),
    C(mcd_flux_total, "kind 99", EINVAL_, NULL, MI(kind, 99)),
    C(mcd_flux_total, "TOTAL, values NULL", EINVAL_, NULL,
      MI(kind, MCD_BOOT_TOTAL), MN(NB_VALS)),
    C(mcd_flux_total, "TOTAL, values NaN", EINVAL_, NULL,
      MI(kind, MCD_BOOT_TOTAL), MDA(vals, 1, SUP_NAN)),
    C(mcd_flux_total, "WEIGHTS, values NULL", EINVAL_, NULL,
      MI(kind, MCD_BOOT_WEIGHTS), MN(NB_VALS)),
    C(mcd_flux_total, "WEIGHTS, sum nu x = 0", EDOM_, NULL,
      MI(kind, MCD_BOOT_WEIGHTS), MDA(vals, 0, 0.0), MDA(vals, 1, 0.0),
      MDA(vals, 2, 0.0)),
    C(mcd_flux_total, "WEIGHTS, nu inf", EINVAL_, NULL,
      MI(kind, MCD_BOOT_WEIGHTS), MDA(vals, 2, SUP_INF)),
    C(mcd_flux_total, "STAGNANT species = n", EINVAL_, NULL,
      MI(kind, MCD_BOOT_STAGNANT), MZ(species, 3)),
    C(mcd_flux_total, "STAGNANT species absent", EDOM_, NULL,
      MI(kind, MCD_BOOT_STAGNANT), MZ(species, 2), MDA(x, 2, 0.0),
      MDA(x, 0, 0.7)),
    C(mcd_flux_total, "bulk flux overflows", EDOM_, NULL,
      MI(kind, MCD_BOOT_STAGNANT), MZ(species, 2), MDA(x, 2, 1e-10),
      MDA(x, 0, 0.7 - 1e-10), MDA(J, 4, 1e300)),
    FRAME_COMMON(mcd_flux_velocity_difference, 1),
    C(mcd_flux_velocity_difference, "M NULL", EINVAL_, NULL, MN(NB_M)),
    C(mcd_flux_velocity_difference, "M negative", EDOM_, NULL,
      MDA(M, 1, -0.032)),
    C(mcd_flux_velocity_difference, "c 0", EDOM_, NULL, MD(c, 0.0)),
    C(mcd_flux_velocity_difference, "c inf", EINVAL_, NULL, MD(c, SUP_INF)),
    C(mcd_flux_velocity_difference, "v - u overflows", EDOM_, NULL,
      MD(c, 1e-300), MDA(J, 0, 1e300)),
    B(mcd_flux_project, MCD_OK),
    C(mcd_flux_project, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_flux_project, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_flux_project, "n_dim 0", EINVAL_, NULL, MZ(nd, 0)),
    C(mcd_flux_project, "n_dim 4", EINVAL_, NULL, MZ(nd, 4)),
    C(mcd_flux_project, "inout NULL", EINVAL_, NULL, MN(NB_O1)),
    C(mcd_flux_project, "inout NaN", EINVAL_, NULL, MDA(o.o1, 3, SUP_NAN)),
    C(mcd_flux_project, "inout inf", EINVAL_, NULL, MDA(o.o1, 0, SUP_INF)),
    C(mcd_flux_project, "weights NaN", EINVAL_, NULL, MDA(vals, 1, SUP_NAN)),
    C(mcd_flux_project, "weights negative", EDOM_, NULL, MDA(vals, 1, -0.2)),
    C(mcd_flux_project, "sum overflows", EDOM_, NULL, MDA(o.o1, 0, 1.7e308),
      MDA(o.o1, 2, 1.7e308)),
    C(mcd_flux_project, "weights all zero", EDOM_, NULL, MDA(vals, 0, 0.0),
      MDA(vals, 1, 0.0), MDA(vals, 2, 0.0)),
    B(mcd_flux_diagnose, MCD_OK),
    C(mcd_flux_diagnose, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_flux_diagnose, "n above MCD_MAX_SPECIES", EINVAL_, NULL, MZ(n, BIG)),
    C(mcd_flux_diagnose, "n_dim 0", EINVAL_, NULL, MZ(nd, 0)),
    C(mcd_flux_diagnose, "n_dim 4", EINVAL_, NULL, MZ(nd, 4)),
    C(mcd_flux_diagnose, "grad NULL", EINVAL_, NULL, MN(NB_GRAD)),
    C(mcd_flux_diagnose, "flux NULL", EINVAL_, NULL, MN(NB_J)),
    C(mcd_flux_diagnose, "flags NULL", EINVAL_, NULL, MN(NB_OU)),
    C(mcd_flux_diagnose, "grad NaN", EINVAL_, NULL, MDA(grad, 1, SUP_NAN)),
    C(mcd_flux_diagnose, "flux inf", EINVAL_, NULL, MDA(J, 1, SUP_INF)),
    C(mcd_flux_diagnose, "rel_tol 0", EINVAL_, NULL, MD(tol_diag, 0.0)),
    C(mcd_flux_diagnose, "rel_tol 1", EINVAL_, NULL, MD(tol_diag, 1.0)),
    C(mcd_flux_diagnose, "rel_tol NaN", EINVAL_, NULL, MD(tol_diag, SUP_NAN)),

/* ---- batched fluxes: one cell (K = 1), so that the failing cell is
     * the only one and nothing at all may be written ---- */
#define BATCH_COMMON(fn)                                                       \
    B(fn, MCD_OK), C(fn, "ws NULL", EINVAL_, NULL, MN(NB_WS)),                 \
        C(fn, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),                         \
        C(fn, "n_dim 4", EINVAL_, "n_dim", MZ(nd, 4)),                         \
        C(fn, "model 9", EINVAL_, "model", MI(model, 9)),                      \
        C(fn, "comp basis 7", EINVAL_, NULL, MI(basis, 7)),                    \
        C(fn, "flux basis -1", EINVAL_, NULL, MI(basis2, -1)),                 \
        C(fn, "comp NULL", EINVAL_, "comp", MN(NB_X)),                         \
        C(fn, "grad NULL", EINVAL_, "grad", MN(NB_GRAD)),                      \
        C(fn, "out NULL", EINVAL_, "out_flux", MN(NB_O1)),                     \
        C(fn, "capacity 2 < N", MCD_EBADLEN, NULL, MI(use_small_ws, 1)),       \
        C(fn, "comp NaN", EINVAL_, "cell", MDA(x, 1, SUP_NAN)),                \
        C(fn, "comp negative", EDOM_, "cell", MDA(x, 1, -0.1),                 \
          MDA(x, 0, 0.9)),                                                     \
        C(fn, "comp sum 0.5", EDOM_, "cell", MDA(x, 0, 0.0)),                  \
        C(fn, "grad inf", EINVAL_, "cell", MDA(grad, 3, SUP_INF)),             \
        C(fn, "grad_lnP NaN", EINVAL_, "cell", MI(use_glnp, 1),                \
          MDA(glnP, 1, SUP_NAN)),                                              \
        C(fn, "kT NaN", EINVAL_, "cell", MI(use_kT, 3), MDA(kT, 1, SUP_NAN)),  \
        C(fn, "grad_lnT inf", EINVAL_, "cell", MI(use_kT, 3),                  \
          MDA(glnT, 0, SUP_INF)),                                              \
        C(fn, "kT without grad_lnT", EINVAL_, "grad_lnT", MI(use_kT, 1))
#define BATCH_MIX(fn)                                                          \
    BATCH_COMMON(fn), C(fn, "mix NULL", EINVAL_, "mix", MN(NB_MIX)),           \
        C(fn, "T NULL", EINVAL_, "T", MN(NB_T)),                               \
        C(fn, "P NULL", EINVAL_, "P", MN(NB_VBAR)),                            \
        C(fn, "T NaN", EINVAL_, "cell", MDA(Tc, 0, SUP_NAN)),                  \
        C(fn, "T 0", EDOM_, "cell", MDA(Tc, 0, 0.0)),                          \
        C(fn, "T negative", EDOM_, "cell", MDA(Tc, 0, -300.0)),                \
        C(fn, "P inf", EINVAL_, "cell", MDA(Pc, 0, SUP_INF)),                  \
        C(fn, "P 0", EDOM_, "cell", MDA(Pc, 0, 0.0)),                          \
        C(fn, "P / (R T) subnormal", EDOM_, "concentration",                   \
          MDA(Pc, 0, 1e-300), MDA(Tc, 0, 1e10))
    BATCH_MIX(mcd_flux_batch),
    BATCH_MIX(mcd_flux_batch_aos),
    BATCH_COMMON(mcd_flux_batch_dij),
    C(mcd_flux_batch_dij, "n 0", EINVAL_, NULL, MZ(n, 0)),
    C(mcd_flux_batch_dij, "n above capacity", MCD_EBADLEN, NULL, MZ(n, 4)),
    C(mcd_flux_batch_dij, "n above MCD_MAX_SPECIES", MCD_EBADLEN, NULL,
      MZ(n, BIG)),
    C(mcd_flux_batch_dij, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),
    C(mcd_flux_batch_dij, "c NULL", EINVAL_, "c", MN(NB_VALS)),
    C(mcd_flux_batch_dij, "Dij NaN", EINVAL_, "cell", MDA(D, 1, SUP_NAN),
      MDA(D, 3, SUP_NAN)),
    C(mcd_flux_batch_dij, "Dij 0", EDOM_, "cell", MDA(D, 1, 0.0),
      MDA(D, 3, 0.0)),
    C(mcd_flux_batch_dij, "Dij subnormal", EDOM_, "subnormal",
      MDA(D, 1, 1e-310), MDA(D, 3, 1e-310)),
    C(mcd_flux_batch_dij, "Dij not symmetric", EDOM_, "cell",
      MDA(D, 1, 2.1e-5)),
    C(mcd_flux_batch_dij, "c 0", EDOM_, "cell", MDA(cc, 0, 0.0)),
    /* a subnormal c is EDOM as in mcd_flux_compute (found by fuzz_flux:
     * the batched check took c > 0 and the fluxes underflowed unevenly) */
    C(mcd_flux_batch_dij, "c subnormal", EDOM_, "normal", MDA(cc, 0, 4.9e-324)),
    C(mcd_flux_batch_dij, "c NaN", EINVAL_, "cell", MDA(cc, 0, SUP_NAN)),
    C(mcd_flux_batch_dij, "mass comp without M", EINVAL_, "M",
      MI(basis, MCD_BASIS_MASS), MN(NB_M)),
    C(mcd_flux_batch_dij, "M span > 1e12 (mass comp)", EDOM_, "span",
      MI(basis, MCD_BASIS_MASS), MDA(M, 2, 1e-20)),
    B(mcd_workspace_set_iterative, MCD_OK),
    C(mcd_workspace_set_iterative, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_workspace_set_iterative, "max_iter 0", EINVAL_, "max_iter",
      MZ(max_iter, 0)),
    C(mcd_workspace_set_iterative, "max_iter 1001", EINVAL_, "max_iter",
      MZ(max_iter, 1001)),
    C(mcd_workspace_set_iterative, "tol NaN", EINVAL_, "tol",
      MD(tol_it, SUP_NAN)),
    C(mcd_workspace_set_iterative, "tol inf", EINVAL_, "tol",
      MD(tol_it, SUP_INF)),
    C(mcd_workspace_set_iterative, "tol negative", EINVAL_, "tol",
      MD(tol_it, -1e-10)),
    B(mcd_workspace_iterative_outcome, MCD_OK),
    C(mcd_workspace_iterative_outcome, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    B(mcd_workspace_set_threads, MCD_OK),
    C(mcd_workspace_set_threads, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    B(mcd_workspace_set_dij_read, MCD_OK),
    C(mcd_workspace_set_dij_read, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_workspace_set_dij_read, "mode 2", EINVAL_, "mode", MI(dij_mode, 2)),
    C(mcd_workspace_set_dij_read, "mode -1", EINVAL_, "mode", MI(dij_mode, -1)),
    B(mcd_mixture_set_temperature_fit, MCD_OK),
    C(mcd_mixture_set_temperature_fit, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),
    C(mcd_mixture_set_temperature_fit, "T_min NaN", EINVAL_, NULL,
      MD(Tlo, SUP_NAN)),
    C(mcd_mixture_set_temperature_fit, "T_max inf", EINVAL_, NULL,
      MD(Thi, SUP_INF)),
    C(mcd_mixture_set_temperature_fit, "T_min > T_max", EDOM_, NULL,
      MD(Tlo, 900.0)),
    C(mcd_mixture_set_temperature_fit, "T_min = T_max", EDOM_, NULL,
      MD(Tlo, 800.0)),
    C(mcd_mixture_set_temperature_fit, "T_min negative", EDOM_, NULL,
      MD(Tlo, -10.0)),
    C(mcd_mixture_set_temperature_fit, "T_min 0, T_max > 0", EDOM_, NULL,
      MD(Tlo, 0.0)),
    B(mcd_mixture_temperature_fit, MCD_OK),
    C(mcd_mixture_temperature_fit, "mix NULL", EINVAL_, NULL, MN(NB_MIX)),

/* ---- transfer ---- */
#define XFER_COMMON(fn, x0w)                                                   \
    B(fn, MCD_OK), C(fn, "ws NULL", EINVAL_, NULL, MN(NB_WS)),                 \
        C(fn, "n 1", EINVAL_, "n_species", MZ(n, 1)),                          \
        C(fn, "n 0", EINVAL_, "n_species", MZ(n, 0)),                          \
        C(fn, "n above capacity", MCD_EBADLEN, "n_species", MZ(n, 4)),         \
        C(fn, "n above MCD_MAX_SPECIES", EINVAL_, "n_species", MZ(n, BIG)),    \
        C(fn, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),                           \
        C(fn, "Dij NaN", EINVAL_, "Dij", MDA(D, 1, SUP_NAN),                   \
          MDA(D, 3, SUP_NAN)),                                                 \
        C(fn, "Dij 0", EDOM_, "Dij", MDA(D, 5, 0.0), MDA(D, 7, 0.0)),          \
        C(fn, "Dij not symmetric", EDOM_, "Dij", MDA(D, 2, 1.7e-5)),           \
        C(fn, "Dij subnormal", EDOM_, "subnormal", MDA(D, 1, 4.9e-324),        \
          MDA(D, 3, 4.9e-324)),                                                \
        C(fn, "c NaN", EINVAL_, "c", MD(c, SUP_NAN)),                          \
        C(fn, "c 0", EDOM_, "c", MD(c, 0.0)),                                  \
        C(fn, "L inf", EINVAL_, "L", MD(L, SUP_INF)),                          \
        C(fn, "L negative", EDOM_, "L", MD(L, -1e-3)),                         \
        C(fn, "x0 NULL", EINVAL_, x0w, MN(NB_X)),                              \
        C(fn, "x0 NaN", EINVAL_, x0w, MDA(x, 1, SUP_NAN)),                     \
        C(fn, "x0 negative", EDOM_, x0w, MDA(x, 1, -0.3), MDA(x, 0, 1.1)),     \
        C(fn, "x0 sum 0.7", EDOM_, x0w, MDA(x, 1, 0.0))
    XFER_COMMON(mcd_film_solve, "x0"),
    C(mcd_film_solve, "xL NULL", EINVAL_, "xL", MN(NB_X2)),
    C(mcd_film_solve, "xL sum 1.2", EDOM_, "xL", MDA(x2, 1, 0.5)),
    C(mcd_film_solve, "xL NaN", EINVAL_, "xL", MDA(x2, 2, SUP_NAN)),
    C(mcd_film_solve, "out_N NULL", EINVAL_, "out_N", MN(NB_O1)),
    C(mcd_film_solve, "kind 17", EINVAL_, NULL, MI(kind, 17)),
    C(mcd_film_solve, "method 2", EINVAL_, NULL, MI(film_method, 2)),
    C(mcd_film_solve, "STAGNANT species = n", EINVAL_, NULL,
      MI(kind, MCD_FILM_BOOT_STAGNANT), MZ(species, 3)),
    C(mcd_film_solve, "STAGNANT species absent at z = 0", EDOM_, NULL,
      MI(kind, MCD_FILM_BOOT_STAGNANT), MZ(species, 2), MDA(x, 2, 0.0),
      MDA(x, 0, 0.7)),
    C(mcd_film_solve, "TOTAL values NULL", EINVAL_, NULL,
      MI(kind, MCD_FILM_BOOT_TOTAL), MN(NB_VALS)),
    C(mcd_film_solve, "TOTAL N_t NaN", EINVAL_, NULL,
      MI(kind, MCD_FILM_BOOT_TOTAL), MDA(vals, 0, SUP_NAN)),
    C(mcd_film_solve, "WEIGHTS all zero", EDOM_, NULL,
      MI(kind, MCD_FILM_BOOT_WEIGHTS), MDA(vals, 0, 0.0), MDA(vals, 1, 0.0),
      MDA(vals, 2, 0.0)),
    C(mcd_film_solve, "RATIOS values NULL", EINVAL_, NULL,
      MI(kind, MCD_FILM_BOOT_RATIOS), MN(NB_VALS)),
    C(mcd_film_solve, "RATIOS sum 2", EDOM_, NULL,
      MI(kind, MCD_FILM_BOOT_RATIOS), MDA(vals, 2, 1.7)),
    C(mcd_film_solve, "rate factor beyond 1e4", EDOM_, NULL,
      MI(kind, MCD_FILM_BOOT_TOTAL), MDA(vals, 0, 1e9)),
    XFER_COMMON(mcd_film_profile, "x0"),
    C(mcd_film_profile, "N NULL", EINVAL_, "N", MN(NB_NF)),
    C(mcd_film_profile, "N NaN", EINVAL_, "N", MDA(Nf, 1, SUP_NAN)),
    C(mcd_film_profile, "z NULL", EINVAL_, "z", MN(NB_Z)),
    C(mcd_film_profile, "out_x NULL", EINVAL_, "out_x", MN(NB_O1)),
    C(mcd_film_profile, "z > L", EDOM_, "z", MDA(zz, 1, 2e-3)),
    C(mcd_film_profile, "z negative", EDOM_, "z", MDA(zz, 0, -1e-9)),
    C(mcd_film_profile, "z NaN", EINVAL_, "z", MDA(zz, 1, SUP_NAN)),
    XFER_COMMON(mcd_bulbs_linearized, "x1_0"),
    C(mcd_bulbs_linearized, "x2_0 NULL", EINVAL_, "x2_0", MN(NB_X2)),
    C(mcd_bulbs_linearized, "x2_0 negative", EDOM_, "x2_0", MDA(x2, 0, -0.2),
      MDA(x2, 2, 0.9)),
    C(mcd_bulbs_linearized, "V1 0", EDOM_, "V1", MD(V1, 0.0)),
    C(mcd_bulbs_linearized, "V2 NaN", EINVAL_, "V2", MD(V2, SUP_NAN)),
    C(mcd_bulbs_linearized, "A inf", EINVAL_, "A", MD(A, SUP_INF)),
    C(mcd_bulbs_linearized, "A negative", EDOM_, "A", MD(A, -1e-5)),
    C(mcd_bulbs_linearized, "t NULL", EINVAL_, "t", MN(NB_T)),
    C(mcd_bulbs_linearized, "out_x1 NULL", EINVAL_, "out_x1", MN(NB_O1)),
    C(mcd_bulbs_linearized, "out_x2 NULL", EINVAL_, "out_x2", MN(NB_O2)),
    C(mcd_bulbs_linearized, "t negative", EDOM_, "t", MDA(tt, 1, -1.0)),
    C(mcd_bulbs_linearized, "t NaN", EINVAL_, "t", MDA(tt, 0, SUP_NAN)),
    XFER_COMMON(mcd_bulbs_integrate, "x1_0"),
    C(mcd_bulbs_integrate, "x2_0 NULL", EINVAL_, "x2_0", MN(NB_X2)),
    C(mcd_bulbs_integrate, "V2 0", EDOM_, "V2", MD(V2, 0.0)),
    C(mcd_bulbs_integrate, "t decreasing", EDOM_, "t", MDA(tt, 0, 20.0)),
    C(mcd_bulbs_integrate, "t inf", EINVAL_, "t", MDA(tt, 1, SUP_INF)),
    C(mcd_bulbs_integrate, "rel_tol 0", EDOM_, "rel_tol", MD(tol_ode, 0.0)),
    C(mcd_bulbs_integrate, "rel_tol 0.5", EDOM_, "rel_tol", MD(tol_ode, 0.5)),
    C(mcd_bulbs_integrate, "rel_tol NaN", EINVAL_, "rel_tol",
      MD(tol_ode, SUP_NAN)),
    B(mcd_liquid_new, MCD_OK),
    C(mcd_liquid_new, "out_liq NULL", EINVAL_, "out_liq", MN(NB_OLIQ)),
    C(mcd_liquid_new, "n 0", EINVAL_, "n_species", MZ(n, 0)),
    C(mcd_liquid_new, "n above MCD_MAX_SPECIES", EINVAL_, "n_species",
      MZ(n, BIG)),
    C(mcd_liquid_new, "model 4", EINVAL_, "model", MI(lmodel, 4)),
    C(mcd_liquid_new, "model -1", EINVAL_, "model", MI(lmodel, -1)),
    B(mcd_liquid_free, R_VOID),
    C(mcd_liquid_free, "NULL is a no-op", R_VOID, NULL, MN(NB_LIQ)),
    B(mcd_liquid_set_species, MCD_OK),
    C(mcd_liquid_set_species, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_set_species, "i = n", EINVAL_, "i", MZ(i, 3)),
    C(mcd_liquid_set_species, "p 3", EINVAL_, "p", MI(lparam, 3)),
    C(mcd_liquid_set_species, "p -1", EINVAL_, "p", MI(lparam, -1)),
    C(mcd_liquid_set_species, "value NaN", EINVAL_, "value",
      MD(value, SUP_NAN)),
    C(mcd_liquid_set_species, "value 0", EDOM_, "value", MD(value, 0.0)),
    B(mcd_liquid_set_pair, MCD_OK),
    C(mcd_liquid_set_pair, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_set_pair, "coef_ij NULL", EINVAL_, "coef_ij", MN(NB_CIJ)),
    C(mcd_liquid_set_pair, "i == j", EINVAL_, "pair", MZ(j, 0)),
    C(mcd_liquid_set_pair, "j = n", EINVAL_, "pair", MZ(j, 3)),
    C(mcd_liquid_set_pair, "coef NaN", EINVAL_, "coef_ij",
      MDA(cij, 1, SUP_NAN)),
    C(mcd_liquid_set_pair, "alpha NaN", EINVAL_, "alpha", MD(alpha, SUP_NAN)),
    C(mcd_liquid_set_pair, "alpha 1.5", EDOM_, "alpha", MD(alpha, 1.5)),
    C(mcd_liquid_set_pair, "T range reversed", EDOM_, "T_min", MD(Tmin, 400.0)),
    C(mcd_liquid_set_pair, "T_max inf", EINVAL_, "T_max", MD(Tmax, SUP_INF)),
    B(mcd_liquid_set_dinf, MCD_OK),
    C(mcd_liquid_set_dinf, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_set_dinf, "i == j", EINVAL_, "pair", MZ(j, 0)),
    C(mcd_liquid_set_dinf, "i = n", EINVAL_, "pair", MZ(i, 3)),
    C(mcd_liquid_set_dinf, "D NaN", EINVAL_, "D_i_in_j", MD(Din1, SUP_NAN)),
    C(mcd_liquid_set_dinf, "D 0", EDOM_, "D_j_in_i", MD(Din2, 0.0)),
    C(mcd_liquid_set_dinf, "D subnormal", EDOM_, "D_i_in_j", MD(Din1, 1e-310)),
    B(mcd_liquid_eval, MCD_OK),
    C(mcd_liquid_eval, "ws NULL", EINVAL_, "ws", MN(NB_WS)),
    C(mcd_liquid_eval, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_eval, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_liquid_eval, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_liquid_eval, "T NaN", EINVAL_, "T", MD(T, SUP_NAN)),
    C(mcd_liquid_eval, "x negative", EDOM_, "x", MDA(x, 0, -0.5)),
    C(mcd_liquid_eval, "x NaN", EINVAL_, "x", MDA(x, 1, SUP_NAN)),
    C(mcd_liquid_eval, "workspace too small", MCD_EBADLEN, NULL,
      MI(use_small_ws, 1)),
    B(mcd_liquid_flux_batch, MCD_OK),
    C(mcd_liquid_flux_batch, "ws NULL", EINVAL_, NULL, MN(NB_WS)),
    C(mcd_liquid_flux_batch, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_flux_batch, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),
    C(mcd_liquid_flux_batch, "model 9", EINVAL_, "model", MI(model, 9)),
    C(mcd_liquid_flux_batch, "iterative model", EINVAL_, "MCD_MODEL_ITERATIVE",
      MI(model, MCD_MODEL_ITERATIVE)),
    C(mcd_liquid_flux_batch, "comp basis 7", EINVAL_, NULL, MI(basis, 7)),
    C(mcd_liquid_flux_batch, "flux basis -1", EINVAL_, NULL, MI(basis2, -1)),
    C(mcd_liquid_flux_batch, "comp NULL", EINVAL_, "comp", MN(NB_X)),
    C(mcd_liquid_flux_batch, "grad NULL", EINVAL_, "grad", MN(NB_GRAD)),
    C(mcd_liquid_flux_batch, "out NULL", EINVAL_, "out_flux", MN(NB_O1)),
    C(mcd_liquid_flux_batch, "T NULL", EINVAL_, "argument T", MN(NB_T)),
    C(mcd_liquid_flux_batch, "c NULL", EINVAL_, "argument c", MN(NB_VALS)),
    C(mcd_liquid_flux_batch, "capacity 2 < N", MCD_EBADLEN, NULL,
      MI(use_small_ws, 1)),
    C(mcd_liquid_flux_batch, "grad_lnP given", EINVAL_, "grad_lnP",
      MI(use_glnp, 1)),
    C(mcd_liquid_flux_batch, "kT without grad_lnT", EINVAL_, "grad_lnT",
      MI(use_kT, 1)),
    C(mcd_liquid_flux_batch, "mass fluxes without M", EINVAL_, "M",
      MI(basis2, MCD_BASIS_MASS), MN(NB_M)),
    C(mcd_liquid_flux_batch, "T NaN", EINVAL_, "cell 0: argument T",
      MDA(Tc, 0, SUP_NAN)),
    C(mcd_liquid_flux_batch, "T 0", EDOM_, "cell 0: argument T",
      MDA(Tc, 0, 0.0)),
    C(mcd_liquid_flux_batch, "c 0", EDOM_, "cell 0: argument c",
      MDA(cc, 0, 0.0)),
    C(mcd_liquid_flux_batch, "comp NaN", EINVAL_, "cell 0: argument comp",
      MDA(x, 1, SUP_NAN)),
    C(mcd_liquid_flux_batch, "comp negative", EDOM_, "cell 0: argument comp",
      MDA(x, 1, -0.1), MDA(x, 0, 0.9)),
    C(mcd_liquid_flux_batch, "grad inf", EINVAL_, "cell 0: argument grad",
      MDA(grad, 3, SUP_INF)),
    C(mcd_liquid_flux_batch, "kT NaN", EINVAL_, "cell 0: argument kT",
      MI(use_kT, 3), MDA(kT, 1, SUP_NAN)),
    C(mcd_liquid_flux_batch, "Vbar NaN", EINVAL_, "cell 0: argument Vbar",
      MDA(Vbar, 1, SUP_NAN)),
    C(mcd_liquid_flux_batch, "Vbar and c disagree", EDOM_,
      "cell 0: argument Vbar", MDA(Vbar, 0, 1.0)),
    B(mcd_liquid_set_antoine, MCD_OK),
    C(mcd_liquid_set_antoine, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_set_antoine, "i = n", EINVAL_, "i", MZ(i, 3)),
    C(mcd_liquid_set_antoine, "A NaN", EINVAL_, "A", MD(antA, SUP_NAN)),
    C(mcd_liquid_set_antoine, "B 0", EDOM_, "B", MD(antB, 0.0)),
    C(mcd_liquid_set_antoine, "range reversed", EDOM_, "T_min",
      MD(Tmin, 400.0)),
    C(mcd_liquid_set_antoine, "T_min below the pole", EDOM_, "T_min",
      MD(antC, -300.0)),
    B(mcd_liquid_vle, MCD_OK),
    C(mcd_liquid_vle, "ws NULL", EINVAL_, "ws", MN(NB_WS)),
    C(mcd_liquid_vle, "liq NULL", EINVAL_, "liq", MN(NB_LIQ)),
    C(mcd_liquid_vle, "out_p NULL", EINVAL_, "out_p", MN(NB_O1)),
    C(mcd_liquid_vle, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_liquid_vle, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_liquid_vle, "x sum 1.5", EDOM_, "x", MDA(x, 0, 1.0)),
    C(mcd_liquid_vle, "workspace too small", MCD_EBADLEN, NULL,
      MI(use_small_ws, 1)),
    B(mcd_liquid_evaporation, MCD_OK),
    C(mcd_liquid_evaporation, "ws NULL", EINVAL_, "ws", MN(NB_WS)),
    C(mcd_liquid_evaporation, "liq NULL", EINVAL_, "liq", MN(NB_LIQ2)),
    C(mcd_liquid_evaporation, "x_liq NULL", EINVAL_, "x_liq", MN(NB_X)),
    C(mcd_liquid_evaporation, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_liquid_evaporation, "out_N NULL", EINVAL_, "out_N", MN(NB_O2)),
    C(mcd_liquid_evaporation, "gas n_species not N + 1", EINVAL_, "gas",
      MZ(n, 2)),
    C(mcd_liquid_evaporation, "P 0", EDOM_, "P", MD(P, 0.0)),
    C(mcd_liquid_evaporation, "rho_liquid NaN", EINVAL_, "rho_liquid",
      MD(rhoL, SUP_NAN)),
    C(mcd_liquid_evaporation, "boiling", EDOM_, "P", MD(P, 1000.0)),
    C(mcd_liquid_evaporation, "x_liq negative", EDOM_, "x", MDA(xl2, 0, -0.4)),
    C(mcd_liquid_evaporation, "L 0", EDOM_, "L", MD(L, 0.0)),
    C(mcd_liquid_evaporation, "workspace too small", MCD_EBADLEN, NULL,
      MI(use_small_ws, 1)),
    B(mcd_binary_tyn_calus, MCD_OK),
    C(mcd_binary_tyn_calus, "T NaN", EINVAL_, NULL, MD(T, SUP_NAN)),
    C(mcd_binary_tyn_calus, "mu 0", EDOM_, NULL, MD(mu, 0.0)),
    C(mcd_binary_tyn_calus, "Vb 0", EDOM_, NULL, MD(Vb, 0.0)),
    C(mcd_binary_tyn_calus, "Vb solvent negative", EDOM_, NULL, MD(VA, -1.0)),
    C(mcd_binary_tyn_calus, "out NULL", EINVAL_, NULL, MN(NB_O1)),
    B(mcd_method_temperature_range, MCD_OK),
    C(mcd_method_temperature_range, "method fsg", EINVAL_, "method",
      MI(method, 2 * MCD_METHOD_FSG - MCD_METHOD_WILKE_CHANG)),
    C(mcd_method_temperature_range, "T NaN", EINVAL_, "T", MD(T, SUP_NAN)),
    C(mcd_method_temperature_range, "T 0", EDOM_, "T", MD(T, 0.0)),
    B(mcd_binary_hayduk_minhas, MCD_OK),
    C(mcd_binary_hayduk_minhas, "T 0", EDOM_, NULL, MD(T, 0.0)),
    C(mcd_binary_hayduk_minhas, "mu inf", EINVAL_, NULL, MD(mu, SUP_INF)),
    C(mcd_binary_hayduk_minhas, "Vb NaN", EINVAL_, NULL, MD(Vb, SUP_NAN)),
    C(mcd_binary_hayduk_minhas, "Vb beyond the correlation", EDOM_, NULL,
      MD(Vb, 1e-3)),
    C(mcd_binary_hayduk_minhas, "out NULL", EINVAL_, NULL, MN(NB_O1)),

    /* ---- gas viscosity ---- */
    B(mcd_viscosity_omega22, MCD_OK),
    C(mcd_viscosity_omega22, "T* 0", EDOM_, "T_star", MD(Tstar, 0.0)),
    C(mcd_viscosity_omega22, "T* NaN", EINVAL_, "T_star", MD(Tstar, SUP_NAN)),
    C(mcd_viscosity_omega22, "out NULL", EINVAL_, "out_omega", MN(NB_O1)),
    B(mcd_viscosity_chapman_enskog, MCD_OK),
    C(mcd_viscosity_chapman_enskog, "T negative", EDOM_, "T", MD(T, -1.0)),
    C(mcd_viscosity_chapman_enskog, "M 0", EDOM_, "M", MD(MA, 0.0)),
    C(mcd_viscosity_chapman_enskog, "sigma inf", EINVAL_, "sigma",
      MD(sigA, SUP_INF)),
    C(mcd_viscosity_chapman_enskog, "eps_k 0", EDOM_, "eps_k", MD(epsA, 0.0)),
    C(mcd_viscosity_chapman_enskog, "out NULL", EINVAL_, "out_mu", MN(NB_O1)),
    B(mcd_viscosity_wilke, MCD_OK),
    C(mcd_viscosity_wilke, "n 0", EINVAL_, "n_species", MZ(n, 0)),
    C(mcd_viscosity_wilke, "n too big", EINVAL_, "n_species", MZ(n, BIG)),
    C(mcd_viscosity_wilke, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_viscosity_wilke, "mu NULL", EINVAL_, "mu", MN(NB_VALS)),
    C(mcd_viscosity_wilke, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_viscosity_wilke, "mu negative", EDOM_, "mu", MDA(mus, 1, -1e-5)),
    C(mcd_viscosity_wilke, "mu NaN", EINVAL_, "mu", MDA(mus, 2, SUP_NAN)),
    C(mcd_viscosity_wilke, "M 0", EDOM_, "M", MDA(M, 0, 0.0)),
    C(mcd_viscosity_wilke, "x sum 1.5", EDOM_, "x", MDA(x, 0, 1.0)),
    C(mcd_viscosity_wilke, "out NULL", EINVAL_, "out_mu", MN(NB_O1)),
    B(mcd_db_viscosity_gas, MCD_OK),
    C(mcd_db_viscosity_gas, "db NULL", EINVAL_, "db", MN(NB_DB)),
    C(mcd_db_viscosity_gas, "out NULL", EINVAL_, "out_mu", MN(NB_O1)),
    C(mcd_db_viscosity_gas, "index out of range", MCD_ENOTFOUND, "i",
      MZ(ga, 100000)),
    C(mcd_db_viscosity_gas, "species without sigma", MCD_ENODATA, "sigma",
      MZ(ga, PROBE)),
    C(mcd_db_viscosity_gas, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_db_viscosity_gas, "T NaN", EINVAL_, "T", MD(T, SUP_NAN)),
    B(mcd_mixture_viscosities, MCD_OK),
    C(mcd_mixture_viscosities, "mix NULL", EINVAL_, "mix", MN(NB_MIX)),
    C(mcd_mixture_viscosities, "out NULL", EINVAL_, "out_mu", MN(NB_O1)),
    C(mcd_mixture_viscosities, "T negative", EDOM_, "T", MD(T, -300.0)),

    B(mcd_lj_collision_integrals, MCD_OK),
    C(mcd_lj_collision_integrals, "T* 0", EDOM_, "T_star", MD(Tstar, 0.0)),
    C(mcd_lj_collision_integrals, "T* above the table", EDOM_, "T_star",
      MD(Tstar, 200.0)),
    C(mcd_lj_collision_integrals, "T* NaN", EINVAL_, "T_star",
      MD(Tstar, SUP_NAN)),
    B(mcd_thermal_factor_kinetic, MCD_OK),
    C(mcd_thermal_factor_kinetic, "M1 0", EDOM_, "M1", MD(MA, 0.0)),
    C(mcd_thermal_factor_kinetic, "x1 NaN", EINVAL_, "x1", MDA(x, 0, SUP_NAN)),
    C(mcd_thermal_factor_kinetic, "out NULL", EINVAL_, "out_alpha", MN(NB_O1)),
    B(mcd_thermal_factor_ce, MCD_OK),
    C(mcd_thermal_factor_ce, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_thermal_factor_ce, "sigma NaN", EINVAL_, "sig1", MD(sigA, SUP_NAN)),
    C(mcd_thermal_factor_ce, "out NULL", EINVAL_, "out_alpha", MN(NB_O1)),
    B(mcd_db_thermal_factor, MCD_OK),
    C(mcd_db_thermal_factor, "db NULL", EINVAL_, "db", MN(NB_DB)),
    C(mcd_db_thermal_factor, "out NULL", EINVAL_, "out_alpha", MN(NB_O1)),
    C(mcd_db_thermal_factor, "index out of range", MCD_ENOTFOUND, "a",
      MZ(ga, 100000)),
    C(mcd_db_thermal_factor, "species without sigma", MCD_ENODATA, "sigma",
      MZ(ga, PROBE)),
    C(mcd_db_thermal_factor, "T NaN", EINVAL_, "T", MD(T, SUP_NAN)),
    B(mcd_mixture_thermal_ratios, MCD_OK),
    C(mcd_mixture_thermal_ratios, "mix NULL", EINVAL_, "mix", MN(NB_MIX)),
    C(mcd_mixture_thermal_ratios, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_mixture_thermal_ratios, "out NULL", EINVAL_, "out_kT", MN(NB_O1)),
    C(mcd_mixture_thermal_ratios, "T negative", EDOM_, "T", MD(T, -300.0)),
    B(mcd_dufour_heat_flux, MCD_OK),
    C(mcd_dufour_heat_flux, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_dufour_heat_flux, "theta NULL", EINVAL_, "theta", MN(NB_VALS)),
    C(mcd_dufour_heat_flux, "flux NULL", EINVAL_, "flux", MN(NB_J)),
    C(mcd_dufour_heat_flux, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_dufour_heat_flux, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_dufour_heat_flux, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),
    C(mcd_dufour_heat_flux, "out NULL", EINVAL_, "out_q", MN(NB_O1)),
    /* one cell (K = 1): the failing cell is the only one */
    B(mcd_dufour_heat_flux_batch, MCD_OK),
    C(mcd_dufour_heat_flux_batch, "n 0", EINVAL_, "n_species", MZ(n, 0)),
    C(mcd_dufour_heat_flux_batch, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_dufour_heat_flux_batch, "theta NULL", EINVAL_, "theta", MN(NB_VALS)),
    C(mcd_dufour_heat_flux_batch, "T NULL", EINVAL_, "T", MN(NB_T)),
    C(mcd_dufour_heat_flux_batch, "flux NULL", EINVAL_, "flux", MN(NB_J)),
    C(mcd_dufour_heat_flux_batch, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_dufour_heat_flux_batch, "out NULL", EINVAL_, "out_q", MN(NB_O1)),
    C(mcd_dufour_heat_flux_batch, "n_dim 0", EINVAL_, "n_dim", MZ(nd, 0)),
    C(mcd_dufour_heat_flux_batch, "T 0", EDOM_, "cell", MDA(Tc, 0, 0.0)),
    C(mcd_dufour_heat_flux_batch, "T NaN", EINVAL_, "cell",
      MDA(Tc, 0, SUP_NAN)),
    C(mcd_dufour_heat_flux_batch, "x negative", EDOM_, "cell", MDA(x, 1, -0.1),
      MDA(x, 0, 0.9)),
    C(mcd_dufour_heat_flux_batch, "theta NaN", EINVAL_, "theta",
      MDA(vals, 1, SUP_NAN)),
    C(mcd_dufour_heat_flux_batch, "flux inf", EINVAL_, "flux",
      MDA(J, 1, SUP_INF)),
    /* ---- porous media ---- */
    B(mcd_pore_permeability, MCD_OK),
    C(mcd_pore_permeability, "pore NULL", EINVAL_, "pore", MN(NB_PORE)),
    C(mcd_pore_permeability, "out NULL", EINVAL_, "out_B0", MN(NB_O1)),
    C(mcd_pore_permeability, "porosity 0", EDOM_, "porosity",
      MD(pore.porosity, 0.0)),
    C(mcd_pore_permeability, "porosity 1.2", EDOM_, "porosity",
      MD(pore.porosity, 1.2)),
    C(mcd_pore_permeability, "porosity NaN", EINVAL_, "porosity",
      MD(pore.porosity, SUP_NAN)),
    C(mcd_pore_permeability, "tortuosity 0.5", EDOM_, "tortuosity",
      MD(pore.tortuosity, 0.5)),
    C(mcd_pore_permeability, "d_pore 0", EDOM_, "d_pore", MD(pore.d_pore, 0.0)),
    C(mcd_pore_permeability, "permeability negative", EDOM_, "permeability",
      MD(pore.permeability, -1e-15)),
    C(mcd_pore_permeability, "permeability inf", EINVAL_, "permeability",
      MD(pore.permeability, SUP_INF)),
    B(mcd_pore_effective, MCD_OK),
    C(mcd_pore_effective, "pore NULL", EINVAL_, "pore", MN(NB_PORE)),
    C(mcd_pore_effective, "D 0", EDOM_, "D", MD(D_ref, 0.0)),
    C(mcd_pore_effective, "tortuosity NaN", EINVAL_, "tortuosity",
      MD(pore.tortuosity, SUP_NAN)),
    C(mcd_pore_effective, "out NULL", EINVAL_, "out_De", MN(NB_O1)),
    B(mcd_knudsen_diffusivity, MCD_OK),
    C(mcd_knudsen_diffusivity, "d_pore negative", EDOM_, "d_pore",
      MD(pore.d_pore, -1e-9)),
    C(mcd_knudsen_diffusivity, "M NaN", EINVAL_, "M", MD(MA, SUP_NAN)),
    C(mcd_knudsen_diffusivity, "T 0", EDOM_, "T", MD(T, 0.0)),
    C(mcd_knudsen_diffusivity, "out NULL", EINVAL_, "out_DK", MN(NB_O1)),
    B(mcd_bosanquet, MCD_OK),
    C(mcd_bosanquet, "D_m 0", EDOM_, "D_m", MD(D_ref, 0.0)),
    C(mcd_bosanquet, "D_K NaN", EINVAL_, "D_K", MD(Dk, SUP_NAN)),
    C(mcd_bosanquet, "out NULL", EINVAL_, "out_D", MN(NB_O1)),
    B(mcd_dgm_fluxes, MCD_OK),
    C(mcd_dgm_fluxes, "ws NULL", EINVAL_, "ws", MN(NB_WS)),
    C(mcd_dgm_fluxes, "pore NULL", EINVAL_, "pore", MN(NB_PORE)),
    C(mcd_dgm_fluxes, "dgm NULL", EINVAL_, "dgm", MN(NB_DGM)),
    C(mcd_dgm_fluxes, "out NULL", EINVAL_, "out_N", MN(NB_O1)),
    C(mcd_dgm_fluxes, "n 0", EINVAL_, "n_species", MZ(n, 0)),
    C(mcd_dgm_fluxes, "n above capacity", MCD_EBADLEN, "n_species", MZ(n, 4)),
    C(mcd_dgm_fluxes, "n_dim 4", EINVAL_, "n_dim", MZ(nd, 4)),
    C(mcd_dgm_fluxes, "porosity 1.5", EDOM_, "porosity",
      MD(pore.porosity, 1.5)),
    C(mcd_dgm_fluxes, "tortuosity 0.99", EDOM_, "tortuosity",
      MD(pore.tortuosity, 0.99)),
    C(mcd_dgm_fluxes, "d_pore 0", EDOM_, "d_pore", MD(pore.d_pore, 0.0)),
    C(mcd_dgm_fluxes, "permeability negative", EDOM_, "permeability",
      MD(pore.permeability, -1.0)),
    C(mcd_dgm_fluxes, "P negative", EDOM_, "P", MD(P, -1.0)),
    C(mcd_dgm_fluxes, "T NaN", EINVAL_, "T", MD(T, SUP_NAN)),
    C(mcd_dgm_fluxes, "mu 0", EDOM_, "mu", MD(mug, 0.0)),
    C(mcd_dgm_fluxes, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_dgm_fluxes, "Dij NULL", EINVAL_, "Dij", MN(NB_D)),
    C(mcd_dgm_fluxes, "Dij negative", EDOM_, "Dij", MDA(D, 1, -1e-5),
      MDA(D, 3, -1e-5)),
    C(mcd_dgm_fluxes, "x negative", EDOM_, "x", MDA(x, 1, -0.1)),
    C(mcd_dgm_fluxes, "x NULL", EINVAL_, "x", MN(NB_X)),
    C(mcd_dgm_fluxes, "grad_x NULL", EINVAL_, "grad_x", MN(NB_GRAD)),
    C(mcd_dgm_fluxes, "grad_x NaN", EINVAL_, "grad_x", MDA(grad, 3, SUP_NAN)),
    C(mcd_dgm_fluxes, "grad_P inf", EINVAL_, "grad_P", MDA(gP, 1, SUP_INF)),
    B(mcd_dgm_closed, MCD_OK),
    C(mcd_dgm_closed, "N_t NULL", EINVAL_, "N_t", MN(NB_NF)),
    C(mcd_dgm_closed, "N_t NaN", EINVAL_, "N_t", MDA(Nt, 0, SUP_NAN)),
    C(mcd_dgm_closed, "out_grad_P NULL", EINVAL_, "out_grad_P", MN(NB_O2)),
    C(mcd_dgm_closed, "porosity 0", EDOM_, "porosity", MD(pore.porosity, 0.0)),
    C(mcd_dgm_closed, "P 0", EDOM_, "P", MD(P, 0.0)),
    B(mcd_dgm_gradients, MCD_OK),
    C(mcd_dgm_gradients, "N NULL", EINVAL_, "N", MN(NB_J)),
    C(mcd_dgm_gradients, "N NaN", EINVAL_, "N", MDA(J, 2, SUP_NAN)),
    C(mcd_dgm_gradients, "out_grad_x NULL", EINVAL_, "out_grad_x", MN(NB_O1)),
    C(mcd_dgm_gradients, "d_pore NaN", EINVAL_, "d_pore",
      MD(pore.d_pore, SUP_NAN)),
    C(mcd_dgm_gradients, "mu negative", EDOM_, "mu", MD(mug, -2e-5)),
    B(mcd_dgm_fluxes_batch, MCD_OK),
    C(mcd_dgm_fluxes_batch, "cells NULL", EINVAL_, "cells", MN(NB_DGM)),
    C(mcd_dgm_fluxes_batch, "M NULL", EINVAL_, "M", MN(NB_M)),
    C(mcd_dgm_fluxes_batch, "out NULL", EINVAL_, "out_N", MN(NB_O1)),
    C(mcd_dgm_fluxes_batch, "T NULL", EINVAL_, "T", MN(NB_T)),
    C(mcd_dgm_fluxes_batch, "porosity 0", EDOM_, "porosity",
      MD(pore.porosity, 0.0)),
    C(mcd_dgm_fluxes_batch, "n above capacity", MCD_EBADLEN, "n_species",
      MZ(n, 4)),
    C(mcd_dgm_fluxes_batch, "cell T negative", EDOM_, "cell", MDA(Tc, 0, -1.0)),
    C(mcd_dgm_fluxes_batch, "cell P 0", EDOM_, "P", MDA(Pc, 0, 0.0)),
    C(mcd_dgm_fluxes_batch, "cell x negative", EDOM_, "x", MDA(x, 1, -0.1)),
    C(mcd_dgm_fluxes_batch, "cell grad NaN", EINVAL_, "grad_x",
      MDA(grad, 2, SUP_NAN)),
    B(mcd_slab_solve, MCD_OK),
    C(mcd_slab_solve, "slab NULL", EINVAL_, "slab", MN(NB_DGM)),
    C(mcd_slab_solve, "pore NULL", EINVAL_, "pore", MN(NB_PORE)),
    C(mcd_slab_solve, "out_N NULL", EINVAL_, "out_N", MN(NB_O1)),
    C(mcd_slab_solve, "PL negative", EDOM_, "PL", MDA(Pc, 1, -1.0)),
    C(mcd_slab_solve, "P0 0", EDOM_, "P0", MD(P, 0.0)),
    C(mcd_slab_solve, "L 0", EDOM_, "L", MD(L, 0.0)),
    C(mcd_slab_solve, "mu NaN", EINVAL_, "mu", MD(mug, SUP_NAN)),
    C(mcd_slab_solve, "P_ref 0", EDOM_, "P_ref", MD(P_ref, 0.0)),
    C(mcd_slab_solve, "tortuosity 0.5", EDOM_, "tortuosity",
      MD(pore.tortuosity, 0.5)),
    C(mcd_slab_solve, "xL NULL", EINVAL_, "xL", MN(NB_X2)),
    C(mcd_slab_solve, "x0 negative", EDOM_, "x0", MDA(x, 0, -0.5)),
    C(mcd_slab_solve, "kind 9", EINVAL_, "kind",
      MI(kind, MCD_BOOT_EQUIMOLAR + 9)),
    C(mcd_slab_solve, "stagnant species 7", EINVAL_, "species",
      MI(kind, MCD_BOOT_EQUIMOLAR + MCD_SLAB_STAGNANT), MZ(species, 7)),
    C(mcd_slab_solve, "total NaN", EINVAL_, "value",
      MI(kind, MCD_BOOT_EQUIMOLAR + MCD_SLAB_TOTAL), MD(value, SUP_NAN)),
    B(mcd_slab_solve_ratios, MCD_OK),
    C(mcd_slab_solve_ratios, "slab NULL", EINVAL_, "slab", MN(NB_DGM)),
    C(mcd_slab_solve_ratios, "ratios NULL", EINVAL_, "ratios", MN(NB_VALS)),
    C(mcd_slab_solve_ratios, "out_N NULL", EINVAL_, "out_N", MN(NB_O1)),
    C(mcd_slab_solve_ratios, "ratios NaN", EINVAL_, "ratios",
      MDA(zr, 1, SUP_NAN)),
    C(mcd_slab_solve_ratios, "ratios sum 2", EDOM_, "ratios", MDA(zr, 0, 2.0)),
    C(mcd_slab_solve_ratios, "species 7", EINVAL_, "species", MZ(species, 7)),
    C(mcd_slab_solve_ratios, "xL NULL", EINVAL_, "xL", MN(NB_X2)),
    C(mcd_slab_solve_ratios, "P0 0", EDOM_, "P0", MD(P, 0.0)),
    B(mcd_slab_profile, MCD_OK),
    C(mcd_slab_profile, "N NULL", EINVAL_, "N", MN(NB_NF)),
    C(mcd_slab_profile, "N NaN", EINVAL_, "N", MDA(Nt, 1, SUP_NAN)),
    C(mcd_slab_profile, "z NULL", EINVAL_, "z", MN(NB_Z)),
    C(mcd_slab_profile, "z beyond L", EDOM_, "z", MDA(zz, 1, 1.0)),
    C(mcd_slab_profile, "out_P NULL", EINVAL_, "out_P", MN(NB_O2)),
    C(mcd_slab_profile, "porosity 0", EDOM_, "porosity",
      MD(pore.porosity, 0.0)),
};

#define NCASES (sizeof cases / sizeof cases[0])

/* ------------------------------------------------------------------ */
/* Fixture, fingerprints, driver                                      */
/* ------------------------------------------------------------------ */

static void ctx_init(ctx *c)
{
    static const char *const mixnames[3] = {"nitrogen", "oxygen",
                                            "carbon-dioxide"};
    size_t idx;
    memset(c, 0, sizeof *c);
    ck_assert_int_eq(mcd_workspace_new(3, &c->ws), MCD_OK);
    ck_assert_int_eq(mcd_db_new_builtin(&c->db), MCD_OK);
    /* probe species: silane has no diffusion-volume increment for Si and no
     * Lennard-Jones or liquid parameters */
    ck_assert_int_eq(mcd_db_add(c->db, "probe-silane", "SiH4", 0, &c->probe),
                     MCD_OK);
    /* light probe: a user molar mass far below any molecule's, with
     * Lennard-Jones parameters, for the Wilke-Lee domain check */
    ck_assert_int_eq(mcd_db_add(c->db, "probe-light", "He", 0, &c->probe2),
                     MCD_OK);
    ck_assert_int_eq(
        mcd_db_set_param(c->db, c->probe2, MCD_PARAM_MOLAR_MASS, 1e-5), MCD_OK);
    ck_assert_int_eq(
        mcd_db_set_param(c->db, c->probe2, MCD_PARAM_LJ_SIGMA, 2.5e-10),
        MCD_OK);
    ck_assert_int_eq(
        mcd_db_set_param(c->db, c->probe2, MCD_PARAM_LJ_EPS_K, 10.0), MCD_OK);
    ck_assert_int_eq(mcd_mixture_new(c->db, 3, mixnames, MCD_GAS_FSG, &c->mix),
                     MCD_OK);
    c->n = 3;
    c->nd = 2;
    c->m = 2;
    c->cap = 8;
    c->i = 0;
    c->j = 1;
    c->k = 0;
    c->dep = 0;
    c->species = 2;
    c->np = 2;
    c->nt = 2;
    ck_assert_int_eq(mcd_db_find(c->db, "nitrogen", &c->ga), MCD_OK);
    ck_assert_int_eq(mcd_db_find(c->db, "helium", &c->gb), MCD_OK);
    ck_assert_int_eq(mcd_db_find(c->db, "methanol", &c->sol), MCD_OK);
    ck_assert_int_eq(mcd_db_find(c->db, "water", &idx), MCD_OK);
    c->solv = idx;
    c->T = 300.0;
    c->P = MCD_ATM;
    c->c = MCD_ATM / (MCD_GAS_CONSTANT * 300.0);
    c->L = 1e-3;
    c->V1 = 1e-4;
    c->V2 = 2e-4;
    c->A = 1e-5;
    c->tol_diag = 1e-3;
    c->tol_ode = 1e-6;
    c->value = 0.028;
    c->Tstar = 1.5;
    c->MA = 0.028;
    c->MB = 0.004;
    c->VA = 18.5;
    c->VB = 2.67;
    c->sigA = 3.798e-10;
    c->sigB = 2.551e-10;
    c->epsA = 71.4;
    c->epsB = 10.22;
    c->mu = 0.89e-3;
    c->Ms = 0.018;
    c->phi = 2.6;
    c->Vb = 4.2e-5;
    c->dipA = 1.8 * 3.33564e-30; /* water-like */
    c->VbB = 31.2e-6;
    c->TbA = 373.15;
    c->lmodel = MCD_ACTIVITY_NRTL;
    c->lparam = MCD_LIQ_MOLAR_VOLUME;
    c->cij[0] = 0.1, c->cij[1] = 100.0, c->cij[2] = 0.0;
    c->alpha = 0.3;
    c->Tmin = 280.0;
    c->Tmax = 350.0;
    c->Din1 = 1.2e-9;
    c->Din2 = 0.8e-9;
    c->antA = 9.6543;
    c->antB = 1435.264;
    c->antC = -64.848;
    c->rhoL = 997.0;
    c->xl2[0] = 0.4;
    c->xl2[1] = 0.6;
    ck_assert_int_eq(mcd_liquid_new(2, MCD_ACTIVITY_IDEAL, &c->liq2), MCD_OK);
    for (size_t a = 0; a < 2; a++)
        ck_assert_int_eq(mcd_liquid_set_antoine(c->liq2, a, c->antA, c->antB,
                                                c->antC, 255.9, 373.0),
                         MCD_OK);
    ck_assert_int_eq(mcd_liquid_new(3, MCD_ACTIVITY_NRTL, &c->liq), MCD_OK);
    for (size_t a = 0; a < 3; a++)
        for (size_t b = a + 1; b < 3; b++) {
            ck_assert_int_eq(
                mcd_liquid_set_pair(c->liq, a, b, c->cij, c->cij, 0.3, 0, 0),
                MCD_OK);
            ck_assert_int_eq(mcd_liquid_set_dinf(c->liq, a, b, 1e-9, 2e-9),
                             MCD_OK);
        }
    c->D_ref = 2e-5;
    c->T_ref = 298.15;
    c->P_ref = MCD_ATM;
    c->expo = 1.75;
    c->conc = 40.0;
    c->Tlo = 250.0;
    c->Thi = 800.0;
    c->tol_it = 1e-10;
    c->K = 1;
    c->max_iter = 50;
    c->nthreads = 1;
    c->Tc[0] = 300.0;
    c->Pc[0] = MCD_ATM;
    c->Pc[1] = 0.9 * MCD_ATM; /* far-end pressure of the slab */
    c->cc[0] = MCD_ATM / (MCD_GAS_CONSTANT * 300.0);
    ck_assert_int_eq(mcd_workspace_new(2, &c->ws2), MCD_OK);
    c->model = MCD_MODEL_MAXWELL_STEFAN;
    c->basis = MCD_BASIS_MOLE;
    c->basis2 = MCD_BASIS_MOLE;
    c->kind = MCD_BOOT_EQUIMOLAR;
    c->method = MCD_METHOD_FSG;
    c->param = MCD_PARAM_MOLAR_MASS;
    c->n_rings = 0;
    c->Z = 6;
    c->film_method = MCD_FILM_EXACT;
    c->status = MCD_EDOM;
    c->bit = MCD_WARN_POLAR;
    {
        static const double M[3] = {0.028014, 0.031998, 0.04401};
        static const double x[3] = {0.5, 0.3, 0.2}, x2[3] = {0.2, 0.3, 0.5};
        static const double grad[6] = {1.0, -1.0, -0.6, 0.6, -0.4, 0.4};
        static const double Dp[3] = {2.0e-5, 1.6e-5, 1.5e-5}; /* 01, 02, 12 */
        double Mbar = 0.0;
        for (int a = 0; a < 3; a++) {
            c->M[a] = M[a];
            c->x[a] = x[a];
            c->x2[a] = x2[a];
            Mbar += x[a] * M[a];
            c->vals[a] = 10.0 * (a + 1); /* concentrations, weights, totals */
            c->Vbar[a] = 1.0 / c->c;
            c->Nf[a] = a == 0 ? 1e-3 : a == 1 ? -1e-3 : 0.0;
            c->Gamma[a * 3 + a] = 1.0;
        }
        for (int a = 0; a < 3; a++)
            c->y[a] = x[a] * M[a] / Mbar;
        for (int a = 0; a < 6; a++) {
            c->grad[a] = grad[a];
            c->J[a] = -1e-4 * grad[a];
        }
        c->D[1] = c->D[3] = Dp[0];
        c->D[2] = c->D[6] = Dp[1];
        c->D[5] = c->D[7] = Dp[2];
        c->glnP[0] = 0.1;
        c->kT[0] = 0.01;
        c->kT[1] = -0.004;
        c->kT[2] = -0.006;
        c->glnT[0] = 0.5;
        c->DT[0] = 1e-6;
        c->DT[1] = -4e-7;
        c->DT[2] = -6e-7;
        c->F[0] = 2e-5;
        c->F[1] = 1e-6;
        c->F[2] = 2e-6;
        c->F[3] = 1.5e-5;
        c->zz[0] = 0.0;
        c->zz[1] = 5e-4;
        c->tt[0] = 0.0;
        c->tt[1] = 10.0;
    }
    c->pore.porosity = 0.4;
    c->zr[0] = 1.0;
    c->zr[1] = 1.0;
    c->zr[2] = -1.0;
    c->pore.tortuosity = 3.0;
    c->pore.d_pore = 1e-7;
    c->mug = 1.8e-5;
    c->use_gp = 1;
    c->gP[0] = 1e4;
    c->gP[1] = -2e3;
    c->Nt[0] = 1e-3;
    c->Nt[1] = 0.0;
    c->Dk = 3e-6;
    c->mus[0] = 17.9e-6;
    c->mus[1] = 20.7e-6;
    c->mus[2] = 15.0e-6;
    c->formula = "CH3COCH3";
    c->name = "my-gas";
    c->text = HDR "species my-gas\n formula C3H6O\n Tb 329.2 K\n";
    c->path = "species-example.txt";
    c->mname = "fsg";
    c->mol = "CO2";
    c->find = "nitrogen";
    c->names[0] = "nitrogen";
    c->names[1] = "oxygen";
    c->names[2] = "carbon-dioxide";
    /* guards: bytes 0x5A, doubles 12345.678 (a valid flux set for the
     * in-out array of mcd_flux_project) */
    memset(&c->o, 0x5A, sizeof c->o);
    for (size_t a = 0; a < NA * NA; a++)
        c->o.o1[a] = c->o.o2[a] = c->o.o3[a] = SUP_GUARD;
}

static void ctx_free(ctx *c)
{
    mcd_workspace_free(c->ws);
    mcd_workspace_free(c->ws2);
    mcd_mixture_free(c->mix);
    mcd_liquid_free(c->liq);
    mcd_liquid_free(c->liq2);
    mcd_db_free(c->db);
}

static uint64_t fnv(uint64_t h, const void *p, size_t len)
{
    const unsigned char *b = p;
    for (size_t q = 0; q < len; q++) {
        h ^= b[q];
        h *= 0x100000001b3ull;
    }
    return h;
}

static uint64_t db_fingerprint(const mcd_db *db)
{
    uint64_t h = 0xcbf29ce484222325ull;
    size_t n = mcd_db_species_count(db);
    h = fnv(h, &n, sizeof n);
    for (size_t i = 0; i < n; i++) {
        const char *s = mcd_db_name(db, i), *f = mcd_db_formula(db, i);
        h = fnv(h, s ? s : "", s ? strlen(s) : 0);
        h = fnv(h, f ? f : "", f ? strlen(f) : 0);
        for (int p = 0; p < MCD_PARAM_COUNT; p++) {
            double v = 0.0;
            int st = mcd_db_param(db, i, (mcd_param)p, &v);
            h = fnv(h, &st, sizeof st);
            if (st == MCD_OK)
                h = fnv(h, &v, sizeof v);
        }
    }
    return h;
}

static uint64_t mix_fingerprint(const mcd_mixture *mix)
{
    double D[9], M[3];
    uint64_t h = 0xcbf29ce484222325ull;
    int st = mcd_mixture_binaries(mix, 350.0, 2e5, D, NULL, NULL);
    h = fnv(h, &st, sizeof st);
    if (st == MCD_OK)
        h = fnv(h, D, sizeof D);
    st = mcd_mixture_molar_masses(mix, M);
    if (st == MCD_OK)
        h = fnv(h, M, sizeof M);
    return h;
}

/* 1 if `word` occurs in s delimited by non-identifier characters. */
static int has_word(const char *s, const char *word)
{
    size_t wl = strlen(word);
    for (const char *p = s; (p = strstr(p, word)) != NULL; p++) {
        int before = p == s || !(isalnum((unsigned char)p[-1]) || p[-1] == '_');
        int after = !(isalnum((unsigned char)p[wl]) || p[wl] == '_');
        if (before && after)
            return 1;
    }
    return 0;
}

static void apply(ctx *c, const mut *m)
{
    char *base = (char *)c;
    switch (m->kind) {
    case MUT_D: memcpy(base + m->off, &m->v.d, sizeof(double)); break;
    case MUT_Z: memcpy(base + m->off, &m->v.z, sizeof(size_t)); break;
    case MUT_I: memcpy(base + m->off, &m->v.i, sizeof(int)); break;
    case MUT_U: memcpy(base + m->off, &m->v.u, sizeof(unsigned)); break;
    case MUT_S: {
        const char *sv = m->v.s;
        memcpy(base + m->off, &sv, sizeof sv);
        break;
    }
    case MUT_NULL: c->nul |= 1ull << m->off; break;
    default: break;
    }
}

/* Copy of the inputs that a call must not modify. */
typedef struct inputs {
    double M[NA], x[NA], x2[NA], y[NA], grad[NA * 3], D[NA * NA],
        Gamma[NA * NA];
    double glnP[3], vals[NA], Vbar[NA], J[NA * 3], Nf[NA], zz[NA], tt[NA],
        F[NA * NA];
    double kT[NA], glnT[3], DT[NA];
} inputs;

static void snap_inputs(const ctx *c, inputs *in)
{
#define CP(f) memcpy(in->f, c->f, sizeof in->f)
    CP(M);
    CP(x);
    CP(x2);
    CP(y);
    CP(grad);
    CP(D);
    CP(Gamma);
    CP(glnP);
    CP(vals);
    CP(Vbar);
    CP(J);
    CP(Nf);
    CP(zz);
    CP(tt);
    CP(F);
    CP(kT);
    CP(glnT);
    CP(DT);
#undef CP
}

/* Run case q; on mismatch write a reason into why and return 0. */
static int run_case(size_t q, char *why, size_t whylen)
{
    const bcase *bc = &cases[q];
    ctx *c = malloc(sizeof *c);
    outs before;
    inputs in0, in1;
    uint64_t dbh0, dbh1, mixh0, mixh1;
    int r, ok = 1;
    ck_assert_ptr_nonnull(c);
    ctx_init(c);
    for (int k = 0; k < 6 && bc->m[k].kind != MUT_END; k++)
        apply(c, &bc->m[k]);
    before = c->o;
    snap_inputs(c, &in0);
    dbh0 = db_fingerprint(c->db);
    mixh0 = mix_fingerprint(c->mix);
    /* a detail left over from a previous call must not satisfy the check:
     * plant one that every status-returning call must clear */
    {
        double sink;
        ck_assert_int_eq(mcd_comp_ideal_gas_c(-1.0, 1.0, &sink), MCD_EDOM);
        ck_assert(mcd_last_error()[0] != '\0');
    }

    r = bc->call(c);
    /* copy at once: the fingerprints below make library calls of their own */
    char detail[256]; /* the library keeps at most 255 characters */
    snprintf(detail, sizeof detail, "%s", mcd_last_error());

    why[0] = '\0';
    if (r != bc->expect) {
        snprintf(why, whylen, "returned %d (%s), documented %d", r,
                 r < 1000 ? mcd_status_string(r) : "pseudo", bc->expect);
        ok = 0;
    }
    snap_inputs(c, &in1);
    if (ok && memcmp(&in0, &in1, sizeof in0) != 0) {
        snprintf(why, whylen, "an input array was modified");
        ok = 0;
    }
    if (ok && r != MCD_OK && r < 1000) {
        if (memcmp(&before, &c->o, sizeof before) != 0) {
            snprintf(why, whylen,
                     "an output was written although the call failed");
            ok = 0;
        }
        if (ok && c->db != NULL) {
            dbh1 = db_fingerprint(c->db);
            if (dbh1 != dbh0) {
                snprintf(why, whylen,
                         "the database changed although the call failed");
                ok = 0;
            }
        }
        if (ok && c->mix != NULL) {
            mixh1 = mix_fingerprint(c->mix);
            if (mixh1 != mixh0) {
                snprintf(why, whylen,
                         "the mixture changed although the call failed");
                ok = 0;
            }
        }
        /* the detail of this failing call (the sentinel planted before it
         * was cleared on entry, so any text is fresh) */
        if (ok) {
            const char *msg = detail;
            if (msg[0] == '\0' || (bc->word && !has_word(msg, bc->word))) {
                snprintf(why, whylen, "mcd_last_error() \"%s\" lacks \"%s\"",
                         msg, bc->word ? bc->word : "(any text)");
                ok = 0;
            }
        }
    }
    if (ok && r == MCD_OK && detail[0] != '\0') {
        snprintf(why, whylen, "succeeded but mcd_last_error() is \"%s\"",
                 detail);
        ok = 0;
    }
    ctx_free(c);
    free(c);
    return ok;
}

START_TEST(bad_input_table)
{
    size_t q = (size_t)_i;
    char why[400];
    int ok = run_case(q, why, sizeof why);
    ck_assert_msg(ok, "%s [%s]: %s", cases[q].fn, cases[q].what, why);
}
END_TEST

/* All cases in one test too (counts printed for the report); Check's loop
 * test above gives one failure line per bad row. */
START_TEST(bad_input_summary)
{
    size_t nbase = 0, nbad = 0, nfail = 0;
    char why[400];
    for (size_t q = 0; q < NCASES; q++) {
        if (cases[q].m[0].kind == MUT_END)
            nbase++;
        else
            nbad++;
        if (!run_case(q, why, sizeof why)) {
            nfail++;
            fprintf(stderr, "bad_input: %s [%s]: %s\n", cases[q].fn,
                    cases[q].what, why);
        }
    }
    printf(
        "bad_input: %zu bad-input cases, %zu valid baselines, %zu mismatches\n",
        nbad, nbase, nfail);
    ck_assert_uint_eq(nfail, 0);
    ck_assert_uint_gt(nbad, 300);
}
END_TEST

static char *read_text(const char *path)
{
    FILE *f = fopen(path, "rb");
    char *buf;
    long len;
    if (f == NULL)
        return NULL;
    fseek(f, 0, SEEK_END);
    len = ftell(f);
    fseek(f, 0, SEEK_SET);
    buf = malloc((size_t)len + 1);
    if (buf != NULL && fread(buf, 1, (size_t)len, f) != (size_t)len) {
        free(buf);
        buf = NULL;
    }
    if (buf != NULL)
        buf[len] = '\0';
    fclose(f);
    return buf;
}

START_TEST(bad_input_table_covers_every_public_function)
{
    char path[1024], name[128];
    char *text, *p;
    size_t ndecl = 0;
    snprintf(path, sizeof path, "%s/../../include/mcdiff.h", g_datadir);
    text = read_text(path);
    ck_assert_msg(text != NULL, "cannot read %s", path);
    for (p = text; (p = strstr(p, "MCD_API")) != NULL; p += 7) {
        /* skip the macro's own definitions */
        const char *paren, *e, *b;
        size_t len, nb = 0, nbad = 0;
        int is_void;
        if (p > text && p[-1] != '\n')
            continue;
        paren = strchr(p, '(');
        if (paren == NULL)
            break;
        e = paren;
        while (e > p && isspace((unsigned char)e[-1]))
            e--;
        b = e;
        while (b > p && (isalnum((unsigned char)b[-1]) || b[-1] == '_'))
            b--;
        len = (size_t)(e - b);
        if (len == 0 || len >= sizeof name || strncmp(b, "mcd_", 4) != 0)
            continue;
        memcpy(name, b, len);
        name[len] = '\0';
        is_void = strncmp(paren, "(void)", 6) == 0;
        ndecl++;
        for (size_t q = 0; q < NCASES; q++)
            if (strcmp(cases[q].fn, name) == 0) {
                nb++;
                if (cases[q].m[0].kind != MUT_END)
                    nbad++;
            }
        ck_assert_msg(nb > 0,
                      "public function %s has no row in the bad-input table",
                      name);
        ck_assert_msg(is_void || nbad > 0,
                      "public function %s has no bad-input row", name);
    }
    free(text);
    printf("bad_input: %zu public functions declared, all covered\n", ndecl);
    ck_assert_uint_ge(ndecl, 74);
}
END_TEST

/* The library must not be able to abort, exit, assert, jump or print: none
 * of these symbols may be imported by the shared library. */
START_TEST(bad_input_library_imports_no_abort_exit_print)
{
    static const char *const banned[] = {
        "abort",          "exit",
        "_exit",          "_Exit",
        "quick_exit",     "__assert_fail",
        "__assert",       "__assert_perror_fail",
        "longjmp",        "siglongjmp",
        "_longjmp",       "__longjmp_chk",
        "raise",          "printf",
        "fprintf",        "vprintf",
        "vfprintf",       "dprintf",
        "vdprintf",       "__printf_chk",
        "__fprintf_chk",  "__vprintf_chk",
        "__vfprintf_chk", "__dprintf_chk",
        "puts",           "fputs",
        "putchar",        "putc",
        "fputc",          "fwrite",
        "perror",         "write",
        "stdout",         "stderr",
    };
    char exe[1024], lib[1200], cmd[1400], line[512];
    ssize_t len = readlink("/proc/self/exe", exe, sizeof exe - 1);
    size_t nsym = 0, nbad = 0;
    FILE *p;
    ck_assert(len > 0);
    exe[len] = '\0';
    *strrchr(exe, '/') = '\0';
    snprintf(lib, sizeof lib, "%s/../lib/libmcdiff.so", exe);
    ck_assert_msg(access(lib, R_OK) == 0, "shared library not found at %s",
                  lib);
    snprintf(cmd, sizeof cmd, "nm -D --undefined-only '%s' 2>/dev/null", lib);
    p = popen(cmd, "r");
    ck_assert_ptr_nonnull(p);
    while (fgets(line, sizeof line, p) != NULL) {
        char sym[256];
        char *at;
        if (sscanf(line, " U %255s", sym) != 1 &&
            sscanf(line, " w %255s", sym) != 1)
            continue;
        if ((at = strchr(sym, '@')) != NULL)
            *at = '\0';
        nsym++;
        for (size_t b = 0; b < sizeof banned / sizeof banned[0]; b++)
            if (strcmp(sym, banned[b]) == 0) {
                fprintf(stderr, "libmcdiff imports %s\n", sym);
                nbad++;
            }
    }
    ck_assert_int_eq(pclose(p), 0);
    ck_assert_msg(nsym > 5, "nm listed only %zu undefined symbols", nsym);
    ck_assert_uint_eq(nbad, 0);
}
END_TEST

/* The Dij check of mcd_flux_compute at every entry of every size from 2
 * to 13 species (its fast pass goes four pairs at a time from 5 species
 * on, with overlapping last steps: every entry must still be seen): one
 * bad off-diagonal entry at a time gives the status of its rule and a
 * detail naming that entry; an asymmetry inside the 1e-12 tolerance and
 * any diagonal pass. */
START_TEST(bad_input_dij_every_entry)
{
    static const struct {
        double v; /* the bad entry; 0: the pair's value scaled by f */
        double f;
        mcd_status st;
    } bad[] = {
        {SUP_NAN, 0, MCD_EINVAL},
        {(double)SUP_INF, 0, MCD_EINVAL},
        {-(double)SUP_INF, 0, MCD_EINVAL},
        {-1e-5, 0, MCD_EDOM},
        {4.9e-324, 0, MCD_EDOM},
        {0, 1 + 1e-9, MCD_EDOM},
        {0, 1 - 1e-9, MCD_EDOM},
        {0, 1 + 5e-13, MCD_OK},
        {0, 1 - 5e-13, MCD_OK},
        {0, 2.0, MCD_EDOM},
    };
    for (size_t n = 2; n <= 13; n++) {
        double D[13 * 13], x[13], g[13 * 3], J[13 * 3];
        mcd_workspace *ws = NULL;
        ck_assert_int_eq(mcd_workspace_new(n, &ws), MCD_OK);
        for (size_t i = 0; i < n; i++) {
            x[i] = 1.0 / (double)n;
            for (size_t dd = 0; dd < 3; dd++)
                g[i * 3 + dd] = (double)((i + dd) % 3) - 1.0;
            for (size_t j = 0; j < n; j++)
                D[i * n + j] =
                    i == j ? 0.0 : 1e-5 * (1.0 + 0.1 * (double)(i + j));
        }
        mcd_state st = {.n_species = n,
                        .n_dim = 3,
                        .comp_basis = MCD_BASIS_MOLE,
                        .c = 40.0,
                        .Dij = D,
                        .comp = x,
                        .grad = g};
        for (size_t i = 0; i < n; i++)
            for (size_t j = 0; j < n; j++)
                for (size_t k = 0; k < sizeof bad / sizeof bad[0]; k++) {
                    const double keep = D[i * n + j];
                    char want[64], want2[64];
                    mcd_status got;
                    if (i == j)
                        D[i * n + j] = k % 2 ? SUP_NAN : -1.0; /* ignored */
                    else
                        D[i * n + j] =
                            bad[k].f != 0 ? keep * bad[k].f : bad[k].v;
                    got = mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, &st,
                                           MCD_BASIS_MOLE, J);
                    D[i * n + j] = keep;
                    if (i == j) {
                        ck_assert_msg(got == MCD_OK, "n %zu diagonal %zu: %d",
                                      n, i, (int)got);
                        continue;
                    }
                    ck_assert_msg(got == bad[k].st,
                                  "n %zu entry (%zu,%zu) case %zu: %d", n, i, j,
                                  k, (int)got);
                    if (got == MCD_OK)
                        continue;
                    snprintf(want, sizeof want, "(%zu,%zu)", i, j);
                    snprintf(want2, sizeof want2, "(%zu,%zu)", j, i);
                    ck_assert_msg(strstr(mcd_last_error(), want) != NULL &&
                                      (bad[k].f == 0 ||
                                       strstr(mcd_last_error(), want2) != NULL),
                                  "n %zu entry (%zu,%zu): %s", n, i, j,
                                  mcd_last_error());
                }
        mcd_workspace_free(ws);
    }
}
END_TEST

int main(void)
{
    g_datadir = getenv("MCD_TEST_DATA");
    if (g_datadir == NULL)
        g_datadir = "tests/data";
    Suite *s = suite_create("mcd:bad_input");
    TCase *tc = tcase_create("table");
    tcase_set_timeout(tc, 240);
    tcase_add_loop_test(tc, bad_input_table, 0, (int)NCASES);
    tcase_add_test(tc, bad_input_summary);
    tcase_add_test(tc, bad_input_table_covers_every_public_function);
    tcase_add_test(tc, bad_input_library_imports_no_abort_exit_print);
    tcase_add_test(tc, bad_input_dij_every_entry);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
