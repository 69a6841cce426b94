/* state.c - the public single-state flux and Fick-matrix calls: they take
 * one mcd_state and pass its fields to the implementations
 * (mcdi_flux_compute_args, maxwell_stefan.c; mcdi_fick_matrix_args,
 * fick.c). A driving force added later is one more field here. */
#include "base/mcd_internal.h"
#include "flux/flux_core.h"

mcd_status mcdi_api_flux_compute(mcd_workspace *ws, mcd_model model,
                                 const mcd_state *state, mcd_basis flux_basis,
                                 double *out_flux)
{
    const mcd_state *s = state;
    if (s == NULL)
        return mcdi_fail(MCD_EINVAL, "argument state: NULL");
    return mcdi_flux_compute_args(ws, model, s->n_species, s->n_dim, s->M,
                                  s->Dij, s->c, s->comp_basis, s->comp, s->grad,
                                  s->Gamma, s->grad_lnP, flux_basis, out_flux);
}

mcd_status mcdi_api_fick_matrix(mcd_workspace *ws, const mcd_state *state,
                                mcd_basis basis, size_t dependent,
                                double *out_D, size_t *out_dependent)
{
    const mcd_state *s = state;
    if (s == NULL)
        return mcdi_fail(MCD_EINVAL, "argument state: NULL");
    return mcdi_fick_matrix_args(ws, s->n_species, s->M, s->Dij, s->comp_basis,
                                 s->comp, s->Gamma, basis, dependent, out_D,
                                 out_dependent);
}
