/* layout.h - scratch laid out from one list of named regions. Never
 * installed.
 *
 * A list is a macro LIST(R) that calls R(name, count) once per region;
 * count is an expression in n, nd (the caller's sizes) and is multiplied
 * by L (lanes of a batched block, or 1). MCDI_DEFINE_LAYOUT(type, LIST,
 * doubles_fn, carve_fn) then defines the struct of region pointers, the
 * size in doubles and the carving of one block of memory in list order:
 * one list drives all three, so the size and the layout cannot disagree,
 * and no region is reached by a number. Used by the batched kernel
 * (batched/batch_layout.h) and the transfer layer (transfer/tf_layout.h).
 */
#ifndef MCD_LAYOUT_H
#define MCD_LAYOUT_H

#include <stddef.h>

/* From a region list: the struct of region pointers, the size in doubles
 * for n species, nd directions, L lanes, and the carving of a block of
 * memory in list order. One list drives all three, so the size and the
 * layout cannot disagree. */
/* clang-format off */
#define MCDI_LAYOUT_FIELD(name, rows) double *name;
#define MCDI_LAYOUT_IFIELD(name, rows) int *name;
#define MCDI_LAYOUT_COUNT(name, rows) count += (rows);
#define MCDI_LAYOUT_CARVE(name, rows) out->name = mem; mem += (rows) * L;
/* elem: double or int; FIELD: MCDI_LAYOUT_FIELD or MCDI_LAYOUT_IFIELD to
 * match. size_fn returns elements of elem. */
#define MCDI_DEFINE_LAYOUT_OF(type, elem, FIELD, LIST, size_fn, carve_fn)   \
    typedef struct type { LIST(FIELD) } type;                             \
    static inline size_t size_fn(size_t n, size_t nd, size_t L)           \
    {                                                                     \
        size_t count = 0;                                                 \
        LIST(MCDI_LAYOUT_COUNT)                                           \
        (void)n;                                                          \
        (void)nd;                                                         \
        return count * L;                                                 \
    }                                                                     \
    static inline void carve_fn(elem *mem, size_t n, size_t nd, size_t L, \
                                type *out)                                \
    {                                                                     \
        LIST(MCDI_LAYOUT_CARVE)                                           \
        (void)n;                                                          \
        (void)nd;                                                         \
    }
#define MCDI_DEFINE_LAYOUT(type, LIST, doubles_fn, carve_fn)              \
    MCDI_DEFINE_LAYOUT_OF(type, double, MCDI_LAYOUT_FIELD, LIST,          \
                          doubles_fn, carve_fn)
/* clang-format on */

#endif
