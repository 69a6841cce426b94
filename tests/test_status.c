/* test_status.c - status codes, their messages and the runtime version.
 * (identities only: the API's own contract, no outside check values) */
#include <check.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"
#include "support.h"

/* The codes' numeric values are part of the ABI (bindings hard-code them):
 * checked when this file compiles. */
_Static_assert(MCD_OK == 0, "MCD_OK is 0");
_Static_assert(MCD_EINVAL == 1, "MCD_EINVAL is 1");
_Static_assert(MCD_EDOM == 2, "MCD_EDOM is 2");
_Static_assert(MCD_EBADLEN == 3, "MCD_EBADLEN is 3");
_Static_assert(MCD_ENOMEM == 4, "MCD_ENOMEM is 4");
_Static_assert(MCD_ESING == 5, "MCD_ESING is 5");
_Static_assert(MCD_EINTERNAL == 6, "MCD_EINTERNAL is 6");
_Static_assert(MCD_ENOTFOUND == 7, "MCD_ENOTFOUND is 7");
_Static_assert(MCD_EPARSE == 8, "MCD_EPARSE is 8");
_Static_assert(MCD_ENODATA == 9, "MCD_ENODATA is 9");
_Static_assert(MCD_ENOCONV == 10, "MCD_ENOCONV is 10");
_Static_assert(MCD_EIO == 11, "MCD_EIO is 11");

START_TEST(status_every_code_has_distinct_text)
{
    /* Codes 0..MCD_EIO are the published set; each needs its own message. */
    for (int a = MCD_OK; a <= MCD_EIO; a++) {
        const char *sa = mcd_status_string(a);
        ck_assert_ptr_nonnull(sa);
        ck_assert_int_gt((int)strlen(sa), 3);
        ck_assert_str_ne(sa, mcd_status_string(-1));
        for (int b = a + 1; b <= MCD_EIO; b++)
            ck_assert_str_ne(sa, mcd_status_string(b));
    }
}
END_TEST

START_TEST(status_unknown_code_is_not_null)
{
    ck_assert_str_eq(mcd_status_string(999), "unknown status code");
    ck_assert_str_eq(mcd_status_string(-7), "unknown status code");
}
END_TEST

START_TEST(status_runtime_version_matches_header)
{
    char expect[32];
    snprintf(expect, sizeof expect, "%d.%d.%d", MCD_VERSION_MAJOR,
             MCD_VERSION_MINOR, MCD_VERSION_PATCH);
    ck_assert_str_eq(mcd_version_string(), expect);
    ck_assert_uint_eq(mcd_version_number(), (unsigned)MCD_VERSION_NUMBER);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mcd:status");
    TCase *tc = tcase_create("codes");
    tcase_add_test(tc, status_every_code_has_distinct_text);
    tcase_add_test(tc, status_unknown_code_is_not_null);
    tcase_add_test(tc, status_runtime_version_matches_header);
    suite_add_tcase(s, tc);
    return sup_run(s);
}
