#!/usr/bin/env bash
# check_format.sh ROOT - the C sources (lib/, tests/, bindings/cli/,
# examples/) are formatted as .clang-format says.
# Formatting differs between clang-format releases: the check runs with
# release 14 (Debian 12's) and skips (exit 77) with any other or none.
# Fix a failure with the command it prints.
set -u
root=${1:-.}
cf=$(command -v clang-format || true)
if [ -z "$cf" ]; then
    echo "check_format: clang-format not installed (skipped)"
    exit 77
fi
major=$("$cf" --version | sed -n 's/.*version \([0-9][0-9]*\)\..*/\1/p')
if [ "$major" != "14" ]; then
    echo "check_format: clang-format $major, the style is pinned to 14 (skipped)"
    exit 77
fi
cd "$root" || exit 1
# Generated files (first line "... do not edit") keep the generator's layout.
files=$(for f in lib/*/*.[ch] tests/*.[ch] tests/fuzz/*.[ch] tests/install/*.c \
    bindings/cli/*.[ch] examples/*.[ch]; do
    [ -f "$f" ] || continue
    head -n 1 "$f" | grep -q 'do not edit' || echo "$f"
done)
# shellcheck disable=SC2086
if "$cf" --dry-run -Werror $files; then
    echo "check_format: the C sources match .clang-format"
    exit 0
fi
echo "check_format: run clang-format -i on the files named above"
exit 1
