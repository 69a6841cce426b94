/* (invariants only: no outside check values)
 * fuzz_formula.c - libFuzzer harness for the chemical-formula parser.
 *
 * The input is taken as a NUL-terminated formula (bytes after an embedded
 * NUL are ignored by the parser). Invariants:
 *  - on error errbuf is NUL-terminated within errlen and nothing past
 *    errlen is written (on success errbuf is not touched);
 *  - MCD_OK => molar mass finite and > 0, element list within cap with
 *    Z in 1..118 and counts > 0, diffusion volume finite;
 *  - failure => the outputs are untouched (guard bytes).
 * The formula is also given to mcd_db_add as a formula and as a name.
 */
#include "fuzz_common.h"
#include "mcdiff.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char *f = fuzz_cstr(data, size);
    double M, V;
    int Z[8];
    long cnt[8];
    size_t n, k, idx;
    mcd_status st;
    mcd_db *db = NULL;

    /* molar mass */
    memset(&M, FUZZ_GUARD_BYTE, sizeof M);
    st = mcd_formula_molar_mass(f, &M);
    FUZZ_REQUIRE(fuzz_detail_ok(st), "detail \"%s\" after status %d",
                 mcd_last_error(), st);
    if (st == MCD_OK)
        FUZZ_REQUIRE(isfinite(M) && M > 0, "M = %g for '%s'", M, f);
    else
        FUZZ_REQUIRE(fuzz_untouched(&M, sizeof M), "M written on error %d", st);

    /* element counts with two capacities */
    for (size_t cap = 2; cap <= 8; cap += 6) {
        memset(Z, FUZZ_GUARD_BYTE, sizeof Z);
        memset(cnt, FUZZ_GUARD_BYTE, sizeof cnt);
        memset(&n, FUZZ_GUARD_BYTE, sizeof n);
        st = mcd_formula_elements(f, cap, Z, cnt, &n);
        FUZZ_REQUIRE(fuzz_detail_ok(st), "detail \"%s\" after status %d",
                     mcd_last_error(), st);
        if (st == MCD_OK) {
            FUZZ_REQUIRE(n >= 1 && n <= cap, "n = %zu cap %zu", n, cap);
            for (k = 0; k < n; k++)
                FUZZ_REQUIRE(Z[k] >= 1 && Z[k] <= 118 && cnt[k] > 0,
                             "element %zu", k);
            FUZZ_REQUIRE(
                fuzz_untouched(Z + cap, sizeof Z - cap * sizeof Z[0]) ||
                    cap == 8,
                "out_Z written past cap");
        } else {
            FUZZ_REQUIRE(fuzz_untouched(Z, sizeof Z) &&
                             fuzz_untouched(cnt, sizeof cnt) &&
                             fuzz_untouched(&n, sizeof n),
                         "elements written on error %d", st);
        }
    }

    /* diffusion volume, without and with a ring */
    for (int rings = 0; rings <= 1; rings++) {
        memset(&V, FUZZ_GUARD_BYTE, sizeof V);
        st = mcd_formula_diffusion_volume(f, rings, &V);
        if (st == MCD_OK)
            FUZZ_REQUIRE(isfinite(V), "V = %g", V);
        else
            FUZZ_REQUIRE(fuzz_untouched(&V, sizeof V), "V written on error %d",
                         st);
    }
    memset(&V, FUZZ_GUARD_BYTE, sizeof V);
    st = mcd_formula_molecule_volume(f, &V);
    if (st == MCD_OK)
        FUZZ_REQUIRE(isfinite(V) && V > 0, "tabulated V = %g", V);
    else
        FUZZ_REQUIRE(fuzz_untouched(&V, sizeof V), "V written on error %d", st);

    /* database: as a formula, then as a name */
    if (mcd_db_new(&db) != MCD_OK)
        abort();
    st = mcd_db_add(db, "fuzzed", f, (int)(size & 1), &idx);
    FUZZ_REQUIRE(fuzz_detail_ok(st), "detail \"%s\" after status %d",
                 mcd_last_error(), st);
    if (st == MCD_OK) {
        double m;
        FUZZ_REQUIRE(mcd_db_species_count(db) == 1 && idx == 0,
                     "count after add");
        FUZZ_REQUIRE(mcd_db_param(db, 0, MCD_PARAM_MOLAR_MASS, &m) == MCD_OK &&
                         isfinite(m) && m > 0,
                     "db molar mass");
    } else {
        FUZZ_REQUIRE(mcd_db_species_count(db) == 0, "db changed on error %d",
                     st);
    }
    st = mcd_db_add(db, f, "CH4", 0, &idx);
    if (st == MCD_OK) {
        size_t found;
        FUZZ_REQUIRE(mcd_db_find(db, f, &found) == MCD_OK && found == idx,
                     "name not found");
    }
    mcd_db_free(db);
    free(f);
    return 0;
}
