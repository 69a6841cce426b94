// The public header must compile on its own as C++.
#include "mcdiff.h"
#include <cstdio>
#include <string_view>

int main()
{
    if (mcd_version_number() != MCD_VERSION_NUMBER) {
        std::fprintf(stderr, "version mismatch\n");
        return 1;
    }
    return std::string_view(mcd_status_string(MCD_OK)).empty() ? 1 : 0;
}
