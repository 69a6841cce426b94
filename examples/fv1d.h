/* fv1d.h - a small 1-D finite-volume solver for transient multicomponent
 * diffusion with reaction, shared by examples/transient_1d.c (serial) and
 * examples/transient_1d_mpi.c (MPI). Uses only the public header mcdiff.h.
 *
 * DEMO ONLY: the scenario (a water-gas-shift-like reaction on a catalyst
 * strip, its rate constant, the initial compositions and the geometry) is
 * invented for illustration; nothing here is measured data.
 *
 * Model (see fv1d.c for the derivation):
 *   d(c x_i)/dt = -dN_i/dz + nu_i r,   i = 1..N,  0 < z < L,
 * isothermal, isobaric ideal gas, so c = P/(R T) is constant. Summing over
 * species gives dN_t/dz = (sum_i nu_i) r = 0 for the equimolar reaction
 * used here, and N_t = 0 at the closed (zero-flux) walls, so N_t = 0
 * everywhere: the molar-average velocity vanishes and the total molar
 * fluxes equal the diffusion fluxes, N_i = J_i + x_i N_t = J_i.
 */
#ifndef MCDIFF_EXAMPLES_FV1D_H
#define MCDIFF_EXAMPLES_FV1D_H

#include <stddef.h>
#include <stdio.h>
#include "mcdiff.h"

/* Species of the demo mixture, in this order. */
enum { FV1D_CO = 0, FV1D_H2O, FV1D_CO2, FV1D_H2, FV1D_N2, FV1D_NS };
/* Elements tracked by the atom balance: C, H, O, N. */
#define FV1D_NE 4

/* Everything that defines one run; identical on every MPI rank. */
typedef struct fv1d_problem {
    size_t n_cells;                /* cells over the whole domain */
    size_t n_steps;                /* explicit Euler steps */
    double L, dz;                  /* domain length and cell size [m] */
    double T, P, c;                /* [K], [Pa], [mol/m^3] */
    double t_end, dt;              /* [s] */
    double M[FV1D_NS];             /* molar masses [kg/mol] */
    double Dij[FV1D_NS * FV1D_NS]; /* binary diffusivities [m^2/s] */
    double D_max;                  /* largest binary diffusivity [m^2/s] */
    double D_star;                 /* D_max or the largest Fick-matrix
                                   eigenvalue at the initial states, if
                                   larger: sets the stable dt [m^2/s] */
    double nu[FV1D_NS];            /* stoichiometric coefficients [-] */
    double k_rate;                 /* rate constant [m^3/(mol s)], 0 = inert */
    size_t zone_lo, zone_hi;       /* catalyst cells [zone_lo, zone_hi) */
    mcd_model model;               /* flux model */
    int per_face;                  /* 1: one mcd_flux_compute call per face
                                   instead of one batched call per step */
    mcd_mixture *mix;              /* the mixture (owned; fv1d_problem_free) */
    double atoms[FV1D_NE * FV1D_NS]; /* atoms of element e in species i */
    const char *names[FV1D_NS];      /* species names (built-in table) */
    const char *short_names[FV1D_NS];
} fv1d_problem;

/* Per-process scratch: a workspace and face arrays for up to max_faces
 * faces. One per thread/rank. */
typedef struct fv1d_solver {
    mcd_workspace *ws;
    size_t max_faces;
    size_t *face_index; /* which local face each batch entry is */
    double *face_T;     /* face temperatures [K] (all p->T) */
    double *face_P;     /* face pressures [Pa] (all p->P) */
    double *face_x;     /* face compositions, SoA: [i * n_faces + f] */
    double *face_grad;  /* face gradients, SoA: [i * n_faces + f] */
    double *face_flux;  /* face fluxes from the library, SoA */
    double *flux;       /* fluxes on all local faces, face-major, N per face */
    size_t calls;       /* library flux calls made */
} fv1d_solver;

/* Set up the invented scenario. n_cells >= 3; n_steps == 0 picks the
 * smallest stable count for t_end; a given n_steps must be stable.
 * react = 0 switches the reaction off. Returns 0, or 1 after printing the
 * reason to err (p then needs no fv1d_problem_free). */
int fv1d_problem_init(fv1d_problem *p, size_t n_cells, size_t n_steps,
                      double t_end, int react, mcd_model model, FILE *err);
/* Free the mixture held by p. */
void fv1d_problem_free(fv1d_problem *p);

/* Initial mole fractions of global cells first .. first+n-1 into
 * x[k * FV1D_NS + i] (no ghost cells). */
void fv1d_initial(const fv1d_problem *p, size_t first, size_t n, double *x);

/* Allocate / free the scratch for blocks of up to max_cells cells of
 * problem p. */
int fv1d_solver_init(fv1d_solver *s, const fv1d_problem *p, size_t max_cells,
                     FILE *err);
void fv1d_solver_free(fv1d_solver *s);

/* One explicit Euler step on a block of n_local cells whose first cell is
 * global cell `first`. x holds (n_local + 2) cells, x[0] and x[n_local + 1]
 * are ghost cells: they must hold the neighbours' compositions when
 * has_left / has_right is set, and are ignored at a wall. Face fluxes come
 * from the library (mixture-averaged or Maxwell-Stefan) in ONE batched
 * call for all faces of the block (or one call per face when p->per_face),
 * the face state is the arithmetic mean of the two cells and the gradient
 * (x_R - x_L)/dz.
 * *inout_extent accumulates the reaction extent sum r dz dt [mol/m^2] of the
 * block. Returns 0, or 1 after printing the library's reason to err. */
int fv1d_step(fv1d_solver *s, const fv1d_problem *p, size_t first,
              size_t n_local, int has_left, int has_right, double *x,
              double *inout_extent, FILE *err);

/* Whole domain on one process: initial state, n_steps steps, final mole
 * fractions into x_out (n_cells x FV1D_NS, cell-major) and the reaction
 * extent into *out_extent [mol/m^2]. s must hold n_cells cells. */
int fv1d_run_serial(fv1d_solver *s, const fv1d_problem *p, double *x_out,
                    double *out_extent, FILE *err);

/* Species inventories sum_k c x_ik dz [mol/m^2] of n cells (no ghosts),
 * summed left to right. */
void fv1d_inventory(const fv1d_problem *p, size_t n, const double *x,
                    double *out_inv);

/* Element inventories sum_i atoms_ei inv_i [mol/m^2] from species ones. */
void fv1d_elements(const fv1d_problem *p, const double *inv, double *out_el);

#endif
