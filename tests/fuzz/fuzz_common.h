/* fuzz_common.h - helpers shared by the libFuzzer harnesses.
 *
 * A harness checks invariants and calls FUZZ_REQUIRE on each; a violated
 * invariant prints a line and calls abort(), which libFuzzer reports as a
 * crash and saves the input (crash-<sha1>) for reproduction. These are test
 * programs: abort() here is intended; the library itself never aborts.
 */
#ifndef MCD_FUZZ_COMMON_H
#define MCD_FUZZ_COMMON_H

#include <math.h>
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"

#define FUZZ_REQUIRE(cond, ...)                                                \
    do {                                                                       \
        if (!(cond)) {                                                         \
            fprintf(stderr, "invariant violated at %s:%d: %s: ", __FILE__,     \
                    __LINE__, #cond);                                          \
            fprintf(stderr, __VA_ARGS__);                                      \
            fputc('\n', stderr);                                               \
            abort();                                                           \
        }                                                                      \
    } while (0)

#define FUZZ_GUARD_BYTE 0x5A

/* 1 if n bytes at p all equal the guard byte. */
static inline int fuzz_untouched(const void *p, size_t n)
{
    const unsigned char *b = (const unsigned char *)p;
    for (size_t i = 0; i < n; i++)
        if (b[i] != FUZZ_GUARD_BYTE)
            return 0;
    return 1;
}

/* 1 if errbuf holds a NUL within errlen. */
static inline int fuzz_terminated(const char *buf, size_t len)
{
    return memchr(buf, '\0', len) != NULL;
}

/* The error detail agrees with the status: none after a success, some
 * (shorter than the library's 256-byte buffer) after a failure. */
static inline int fuzz_detail_ok(mcd_status st)
{
    const char *d = mcd_last_error();
    return st == MCD_OK ? d[0] == '\0'
                        : d[0] != '\0' && fuzz_terminated(d, 256);
}

/* A NUL-terminated copy of the fuzz input (caller frees). */
static inline char *fuzz_cstr(const uint8_t *data, size_t size)
{
    char *s = (char *)malloc(size + 1);
    if (s == NULL)
        abort();
    memcpy(s, data, size);
    s[size] = '\0';
    return s;
}

/* Byte reader over the input; past the end it yields zeros. */
typedef struct fuzz_in {
    const uint8_t *p;
    size_t n, pos;
} fuzz_in;

static inline uint8_t fuzz_u8(fuzz_in *in)
{
    return in->pos < in->n ? in->p[in->pos++] : 0;
}

/* A double: with the control byte's top bit set, 8 raw bytes (any bit
 * pattern: NaN, inf, subnormal, negative, huge); otherwise a value from a
 * small table of physically reasonable magnitudes scaled by the low bits,
 * so that the valid paths are reached as well. */
static inline double fuzz_double(fuzz_in *in, double scale)
{
    uint8_t ctl = fuzz_u8(in);
    if (ctl & 0x80) {
        uint64_t u = 0;
        double d;
        for (int k = 0; k < 8; k++)
            u |= (uint64_t)fuzz_u8(in) << (8 * k);
        memcpy(&d, &u, sizeof d);
        return d;
    }
    switch (ctl & 0x07) {
    case 0: return 0.0;
    case 1: return scale * (1.0 + (ctl >> 3));
    case 2: return -scale * (1.0 + (ctl >> 3));
    case 3: return scale / (1.0 + (ctl >> 3));
    case 4: return scale * 1e-6 * (1 + (ctl >> 3));
    case 5: return scale * 1e6 * (1 + (ctl >> 3));
    case 6: return scale;
    default: return scale * 0.5;
    }
}

#endif
