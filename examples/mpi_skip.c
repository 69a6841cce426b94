/* mpi_skip.c - stands in for the MPI example when the build found no MPI:
 * prints why and exits 77, which Meson reports as SKIP (never a silent
 * pass). The reason comes from examples/meson.build as argv[1]. */
#include <stdio.h>

int main(int argc, char **argv)
{
    printf("transient_1d_mpi not built: %s\n",
           argc > 1 ? argv[1] : "no MPI found");
    return 77;
}
