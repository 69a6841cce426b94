/* (invariants only: no outside check values)
 * fuzz_db_load.c - libFuzzer harness for the species-file parser
 * (mcd_db_load_string) and for what a loaded database feeds into.
 *
 * Invariants:
 *  - on error errbuf is NUL-terminated and not empty;
 *  - failure => the database is unchanged (all or nothing): same count,
 *    names and parameter values;
 *  - success => every species has a name and a formula, every known
 *    parameter is finite and in its documented range (> 0, or >= 0 for the
 *    dipole moment and association factor), and binary estimates between
 *    the loaded species and nitrogen by every gas method are either an
 *    error or finite and > 0.
 */
#include "fuzz_common.h"
#include "mcdiff.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

static uint64_t fingerprint(const mcd_db *db)
{
    uint64_t h = 1469598103934665603ull;
    size_t n = mcd_db_species_count(db);
    for (size_t i = 0; i < n; i++) {
        const char *s = mcd_db_name(db, i);
        for (; s && *s; s++)
            h = (h ^ (unsigned char)*s) * 1099511628211ull;
        for (int p = 0; p < MCD_PARAM_COUNT; p++) {
            double v = 0;
            uint64_t u = 0;
            if (mcd_db_param(db, i, (mcd_param)p, &v) == MCD_OK)
                memcpy(&u, &v, sizeof u);
            h = (h ^ u) * 1099511628211ull;
        }
    }
    return h ^ n;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    static mcd_db *pristine = NULL;
    char *text = fuzz_cstr(data, size);
    mcd_db *db = NULL;
    size_t n0, n1, ref;
    uint64_t h0;
    mcd_status st;

    if (pristine == NULL && mcd_db_new_builtin(&pristine) != MCD_OK)
        abort();
    /* a fresh copy each time: the builtin table */
    if (mcd_db_new_builtin(&db) != MCD_OK)
        abort();
    n0 = mcd_db_species_count(db);
    h0 = fingerprint(db);
    st = mcd_db_load_string(db, text);
    FUZZ_REQUIRE(fuzz_detail_ok(st), "detail \"%s\" after status %d",
                 mcd_last_error(), st);
    n1 = mcd_db_species_count(db);
    if (st != MCD_OK) {
        FUZZ_REQUIRE(n1 == n0 && fingerprint(db) == h0,
                     "database changed on error %d", st);
    } else {
        if (mcd_db_find(db, "nitrogen", &ref) != MCD_OK)
            ref = 0;
        for (size_t i = 0; i < n1; i++) {
            FUZZ_REQUIRE(mcd_db_name(db, i) != NULL &&
                             mcd_db_formula(db, i) != NULL,
                         "species %zu lacks name or formula", i);
            for (int p = 0; p < MCD_PARAM_COUNT; p++) {
                double v;
                mcd_status ps = mcd_db_param(db, i, (mcd_param)p, &v);
                FUZZ_REQUIRE(ps == MCD_OK || ps == MCD_ENODATA,
                             "param status %d", ps);
                if (ps == MCD_OK) {
                    int zero_ok = p == MCD_PARAM_DIPOLE || p == MCD_PARAM_ASSOC;
                    FUZZ_REQUIRE(isfinite(v) && (v > 0 || (zero_ok && v == 0)),
                                 "species %zu param %d = %g", i, p, v);
                }
            }
            if (i < n0 && i != ref)
                continue; /* unchanged builtin species: covered by the tests */
            for (int m = MCD_METHOD_FSG; m <= MCD_METHOD_WILKE_LEE; m++) {
                double D = -1;
                unsigned warn = 0;
                mcd_status bs = mcd_db_binary_gas(
                    db, i, ref, (mcd_method)m, 300.0, MCD_ATM, &D, NULL, &warn);
                if (bs == MCD_OK)
                    FUZZ_REQUIRE(isfinite(D) && D > 0,
                                 "binary %zu-%zu method %d: %g", i, ref, m, D);
            }
        }
    }
    mcd_db_free(db);
    free(text);
    return 0;
}
