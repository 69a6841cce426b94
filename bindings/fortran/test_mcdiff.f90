! test_mcdiff.f90 - checks of the Fortran module mcdiff against the C library
! and against published values. Exit status 0 when every check passes, 1
! otherwise (meson test suite 'fortran').
program test_mcdiff
  use, intrinsic :: iso_c_binding, only: c_double, c_int, c_long
  use mcdiff
  implicit none

  integer :: nfail = 0, nchecks = 0
  real(c_double), parameter :: GUARD = 12345.678_c_double

  call check_version_and_strings()
  call check_formulas()
  call check_fsg_against_experiment()
  call check_binary_limit()
  call check_ternary()
  call check_film_stagnant()
  call check_batch()
  call check_errors()
  call check_handles()

  write (*, '(a, i0, a, i0, a)') 'fortran: ', nchecks - nfail, ' of ', nchecks, &
       ' checks passed'
  if (nfail /= 0) stop 1

contains

  subroutine check(ok, what)
    logical, intent(in) :: ok
    character(len=*), intent(in) :: what
    nchecks = nchecks + 1
    if (.not. ok) then
       nfail = nfail + 1
       write (*, '(2a)') 'FAIL: ', what
    end if
  end subroutine check

  subroutine check_stat(stat, msg, what)
    integer, intent(in) :: stat
    character(len=*), intent(in) :: msg, what
    call check(stat == MCD_OK, what // ' (stat ' // itoa(stat) // ': ' // trim(msg) // ')')
  end subroutine check_stat

  function itoa(i) result(s)
    integer, intent(in) :: i
    character(len=:), allocatable :: s
    character(len=16) :: b
    write (b, '(i0)') i
    s = trim(b)
  end function itoa

  ! Version string and number agree; status texts reach Fortran intact.
  subroutine check_version_and_strings()
    character(len=32) :: expect
    integer :: v
    v = mcd_version_number()
    write (expect, '(i0, ".", i0, ".", i0)') v / 10000, mod(v / 100, 100), mod(v, 100)
    call check(mcd_version_string() == trim(expect), 'version string ' // &
         mcd_version_string() // ' matches number ' // trim(expect))
    call check(len(mcd_status_string(MCD_OK)) > 0, 'status text of MCD_OK not empty')
    call check(mcd_status_string(MCD_ENOTFOUND) /= mcd_status_string(MCD_OK), &
         'status texts differ')
    call check(mcd_method_name(MCD_METHOD_FSG) == 'fsg', 'method name fsg')
    call check(mcd_param_unit(MCD_PARAM_MOLAR_MASS) == 'kg/mol', 'param unit kg/mol')
    call check(mcd_element_symbol(6) == 'C', 'element 6 is C')
  end subroutine check_version_and_strings

  ! Formula helpers through Fortran strings.
  subroutine check_formulas()
    real(c_double) :: M, V
    integer :: stat, Z(4), n
    integer(c_long) :: cnt(4)
    character(len=256) :: msg
    ! CO2: 12.011 + 2 x 15.999 = 44.009 g/mol (IUPAC conventional atomic
    ! weights, common practice); 1e-9 relative covers the summation.
    M = GUARD
    call mcd_formula_molar_mass('CO2', M, stat, msg)
    call check_stat(stat, msg, 'molar mass of CO2')
    call check(abs(M - 44.009e-3_c_double) <= 1e-9_c_double * 44.009e-3_c_double, &
         'molar mass of CO2 = 44.009 g/mol')
    ! trailing blanks of a Fortran string are not part of the formula
    call mcd_formula_molar_mass('(CH3)2CO     ', M, stat, msg)
    call check_stat(stat, msg, 'formula with trailing blanks')
    call mcd_formula_elements('CH3COOH', 4, Z, cnt, n, stat, msg)
    call check_stat(stat, msg, 'elements of CH3COOH')
    call check(n == 3, 'CH3COOH has 3 elements')
    call check(all(Z(1:3) == [6, 1, 8]) .and. all(cnt(1:3) == [2_c_long, 4_c_long, &
         2_c_long]), 'CH3COOH = C2 H4 O2 in order of appearance')
    M = GUARD
    call mcd_formula_molar_mass('CO2x', M, stat, msg)
    call check(stat == MCD_EPARSE, 'malformed formula is MCD_EPARSE')
    call check(abs(M - GUARD) < tiny(M), 'molar mass untouched on error')
    call check(len_trim(msg) > len(mcd_status_string(MCD_EPARSE)), &
         'parse error carries the position detail: ' // trim(msg))
    ! CO2 diffusion volume 26.9 (Fuller, Schettler and Giddings 1966, as
    ! tabulated in Poling, Prausnitz and O'Connell 2001, Table 11-1; from
    ! memory)
    call mcd_fsg_molecule_volume('CO2', V, stat, msg)
    call check_stat(stat, msg, 'tabulated volume of CO2')
    call check(abs(V - 26.9_c_double) <= 1e-9_c_double, 'CO2 diffusion volume 26.9')
  end subroutine check_formulas

  ! Fuller-Schettler-Giddings estimate for CO2-N2 at 298.2 K, 1 atm against
  ! the experimental 0.165 cm^2/s: Bird, Stewart and Lightfoot, Transport
  ! Phenomena, 2nd ed. (2002), Table 17.1-1. The method's estimate must lie
  ! within its own published typical error (returned by the library, a few
  ! per cent for FSG).
  subroutine check_fsg_against_experiment()
    type(mcd_db_t) :: db
    integer :: stat, ico2, in2, warn
    real(c_double) :: D, err, rel
    character(len=256) :: msg
    real(c_double), parameter :: D_EXP = 0.165e-4_c_double ! m^2/s, BSL 2002 T 17.1-1

    call mcd_db_new_builtin(db, stat, msg)
    call check_stat(stat, msg, 'builtin database')
    call check(mcd_db_count(db) >= 40, 'builtin database holds >= 40 species')
    ico2 = 0
    in2 = 0
    call mcd_db_find(db, 'carbon-dioxide', ico2, stat, msg)
    call check_stat(stat, msg, 'find carbon-dioxide')
    call mcd_db_find(db, 'N2', in2, stat, msg)
    call check_stat(stat, msg, 'find N2 by formula')
    call check(mcd_db_name(db, in2) == 'nitrogen', '1-based index names nitrogen')
    D = GUARD
    err = -1
    warn = -1
    call mcd_binary_gas(db, ico2, in2, MCD_METHOD_FSG, 298.2_c_double, MCD_ATM, D, &
         stat, msg, rel_err=err, warn=warn)
    call check_stat(stat, msg, 'FSG CO2-N2')
    rel = abs(D - D_EXP) / D_EXP
    write (*, '(a, es12.5, a, f6.4, a, f6.4)') 'FSG CO2-N2 298.2 K: D = ', D, &
         ' m^2/s, rel. deviation from experiment ', rel, ', typical error ', err
    call check(err > 0 .and. err < 0.2_c_double, 'typical error in (0, 0.2)')
    call check(rel <= err, 'FSG CO2-N2 within the method''s typical error')
    call check(warn == 0, 'no warnings for CO2-N2 at ambient state')
    call mcd_free(db)
    call check(.not. mcd_associated(db), 'database freed')
  end subroutine check_fsg_against_experiment

  ! Binary limit of Maxwell-Stefan: J1 = -c D12 grad x1 exactly (Fick's law
  ! for a binary ideal gas; Bird, Stewart and Lightfoot 2002, eq. 17.7-1 and
  ! 24.2, from memory), for several directions and compositions.
  subroutine check_binary_limit()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(2, 2), x(2), grad(3, 2), J(3, 2), c, ref, worst
    integer :: stat, k, d
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'nitrogen', 'carbon-dioxide'], &
         stat, msg)
    call check_stat(stat, msg, 'binary mixture')
    call check(mcd_mixture_name(mix, 2) == 'carbon-dioxide', 'mixture name 2')
    call mcd_mixture_binaries(mix, 310.0_c_double, 2.0e5_c_double, Dij, stat, msg)
    call check_stat(stat, msg, 'binaries of binary mixture')
    call mcd_ideal_gas_c(310.0_c_double, 2.0e5_c_double, c, stat, msg)
    call check_stat(stat, msg, 'ideal gas c')
    call mcd_workspace_alloc(ws, 2, stat, msg)
    call check_stat(stat, msg, 'workspace')
    worst = 0
    do k = 1, 9
       x = [0.1_c_double * k, 1 - 0.1_c_double * k]
       grad(:, 1) = [17.0_c_double, -3.5_c_double * k, 0.25_c_double]
       grad(:, 2) = -grad(:, 1)
       J = GUARD
       call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 2, 3, Dij, c, &
            MCD_BASIS_MOLE, x, grad, MCD_BASIS_MOLE, J, stat, msg)
       call check_stat(stat, msg, 'binary flux')
       do d = 1, 3
          ref = -c * Dij(1, 2) * grad(d, 1)
          ! 1e-12 relative: the 2x2 solve and projection add a few ulp.
          worst = max(worst, abs(J(d, 1) - ref) / abs(ref))
       end do
    end do
    write (*, '(a, es10.3)') 'binary limit: largest relative deviation ', worst
    call check(worst <= 1e-12_c_double, 'binary limit J1 = -c D12 grad x1')
  end subroutine check_binary_limit

  ! Ternary ideal gas H2 / N2 / CO2 (an invented state): fluxes sum to zero
  ! in both bases, and the Fick matrix in the documented transposed layout
  ! reproduces the Maxwell-Stefan fluxes through a plain matmul.
  subroutine check_ternary()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(3, 3), M(3), x(3), w(3), grad(2, 3), J(2, 3), jm(2, 3)
    real(c_double) :: JF(2, 3), Dfick(2, 2), re(2), im(2), c, scale, worst
    integer :: stat, dep, d, others(2), k
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'hydrogen', 'nitrogen', &
         'carbon-dioxide'], stat, msg)
    call check_stat(stat, msg, 'ternary mixture')
    call check(mcd_mixture_count(mix) == 3, 'mixture count 3')
    call mcd_mixture_binaries(mix, 300.0_c_double, MCD_ATM, Dij, stat, msg)
    call check_stat(stat, msg, 'ternary binaries')
    call check(all(abs(Dij - transpose(Dij)) <= 1e-15_c_double * maxval(Dij)), &
         'binary matrix symmetric')
    call mcd_mixture_molar_masses(mix, M, stat, msg)
    call check_stat(stat, msg, 'molar masses')
    call mcd_ideal_gas_c(300.0_c_double, MCD_ATM, c, stat, msg)
    call mcd_workspace_alloc(ws, 3, stat, msg)
    call check(mcd_workspace_species(ws) == 3, 'workspace capacity 3')

    x = [0.2_c_double, 0.5_c_double, 0.3_c_double]
    grad(:, 1) = [12.0_c_double, -4.0_c_double]
    grad(:, 2) = [-20.0_c_double, 1.0_c_double]
    grad(:, 3) = -(grad(:, 1) + grad(:, 2))
    J = GUARD
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 3, 2, Dij, c, MCD_BASIS_MOLE, &
         x, grad, MCD_BASIS_MOLE, J, stat, msg, M=M)
    call check_stat(stat, msg, 'ternary molar fluxes')
    scale = maxval(abs(J))
    ! zero-sum to round-off: three terms of size `scale`, 1e-13 relative.
    do d = 1, 2
       call check(abs(sum(J(d, :))) <= 1e-13_c_double * scale, &
            'ternary molar fluxes sum to zero, direction ' // itoa(d))
    end do
    ! H2, the light species, diffuses down its gradient
    call check(J(1, 1) < 0 .and. J(2, 1) > 0, 'H2 diffuses down its own gradient')

    ! mass basis, and agreement with the frame conversion of the molar fluxes
    call mcd_comp_x_to_w(3, M, x, w, stat, msg)
    call check_stat(stat, msg, 'x to w')
    jm = GUARD
    call mcd_flux_convert(3, 2, M, x, MCD_BASIS_MOLE, J, MCD_BASIS_MASS, jm, stat, msg)
    call check_stat(stat, msg, 'flux convert')
    do d = 1, 2
       call check(abs(sum(jm(d, :))) <= 1e-13_c_double * maxval(abs(jm)), &
            'mass fluxes sum to zero, direction ' // itoa(d))
    end do

    ! Fick matrix: D holds transpose([D]); J(:, others) = -c matmul(grad(:, others), D)
    dep = -1
    call mcd_fick_matrix(ws, 3, Dij, MCD_BASIS_MOLE, x, MCD_BASIS_MOLE, Dfick, stat, &
         msg, dependent_used=dep)
    call check_stat(stat, msg, 'Fick matrix')
    call check(dep == 2, 'dependent species is the most abundant (nitrogen, 2)')
    k = 0
    do d = 1, 3
       if (d /= dep) then
          k = k + 1
          others(k) = d
       end if
    end do
    JF = 0
    JF(:, others) = -c * matmul(grad(:, others), Dfick)
    JF(:, dep) = -(JF(:, others(1)) + JF(:, others(2)))
    ! 1e-10 relative: [D] = [B]^-1 comes from a separate LU solve.
    worst = maxval(abs(JF - J)) / scale
    write (*, '(a, es10.3)') 'Fick matmul vs Maxwell-Stefan: largest rel. deviation ', worst
    call check(worst <= 1e-10_c_double, 'Fick matrix layout reproduces MS fluxes')
    ! the same through the C helper, D passed unchanged
    JF = GUARD
    call mcd_fick_fluxes(3, 2, Dfick, dep, c, grad, JF, stat, msg)
    call check_stat(stat, msg, 'Fick fluxes')
    call check(maxval(abs(JF - J)) <= 1e-10_c_double * scale, 'mcd_fick_fluxes agrees')
    ! eigenvalues of a ternary ideal-gas Fick matrix: real and positive
    ! (Taylor and Krishna 1993, sec. 5.5, from memory), and their sum is
    ! the trace.
    call mcd_fick_eigenvalues(ws, 2, Dfick, re, im, stat, msg)
    call check_stat(stat, msg, 'Fick eigenvalues')
    call check(all(re > 0) .and. all(abs(im) <= 1e-12_c_double * maxval(re)), &
         'eigenvalues real and positive')
    call check(abs(sum(re) - (Dfick(1, 1) + Dfick(2, 2))) <= 1e-12_c_double * sum(re), &
         'eigenvalues sum to the trace')
  end subroutine check_ternary

  ! Stefan tube, B stagnant: N_A = (c D/L) ln((1 - xA_L)/(1 - xA_0)) (Bird,
  ! Stewart and Lightfoot 2002, eq. 18.2-14, from memory).
  subroutine check_film_stagnant()
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(2, 2), x0(2), xL(2), N(2), c, L, ref, res
    integer :: stat, it
    character(len=256) :: msg

    Dij = reshape([0.0_c_double, 1.6e-5_c_double, 1.6e-5_c_double, 0.0_c_double], [2, 2])
    c = 40.0_c_double
    L = 0.1_c_double
    x0 = [0.4_c_double, 0.6_c_double]
    xL = [0.05_c_double, 0.95_c_double]
    call mcd_workspace_alloc(ws, 2, stat, msg)
    N = GUARD
    it = -1
    call mcd_film_solve(ws, 2, Dij, c, L, x0, xL, MCD_BOOT_STAGNANT, N, stat, msg, &
         species=2, iterations=it, residual=res)
    call check_stat(stat, msg, 'film solve')
    ref = c * Dij(1, 2) / L * log((1 - xL(1)) / (1 - x0(1)))
    ! 1e-9 relative: the iteration stops at a 1e-12 relative change.
    call check(abs(N(1) - ref) <= 1e-9_c_double * abs(ref), 'Stefan tube closed form')
    call check(abs(N(2)) <= 1e-12_c_double * abs(ref), 'stagnant species does not move')
    call check(it >= 0, 'iterations reported')
  end subroutine check_film_stagnant

  ! Batched calls in the documented Fortran layouts reproduce the
  ! single-state fluxes cell by cell (an invented set of 7 states of the
  ! H2 / N2 / CO2 mixture, 2 directions).
  subroutine check_batch()
    integer, parameter :: K = 7, N = 3, ND = 2
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    type(mcd_workspace_t) :: ws
    real(c_double) :: T(K), P(K), cc(K), comp(K, N), grad(K, ND, N), flux(K, ND, N)
    real(c_double) :: Dk(K, N, N), fdij(K, ND, N)
    real(c_double) :: compa(N, K), grada(ND, N, K), fluxa(ND, N, K)
    real(c_double) :: D1(N, N), g1(ND, N), J1(ND, N), scale, worst, worst_a, worst_d
    integer :: stat, kk, i
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'hydrogen', 'nitrogen', &
         'carbon-dioxide'], stat, msg)
    call mcd_workspace_alloc(ws, N, stat, msg)
    do kk = 1, K
       T(kk) = 280.0_c_double + 25.0_c_double * kk
       P(kk) = MCD_ATM * (0.5_c_double + 0.3_c_double * kk)
       comp(kk, :) = [0.1_c_double + 0.05_c_double * kk, 0.6_c_double - 0.04_c_double * kk, 0.0_c_double]
       comp(kk, 3) = 1 - comp(kk, 1) - comp(kk, 2)
       grad(kk, :, 1) = [3.0_c_double * kk, -2.0_c_double]
       grad(kk, :, 2) = [-5.0_c_double, 1.5_c_double * kk]
       grad(kk, :, 3) = -(grad(kk, :, 1) + grad(kk, :, 2))
       compa(:, kk) = comp(kk, :)
       do i = 1, N
          grada(:, i, kk) = grad(kk, :, i)
       end do
    end do
    flux = GUARD
    call mcd_flux_batch(ws, mix, MCD_MODEL_MAXWELL_STEFAN, K, ND, T, P, MCD_BASIS_MOLE, &
         comp, grad, MCD_BASIS_MOLE, flux, stat, msg)
    call check_stat(stat, msg, 'batched fluxes (SoA)')
    fluxa = GUARD
    call mcd_flux_batch_aos(ws, mix, MCD_MODEL_MAXWELL_STEFAN, K, ND, T, P, &
         MCD_BASIS_MOLE, compa, grada, MCD_BASIS_MOLE, fluxa, stat, msg)
    call check_stat(stat, msg, 'batched fluxes (per-cell layout)')
    worst = 0
    worst_a = 0
    worst_d = 0
    do kk = 1, K
       call mcd_mixture_binaries(mix, T(kk), P(kk), D1, stat, msg)
       call mcd_ideal_gas_c(T(kk), P(kk), cc(kk), stat, msg)
       Dk(kk, :, :) = D1
       g1 = grad(kk, :, :)
       call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, N, ND, D1, cc(kk), &
            MCD_BASIS_MOLE, comp(kk, :), g1, MCD_BASIS_MOLE, J1, stat, msg)
       call check_stat(stat, msg, 'single-state flux of cell ' // itoa(kk))
       scale = maxval(abs(J1))
       worst = max(worst, maxval(abs(flux(kk, :, :) - J1)) / scale)
       worst_a = max(worst_a, maxval(abs(fluxa(:, :, kk) - J1)) / scale)
    end do
    fdij = GUARD
    call mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, N, K, ND, Dk, cc, &
         MCD_BASIS_MOLE, comp, grad, MCD_BASIS_MOLE, fdij, stat, msg)
    call check_stat(stat, msg, 'batched fluxes with caller Dij')
    do kk = 1, K
       worst_d = max(worst_d, maxval(abs(fdij(kk, :, :) - flux(kk, :, :))) / &
            maxval(abs(flux(kk, :, :))))
    end do
    write (*, '(a, 3es10.3)') 'batch vs single (SoA, AoS, Dij): largest rel. deviation ', &
         worst, worst_a, worst_d
    ! 1e-10 relative: batched kernels may order the arithmetic differently
    ! (specialised small-N solves, T^1.75/P scaling per cell).
    call check(worst <= 1e-10_c_double, 'SoA batch equals single-state fluxes')
    call check(worst_a <= 1e-10_c_double, 'per-cell batch equals single-state fluxes')
    call check(worst_d <= 1e-10_c_double, 'Dij batch equals mixture batch')
    ! a bad cell: composition summing to 0.9 -> MCD_EDOM, message names the cell
    comp(4, 3) = comp(4, 3) - 0.1_c_double
    call mcd_flux_batch(ws, mix, MCD_MODEL_MAXWELL_STEFAN, K, ND, T, P, MCD_BASIS_MOLE, &
         comp, grad, MCD_BASIS_MOLE, flux, stat, msg)
    call check(stat == MCD_EDOM, 'batch with a bad cell is MCD_EDOM')
    call check(index(msg, 'cell') > 0, 'batch error names the cell: ' // trim(msg))
  end subroutine check_batch

  ! Error paths: status codes and messages reach Fortran, outputs untouched.
  subroutine check_errors()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    type(mcd_workspace_t) :: ws, empty
    real(c_double) :: Dij(3, 3), x(3), grad(1, 3), J(1, 3), c
    integer :: stat, idx
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    idx = 77
    call mcd_db_find(db, 'unobtainium', idx, stat, msg)
    call check(stat == MCD_ENOTFOUND, 'unknown species is MCD_ENOTFOUND')
    call check(index(msg, 'unobtainium') > 0, 'message names the species: ' // trim(msg))
    call check(idx == 77, 'index untouched on error')

    call mcd_mixture_new(mix, db, [character(len=8) :: 'nitrogen', 'xenonium'], stat, msg)
    call check(stat == MCD_ENOTFOUND, 'mixture with unknown species is MCD_ENOTFOUND')
    call check(.not. mcd_associated(mix), 'failed mixture handle stays empty')
    call check(len_trim(msg) > 0, 'mixture error message: ' // trim(msg))

    Dij = 1e-5_c_double
    x = [0.3_c_double, 0.3_c_double, 0.3_c_double] ! sums to 0.9: MCD_EDOM
    grad = 1
    J = GUARD
    c = 40
    call mcd_workspace_alloc(ws, 3, stat, msg)
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 3, 1, Dij, c, MCD_BASIS_MOLE, &
         x, grad, MCD_BASIS_MOLE, J, stat, msg)
    call check(stat == MCD_EDOM, 'composition summing to 0.9 is MCD_EDOM')
    call check(all(abs(J - GUARD) < tiny(c)), 'fluxes untouched on error')
    call check(len(mcd_workspace_last_error(ws)) > 0, 'workspace last error set')
    call check(index(msg, mcd_workspace_last_error(ws)) > 0, &
         'errmsg carries the workspace detail: ' // trim(msg))

    ! a workspace too small is EBADLEN
    call mcd_workspace_alloc(ws, 2, stat, msg)
    x = [0.3_c_double, 0.3_c_double, 0.4_c_double]
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 3, 1, Dij, c, MCD_BASIS_MOLE, &
         x, grad, MCD_BASIS_MOLE, J, stat)
    call check(stat == MCD_EBADLEN, 'workspace too small is MCD_EBADLEN')
    ! an empty handle is a NULL pointer for C: MCD_EINVAL, no crash
    call mcd_flux_compute(empty, MCD_MODEL_MAXWELL_STEFAN, 3, 1, Dij, c, &
         MCD_BASIS_MOLE, x, grad, MCD_BASIS_MOLE, J, stat, msg)
    call check(stat == MCD_EINVAL, 'empty workspace handle is MCD_EINVAL')
    call check(all(abs(J - GUARD) < tiny(c)), 'fluxes untouched on error (2)')
    ! 0 is not a valid 1-based dependent index (must not mean "auto")
    call mcd_fick_matrix(ws, 2, Dij(1:2, 1:2), MCD_BASIS_MOLE, [0.5_c_double, &
         0.5_c_double], MCD_BASIS_MOLE, J, stat, msg, dependent=0)
    call check(stat /= MCD_OK, 'dependent index 0 rejected')
  end subroutine check_errors

  ! Handles: assignment never shares an object, free is idempotent.
  subroutine check_handles()
    type(mcd_db_t) :: a, b
    integer :: stat
    call mcd_db_new_builtin(a, stat)
    call mcd_db_new(b, stat)
    call check(mcd_associated(b), 'new empty database')
    b = a
    call check(.not. mcd_associated(b), 'assignment leaves the target empty')
    call check(mcd_associated(a), 'source kept')
    call check(mcd_db_count(a) >= 40, 'source still holds the species')
    call mcd_free(a)
    call mcd_free(a)
    call check(.not. mcd_associated(a), 'double free is a no-op')
    call check(mcd_db_count(a) == 0, 'count of empty handle is 0')
  end subroutine check_handles

end program test_mcdiff
