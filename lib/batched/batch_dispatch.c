/* batch_dispatch.c - the entry points of the batched kernel objects, one
 * per instruction set (base/isa.c chooses), and the choice of streaming
 * stores. */
#include <stdatomic.h>
#include <stdlib.h>
#include <string.h>
#if defined(__unix__) || defined(__APPLE__)
#include <unistd.h>
#endif

#include "base/mcd_internal.h"
#include "base/isa.h"
#include "batched/batch.h"

size_t mcdi_batch_lanes(size_t n)
{
    if (n > MCDI_LANES_NMAX)
        return 1;
    switch (mcdi_isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: return mcdi_batch_lanes_v4;
    case 3: return mcdi_batch_lanes_v3;
#endif
    default: return mcdi_batch_lanes_v1;
    }
}

void mcdi_batch_finish(const mcdi_bjob *jb, double *mem)
{
    switch (mcdi_isa()) {
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

/* Read MCDIFF_STREAM_STORES and the cache size once. */
static int stream_mode(void)
{
    int mode = atomic_load_explicit(&stream_mode_cached, memory_order_relaxed);
    if (mode == 0) {
        const char *env = getenv("MCDIFF_STREAM_STORES");
        long v = 0;
        size_t llc;
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
    return mode;
}

int mcdi_batch_beyond_cache(size_t bytes)
{
    (void)stream_mode();
    return bytes >=
           atomic_load_explicit(&stream_bytes_cached, memory_order_relaxed);
}

int mcdi_batch_stream_choice(size_t bytes)
{
    const int mode = stream_mode();
    if (mode != 1)
        return mode == 2;
    return mcdi_batch_beyond_cache(bytes);
}

size_t mcdi_batch_blocks(const mcdi_bjob *jb, size_t k_begin, size_t k_end,
                         double *mem, mcdi_bres *res)
{
    switch (mcdi_isa()) {
#if defined(MCDI_HAVE_KISA)
    case 4: return mcdi_batch_blocks_v4(jb, k_begin, k_end, mem, res);
    case 3: return mcdi_batch_blocks_v3(jb, k_begin, k_end, mem, res);
#endif
    default: return mcdi_batch_blocks_v1(jb, k_begin, k_end, mem, res);
    }
}
