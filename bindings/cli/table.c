/* table.c - aligned text tables for the mcdiff tool.
 *
 * Cells are copied strings; columns are padded to their widest cell (counted
 * in UTF-8 code points so that "Å" or "Đ" take one column) and separated by
 * two spaces. Columns marked right-aligned suit numbers.
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "cli.h"

int cli_table_init(cli_table *t, size_t ncols)
{
    memset(t, 0, sizeof *t);
    if (ncols == 0 || ncols > CLI_TABLE_MAX_COLS)
        return -1;
    t->ncols = ncols;
    return 0;
}

static char *dup_text(const char *s)
{
    size_t n = strlen(s) + 1;
    char *p = malloc(n);
    if (p)
        memcpy(p, s, n);
    return p;
}

int cli_table_row(cli_table *t, const char *const *cells)
{
    size_t c;
    if (t->nrows == t->cap) {
        size_t cap = t->cap ? 2 * t->cap : 16;
        char **grown = realloc(t->cells, cap * t->ncols * sizeof *grown);
        if (!grown)
            return -1;
        t->cells = grown;
        t->cap = cap;
    }
    for (c = 0; c < t->ncols; c++) {
        char *s = dup_text(cells[c] ? cells[c] : "");
        if (!s) {
            while (c-- > 0)
                free(t->cells[t->nrows * t->ncols + c]);
            return -1;
        }
        t->cells[t->nrows * t->ncols + c] = s;
    }
    t->nrows++;
    return 0;
}

/* Display width: UTF-8 continuation bytes do not count. */
static size_t width(const char *s)
{
    size_t w = 0;
    for (; *s; s++)
        if (((unsigned char)*s & 0xC0u) != 0x80u)
            w++;
    return w;
}

void cli_table_print(const cli_table *t, FILE *f, const char *indent)
{
    size_t wmax[CLI_TABLE_MAX_COLS] = {0};
    size_t r, c;
    for (r = 0; r < t->nrows; r++)
        for (c = 0; c < t->ncols; c++) {
            size_t w = width(t->cells[r * t->ncols + c]);
            if (w > wmax[c])
                wmax[c] = w;
        }
    for (r = 0; r < t->nrows; r++) {
        size_t spaces = 0; /* pending padding, written only before text */
        fputs(indent ? indent : "", f);
        for (c = 0; c < t->ncols; c++) {
            const char *s = t->cells[r * t->ncols + c];
            size_t pad = wmax[c] - width(s);
            if (c)
                spaces += 2;
            if (t->right[c])
                spaces += pad;
            if (*s) {
                for (; spaces > 0; spaces--)
                    fputc(' ', f);
                fputs(s, f);
            }
            if (!t->right[c])
                spaces += pad;
        }
        fputc('\n', f);
    }
}

void cli_table_free(cli_table *t)
{
    size_t i;
    for (i = 0; i < t->nrows * t->ncols; i++)
        free(t->cells[i]);
    free(t->cells);
    memset(t, 0, sizeof *t);
}

void cli_fmt_num(char *buf, size_t len, double v)
{
    if (isnan(v))
        snprintf(buf, len, "-");
    else
        snprintf(buf, len, "%.4g", v);
}

double cli_scale(const double *v, size_t n, size_t stride)
{
    double m = 0.0;
    for (size_t k = 0; k < n; k++)
        if (isfinite(v[k * stride]) && fabs(v[k * stride]) > m)
            m = fabs(v[k * stride]);
    return m;
}

double cli_shown(double v, double scale)
{
    return fabs(v) <= CLI_ROUNDOFF_REL * scale ? 0.0 : v;
}
