/* test_status.c - status codes, their messages and the runtime version.
 * (identities only: the API's own contract, no outside check values) */
#include <check.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "mcdiff.h"

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

START_TEST(status_codes_keep_their_numbers)
{
    /* Numeric values are part of the ABI (bindings hard-code them). */
    ck_assert_int_eq(MCD_OK, 0);
    ck_assert_int_eq(MCD_EINVAL, 1);
    ck_assert_int_eq(MCD_EDOM, 2);
    ck_assert_int_eq(MCD_EBADLEN, 3);
    ck_assert_int_eq(MCD_ENOMEM, 4);
    ck_assert_int_eq(MCD_ESING, 5);
    ck_assert_int_eq(MCD_EINTERNAL, 6);
    ck_assert_int_eq(MCD_ENOTFOUND, 7);
    ck_assert_int_eq(MCD_EPARSE, 8);
    ck_assert_int_eq(MCD_ENODATA, 9);
    ck_assert_int_eq(MCD_ENOCONV, 10);
    ck_assert_int_eq(MCD_EIO, 11);
}
END_TEST

START_TEST(status_runtime_version_matches_header)
{
    char expect[32];
    snprintf(expect, sizeof expect, "%d.%d.%d", MCD_VERSION_MAJOR, MCD_VERSION_MINOR,
             MCD_VERSION_PATCH);
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
    tcase_add_test(tc, status_codes_keep_their_numbers);
    tcase_add_test(tc, status_runtime_version_matches_header);
    suite_add_tcase(s, tc);
    SRunner *sr = srunner_create(s);
    srunner_run_all(sr, CK_ENV);
    int failed = srunner_ntests_failed(sr);
    srunner_free(sr);
    return failed ? EXIT_FAILURE : EXIT_SUCCESS;
}
