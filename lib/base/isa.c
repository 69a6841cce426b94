/* isa.c - the instruction set the kernels use, chosen once per process at
 * run time, so that the default build reaches the machine's vector width
 * without -march flags, and without ifunc resolvers (which run before
 * sanitizer runtimes exist).
 *
 * lib/meson.build compiles the batched kernel (batched/batch_kernel.c)
 * once per instruction set on x86-64 with GCC (MCDI_HAVE_KISA): v4 =
 * x86-64-v4 (AVX-512, 8 lanes), v3 = x86-64-v3 (AVX2 + FMA, 4 lanes), v1 =
 * baseline x86-64 (SSE2, 2 lanes); the single-state core
 * (flux/ms_ldl.c) for v3 and v1 only. Elsewhere only v1 (the compiler's
 * default target). Each layer dispatches on mcdi_isa() itself
 * (batched/batch_dispatch.c, flux/maxwell_stefan.c).
 *
 * MCDIFF_KERNEL_ISA=v1|v3|v4 in the environment caps the choice (a cap
 * above what the CPU has is ignored): the tests use it to run every kernel
 * on one machine. The choice is cached in an atomic (no data race when
 * threads call in parallel). Results of different kernels agree to
 * round-off, not bit for bit (FMA contraction, lane order of sums); within
 * one process every call uses the same kernel, so thread counts never
 * change results.
 */
#include <stdatomic.h>
#include <stdlib.h>
#include <string.h>

#include "base/mcd_internal.h"
#include "base/isa.h"

static atomic_int isa_cached; /* 0: not chosen yet; else 1, 3 or 4 */

static int isa_choose(void)
{
    int best = 1, cap = 4;
    const char *env = getenv("MCDIFF_KERNEL_ISA");
#if defined(MCDI_HAVE_KISA)
    if (__builtin_cpu_supports("x86-64-v4"))
        best = 4;
    else if (__builtin_cpu_supports("x86-64-v3"))
        best = 3;
#endif
    if (env != NULL) {
        if (strcmp(env, "v1") == 0)
            cap = 1;
        else if (strcmp(env, "v3") == 0)
            cap = 3;
    }
    return best < cap ? best : cap;
}

int mcdi_isa(void)
{
    int v = atomic_load_explicit(&isa_cached, memory_order_relaxed);
    if (v == 0) {
        v = isa_choose();
        atomic_store_explicit(&isa_cached, v, memory_order_relaxed);
    }
    return v;
}
