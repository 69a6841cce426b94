#!/bin/sh
# Print the version from the public header (single source of truth).
h="$(dirname "$0")/../include/mcdiff.h"
maj=$(sed -n 's/^#define MCD_VERSION_MAJOR \([0-9]*\)/\1/p' "$h")
min=$(sed -n 's/^#define MCD_VERSION_MINOR \([0-9]*\)/\1/p' "$h")
pat=$(sed -n 's/^#define MCD_VERSION_PATCH \([0-9]*\)/\1/p' "$h")
echo "$maj.$min.$pat"
