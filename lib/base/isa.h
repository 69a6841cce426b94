/* isa.h - the instruction set chosen for the kernels (isa.c). Never
 * installed. */
#ifndef MCD_ISA_H
#define MCD_ISA_H

/* 4 (x86-64-v4), 3 (x86-64-v3) or 1 (baseline): the best the CPU has
 * among the kernels built (MCDI_HAVE_KISA), capped by MCDIFF_KERNEL_ISA. */
int mcdi_isa(void);

#endif
