/* problems.c - the public film and two-bulb calls: they take the problem
 * as one struct (mcd_film, mcd_bulbs) and pass its fields to the
 * implementations in film.c and bulbs.c. */
#include "base/mcd_internal.h"
#include "transfer/film.h"

mcd_status mcdi_api_film_solve(mcd_workspace *ws, const mcd_film *film,
                               mcd_film_bootstrap kind, size_t species,
                               const double *values, mcd_film_method method,
                               double *out_N, size_t *out_iterations,
                               double *out_residual)
{
    const mcd_film *f = film;
    if (f == NULL)
        return mcdi_fail(MCD_EINVAL, "argument film: NULL");
    return mcdi_film_solve_args(ws, f->n_species, f->Dij, f->c, f->L, f->x0,
                                f->xL, kind, species, values, method, out_N,
                                out_iterations, out_residual);
}

mcd_status mcdi_api_film_profile(mcd_workspace *ws, const mcd_film *film,
                                 const double *N, size_t n_points,
                                 const double *z, double *out_x)
{
    const mcd_film *f = film;
    if (f == NULL)
        return mcdi_fail(MCD_EINVAL, "argument film: NULL");
    return mcdi_film_profile_args(ws, f->n_species, f->Dij, f->c, f->L, f->x0,
                                  N, n_points, z, out_x);
}

mcd_status mcdi_api_bulbs_linearized(mcd_workspace *ws, const mcd_bulbs *bulbs,
                                     size_t n_times, const double *t,
                                     double *out_x1, double *out_x2)
{
    const mcd_bulbs *b = bulbs;
    if (b == NULL)
        return mcdi_fail(MCD_EINVAL, "argument bulbs: NULL");
    return mcdi_bulbs_linearized_args(ws, b->n_species, b->Dij, b->c, b->V1,
                                      b->V2, b->A, b->L, b->x1_0, b->x2_0,
                                      n_times, t, out_x1, out_x2);
}

mcd_status mcdi_api_bulbs_integrate(mcd_workspace *ws, const mcd_bulbs *bulbs,
                                    size_t n_times, const double *t,
                                    double rel_tol, double *out_x1,
                                    double *out_x2)
{
    const mcd_bulbs *b = bulbs;
    if (b == NULL)
        return mcdi_fail(MCD_EINVAL, "argument bulbs: NULL");
    return mcdi_bulbs_integrate_args(ws, b->n_species, b->Dij, b->c, b->V1,
                                     b->V2, b->A, b->L, b->x1_0, b->x2_0,
                                     n_times, t, rel_tol, out_x1, out_x2);
}
