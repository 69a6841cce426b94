/* cells.c - the public batched calls: they take one mcd_cells (the
 * per-cell inputs every batched call shares) and pass its fields to the
 * implementations in batch.c. A per-cell input added later is one more
 * field here. */
#include "base/mcd_internal.h"
#include "batched/batch.h"

mcd_status mcdi_api_flux_batch(mcd_workspace *ws, const mcd_mixture *mix,
                               mcd_model model, const double *T,
                               const double *P, const mcd_cells *cells,
                               mcd_basis flux_basis, double *out_flux)
{
    const mcd_cells *s = cells;
    if (s == NULL)
        return mcdi_fail(MCD_EINVAL, "argument cells: NULL");
    return mcdi_flux_batch_args(ws, mix, model, s->n_cells, s->n_dim, T, P,
                                s->comp_basis, s->comp, s->grad, s->grad_lnP,
                                flux_basis, out_flux);
}

mcd_status mcdi_api_flux_batch_dij(mcd_workspace *ws, mcd_model model,
                                   size_t n_species, const double *M,
                                   const double *Dij, const double *c,
                                   const mcd_cells *cells, mcd_basis flux_basis,
                                   double *out_flux)
{
    const mcd_cells *s = cells;
    if (s == NULL)
        return mcdi_fail(MCD_EINVAL, "argument cells: NULL");
    return mcdi_flux_batch_dij_args(ws, model, n_species, s->n_cells, s->n_dim,
                                    M, Dij, c, s->comp_basis, s->comp, s->grad,
                                    s->grad_lnP, flux_basis, out_flux);
}

mcd_status mcdi_api_flux_batch_aos(mcd_workspace *ws, const mcd_mixture *mix,
                                   mcd_model model, const double *T,
                                   const double *P, const mcd_cells *cells,
                                   mcd_basis flux_basis, double *out_flux)
{
    const mcd_cells *s = cells;
    if (s == NULL)
        return mcdi_fail(MCD_EINVAL, "argument cells: NULL");
    return mcdi_flux_batch_aos_args(ws, mix, model, s->n_cells, s->n_dim, T, P,
                                    s->comp_basis, s->comp, s->grad,
                                    s->grad_lnP, flux_basis, out_flux);
}
