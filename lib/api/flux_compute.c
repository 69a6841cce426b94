/* flux_compute.c - mcd_flux_compute: the single-state fluxes of the flux
 * layer (flux/maxwell_stefan.c), with MCD_MODEL_ITERATIVE solved by the
 * batched layer's iteration on one cell. Here because only the api layer
 * may use both. */
#include "base/mcd_internal.h"
#include "batched/batch.h"
#include "flux/flux_core.h"

mcd_status mcdi_api_flux_compute(mcd_workspace *ws, mcd_model model,
                                 const mcd_state *state, mcd_basis flux_basis,
                                 double *out_flux)
{
    return mcdi_flux_state(ws, model, state, flux_basis, out_flux,
                           mcdi_batch_iterate_one);
}
