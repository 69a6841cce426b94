/* kernel_isa.c - which kernels run: the instruction set is chosen once per
 * process at run time, so that the default build reaches the machine's
 * vector width without -march flags, and without ifunc resolvers (which
 * run before sanitizer runtimes exist).
 *
 * lib/meson.build compiles batch_kernel.c once per instruction set on
 * x86-64 with GCC (MCDI_HAVE_KISA): v4 = x86-64-v4 (AVX-512, 8 lanes),
 * v3 = x86-64-v3 (AVX2 + FMA, 4 lanes), v1 = baseline x86-64 (SSE2,
 * 2 lanes); ms_ldl.c for v3 and v1 only. Elsewhere only v1 (the
 * compiler's default target).
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
#if defined(__unix__) || defined(__APPLE__)
#include <unistd.h>
#endif

#include "mcd_internal.h"
#include "batch.h"
#include "flux_core.h"

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

static int isa(void)
{
    int v = atomic_load_explicit(&isa_cached, memory_order_relaxed);
    if (v == 0) {
        v = isa_choose();
        atomic_store_explicit(&isa_cached, v, memory_order_relaxed);
    }
    return v;
}

size_t mcdi_batch_lanes(size_t n)
{
    if (n > MCDI_LANES_NMAX)
        return 1;
    switch (isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: return mcdi_batch_lanes_v4;
    case 3: return mcdi_batch_lanes_v3;
#endif
    default: return mcdi_batch_lanes_v1;
    }
}

void mcdi_batch_finish(const mcdi_bjob *jb, double *mem)
{
    switch (isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: mcdi_batch_finish_v4(jb, mem); break;
    case 3: mcdi_batch_finish_v3(jb, mem); break;
#endif
    default: mcdi_batch_finish_v1(jb, mem); break;
    }
}

/* Streaming stores (batch.h): MCDIFF_STREAM_STORES=always|never decides;
 * otherwise a call streams when its inputs and outputs together are at
 * least the last-level cache (sysconf where the C library reports it,
 * else 32 MiB; clamped to 4..32 MiB): the first outputs have then left the cache before the
 * caller can read them, and writing them past it saves the read of every
 * output line. Cached like the instruction set. */
static atomic_int stream_mode_cached; /* 0 unknown, 1 auto, 2 always, 3 never */
static atomic_size_t stream_bytes_cached;

int mcdi_batch_stream_choice(size_t bytes)
{
    int mode = atomic_load_explicit(&stream_mode_cached, memory_order_relaxed);
    size_t llc;
    if (mode == 0) {
        const char *env = getenv("MCDIFF_STREAM_STORES");
        long v = 0;
        mode = 1;
        if (env != NULL && strcmp(env, "always") == 0)
            mode = 2;
        else if (env != NULL && strcmp(env, "never") == 0)
            mode = 3;
#if defined(_SC_LEVEL3_CACHE_SIZE)
        v = sysconf(_SC_LEVEL3_CACHE_SIZE);
#endif
        /* clamped to 4..32 MiB: virtual machines report odd sizes (320 MiB
         * for a 32 MiB L3 on the development host), and the caches a
         * thread can use are its share of the whole anyway */
        llc = v > 0 ? (size_t)v : (size_t)32 << 20;
        if (llc > (size_t)32 << 20)
            llc = (size_t)32 << 20;
        if (llc < (size_t)4 << 20)
            llc = (size_t)4 << 20;
        atomic_store_explicit(&stream_bytes_cached, llc, memory_order_relaxed);
        atomic_store_explicit(&stream_mode_cached, mode, memory_order_relaxed);
    }
    if (mode != 1)
        return mode == 2;
    llc = atomic_load_explicit(&stream_bytes_cached, memory_order_relaxed);
    return bytes >= llc;
}

void mcdi_batch_block(const mcdi_bjob *jb, size_t k0, size_t nv, double *mem,
                      mcdi_bres *res)
{
    switch (isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: mcdi_batch_block_v4(jb, k0, nv, mem, res); break;
    case 3: mcdi_batch_block_v3(jb, k0, nv, mem, res); break;
#endif
    default: mcdi_batch_block_v1(jb, k0, nv, mem, res); break;
    }
}

mcdi_ms_ldl_fn mcdi_ms_ldl_select(void)
{
    switch (isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: /* the x86-64-v3 build: no gain from AVX-512 on a few species */
    case 3: return mcdi_ms_ldl_v3;
#endif
    default: return mcdi_ms_ldl_v1;
    }
}
