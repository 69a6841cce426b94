! test_mcdiff.f90 - checks of the Fortran module mcdiff against the C library
! and against published values. Exit status 0 when every check passes, 1
! otherwise (meson test suite 'fortran').
program test_mcdiff
  use, intrinsic :: iso_c_binding, only: c_double, c_int, c_long, c_size_t, c_null_ptr, c_loc
  use, intrinsic :: ieee_arithmetic, only: ieee_value, ieee_quiet_nan
  use mcdiff
  implicit none

  integer :: nfail = 0, nchecks = 0
  real(c_double), parameter :: GUARD = 12345.678_c_double

  call check_version_and_strings()
  call check_formulas()
  call check_fsg_against_experiment()
  call check_binary_limit()
  call check_thermal_binary()
  call check_jacobians()
  call check_ternary()
  call check_film_stagnant()
  call check_batch()
  call check_raw_and_liquid_binaries()
  call check_frames()
  call check_temperature_fit()
  call check_recommended_mixture()
  call check_bulbs()
  call check_porous()
  call check_thermal_kt()
  call check_errors()
  call check_handles()
  call check_liquid()

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
    call mcd_formula_molecule_volume('CO2', V, stat, msg)
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
    call check(mcd_db_species_count(db) >= 40, 'builtin database holds >= 40 species')
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
    call mcd_db_binary_gas(db, ico2, in2, MCD_METHOD_FSG, 298.2_c_double, MCD_ATM, D, &
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
    call mcd_comp_ideal_gas_c(310.0_c_double, 2.0e5_c_double, c, stat, msg)
    call check_stat(stat, msg, 'ideal gas c')
    call mcd_workspace_new(ws, 2, stat, msg)
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

  ! Thermal diffusion, two species: k_T = rho D_1^T / (c^2 M_1 M_2 D_12)
  ! and J_1 = -c D_12 (grad x_1 + k_T grad ln T) (Bird, Stewart and
  ! Lightfoot 2002, sec. 24.2; from memory).
  subroutine check_thermal_binary()
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(2, 2), M(2), x(2), DT(2), kT(2), grad(1, 2), J(1, 2)
    real(c_double) :: c, rho, want, ref, glnT(1), dJ(2, 1, 2)
    integer :: stat
    character(len=256) :: msg
    Dij = reshape([0.0_c_double, 7.3e-5_c_double, 7.3e-5_c_double, 0.0_c_double], [2, 2])
    M = [0.004_c_double, 0.040_c_double]
    x = [0.4_c_double, 0.6_c_double]
    DT = [3e-6_c_double, -3e-6_c_double]
    c = 41.6_c_double
    call mcd_workspace_new(ws, 2, stat, msg)
    call check_stat(stat, msg, 'workspace')
    kT = GUARD
    call mcd_thermal_ratios(ws, 2, Dij, c, MCD_BASIS_MOLE, x, M, DT, kT, stat, msg)
    call check_stat(stat, msg, 'thermal ratios')
    rho = c * (x(1) * M(1) + x(2) * M(2))
    want = rho * DT(1) / (c * c * M(1) * M(2) * Dij(1, 2))
    call check(abs(kT(1) - want) <= 1e-13_c_double * want, 'k_T closed form')
    grad(1, :) = [5.0_c_double, -5.0_c_double]
    glnT = [20.0_c_double]
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 2, 1, Dij, c, &
         MCD_BASIS_MOLE, x, grad, MCD_BASIS_MOLE, J, stat, msg, kT=kT, grad_lnT=glnT)
    call check_stat(stat, msg, 'thermal flux')
    ref = -c * Dij(1, 2) * (grad(1, 1) + kT(1) * glnT(1))
    call check(abs(J(1, 1) - ref) <= 1e-13_c_double * abs(ref), &
         'thermal binary law J1 = -c D12 (grad x1 + kT grad ln T)')
    ! without thermal or pressure terms J_1 = -c D12 grad x_1 whatever x:
    ! its derivatives vanish
    call mcd_flux_jacobian_comp(ws, 2, 1, Dij, c, x, grad, dJ, stat, msg)
    call check_stat(stat, msg, 'jacobian')
    call check(maxval(abs(dJ)) <= 1e-12_c_double * abs(ref), &
         'jacobian of a binary without pressure diffusion is zero')
  end subroutine check_thermal_binary

  ! Jacobians, two species (Bird, Stewart and Lightfoot 2002, sec. 24.2;
  ! from memory): the mass flux j_1 = -c Mbar D12 grad w_1 with
  ! 1/Mbar = sum w/M, so along e_1 - w dj_1 = c D12 grad w_1 Mbar^2
  ! (1/M_1 - 1/Mbar); with D ~ T^1.75 / P and c = P/(R T) the flux goes as
  ! T^0.75 (dJ/dT = 0.75 J/T, dJ/dP = 0); the batched call equals the
  ! single-state one (the same code per cell).
  subroutine check_jacobians()
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(2, 2), M(2), w(2), grad(1, 2), dF(2, 1, 2), J(1, 2)
    real(c_double) :: dT(2, 2), dP(2, 2), oT(1, 2), oP(1, 2), c, Mb, want, T, P
    real(c_double) :: Db(1, 2, 2), cb(1), wb(1, 2), gb(1, 1, 2), jac(1, 2, 1, 2)
    integer :: stat, mo
    character(len=256) :: msg
    Dij = reshape([0.0_c_double, 6e-5_c_double, 6e-5_c_double, 0.0_c_double], [2, 2])
    M = [0.002_c_double, 0.044_c_double]
    w = [0.35_c_double, 0.65_c_double]
    grad(1, :) = [8.0_c_double, -8.0_c_double]
    c = 40.0_c_double
    call mcd_workspace_new(ws, 2, stat, msg)
    call check_stat(stat, msg, 'workspace')
    do mo = 0, 1
      call mcd_flux_jacobian(ws, mo, 2, 1, Dij, c, MCD_BASIS_MASS, w, grad, &
           MCD_BASIS_MASS, dF, stat, msg, M=M)
      call check_stat(stat, msg, 'flux_jacobian')
      Mb = 1.0_c_double / (w(1) / M(1) + w(2) / M(2))
      want = c * 6e-5_c_double * grad(1, 1) * Mb**2 * (1.0_c_double / M(1) - 1.0_c_double / Mb)
      call check(abs(dF(1, 1, 1) - want) <= 1e-12_c_double * abs(want), &
           'mass-basis binary Jacobian closed form')
    end do
    T = 600.0_c_double
    P = 2e5_c_double
    dT = 1.75_c_double * Dij / T
    dP = -Dij / P
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 2, 1, Dij, c, &
         MCD_BASIS_MOLE, w, grad, MCD_BASIS_MOLE, J, stat, msg)
    call check_stat(stat, msg, 'flux')
    call mcd_flux_jacobian_tp(ws, MCD_MODEL_MAXWELL_STEFAN, 2, 1, Dij, c, &
         MCD_BASIS_MOLE, w, grad, MCD_BASIS_MOLE, T, P, dT, dP, oT, oP, stat, msg)
    call check_stat(stat, msg, 'flux_jacobian_tp')
    call check(abs(oT(1, 1) - 0.75_c_double * J(1, 1) / T) <= 1e-12_c_double * abs(J(1, 1)) / T, &
         'dJ/dT = 0.75 J / T for D ~ T^1.75 / P')
    call check(abs(oP(1, 1)) <= 1e-12_c_double * abs(J(1, 1)) / P, 'dJ/dP = 0')
    Db(1, :, :) = Dij
    cb = c
    wb(1, :) = w
    gb(1, 1, :) = grad(1, :)
    call mcd_flux_batch_jacobian(ws, MCD_MODEL_MIXTURE_AVERAGED, 2, 1, 1, Db, cb, &
         MCD_BASIS_MASS, wb, gb, MCD_BASIS_MASS, jac, stat, msg, M=M)
    call check_stat(stat, msg, 'flux_batch_jacobian')
    call check(maxval(abs(jac(1, :, :, :) - dF)) <= 1e-13_c_double * maxval(abs(dF)), &
         'batched Jacobian equals the single-state one')
    call mcd_free(ws)
  end subroutine check_jacobians

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
    call check(mcd_mixture_species_count(mix) == 3, 'mixture count 3')
    call mcd_mixture_binaries(mix, 300.0_c_double, MCD_ATM, Dij, stat, msg)
    call check_stat(stat, msg, 'ternary binaries')
    call check(all(abs(Dij - transpose(Dij)) <= 1e-15_c_double * maxval(Dij)), &
         'binary matrix symmetric')
    call mcd_mixture_molar_masses(mix, M, stat, msg)
    call check_stat(stat, msg, 'molar masses')
    call mcd_comp_ideal_gas_c(300.0_c_double, MCD_ATM, c, stat, msg)
    call mcd_workspace_new(ws, 3, stat, msg)
    call check(mcd_workspace_capacity(ws) == 3, 'workspace capacity 3')

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
    call mcd_workspace_new(ws, 2, stat, msg)
    N = GUARD
    it = -1
    call mcd_film_solve(ws, 2, Dij, c, L, x0, xL, MCD_FILM_BOOT_STAGNANT, N, stat, msg, &
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
    real(c_double) :: Dk(K, N, N), fdij(K, ND, N), Dup(K, N, N), fup(K, ND, N)
    real(c_double) :: compa(N, K), grada(ND, N, K), fluxa(ND, N, K)
    real(c_double) :: D1(N, N), g1(ND, N), J1(ND, N), scale, worst, worst_a, worst_d
    ! the same cells in one tile of 8 (mcd_layout: cell k at (k, row, tile))
    real(c_double), target :: ct(8, N, 1), gt(8, ND, N, 1)
    real(c_double) :: Dt(8, N, N, 1), ft(8, ND, N, 1)
    type(mcd_cells_t) :: cells
    integer :: stat, kk, i
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'hydrogen', 'nitrogen', &
         'carbon-dioxide'], stat, msg)
    call mcd_workspace_new(ws, N, stat, msg)
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
       call mcd_comp_ideal_gas_c(T(kk), P(kk), cc(kk), stat, msg)
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
    ! the upper-triangle read (mcd_workspace_set_dij_read): C's entry
    ! (i, j) of a cell is Dk(k, j+1, i+1) here, so C's lower triangle and
    ! diagonal (j <= i) are Dk(k, a, b) with a <= b; NaN there, the same bits
    call mcd_workspace_set_dij_read(ws, 7, stat, msg)
    call check(stat == MCD_EINVAL, 'set_dij_read refuses mode 7')
    call mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_UPPER, stat, msg)
    call check_stat(stat, msg, 'set_dij_read upper')
    Dup = Dk
    do i = 1, N
       do kk = i, N
          Dup(:, i, kk) = ieee_value(1.0_c_double, ieee_quiet_nan)
       end do
    end do
    fup = GUARD
    call mcd_flux_batch_dij(ws, MCD_MODEL_MAXWELL_STEFAN, N, K, ND, Dup, cc, &
         MCD_BASIS_MOLE, comp, grad, MCD_BASIS_MOLE, fup, stat, msg)
    call check_stat(stat, msg, 'batched fluxes, upper triangle of Dij only')
    call check(maxval(abs(fup - fdij)) <= 0.0_c_double, &
         'upper-triangle read gives the same values')
    call mcd_workspace_set_dij_read(ws, MCD_DIJ_READ_BOTH, stat, msg)
    call check_stat(stat, msg, 'set_dij_read both')
    ! the raw interface in tiles of 8: the same values as the SoA call
    ! (bit-for-bit in C, test_tiled.c); padding cell 8 is not written
    ct = 0
    gt = 0
    Dt = 0
    ft = GUARD
    do kk = 1, K
       ct(kk, :, 1) = comp(kk, :)
       gt(kk, :, :, 1) = grad(kk, :, :)
       Dt(kk, :, :, 1) = Dk(kk, :, :)
    end do
    cells%n_cells = K
    cells%n_dim = ND
    cells%comp_basis = MCD_BASIS_MOLE
    cells%comp = c_loc(ct)
    cells%grad = c_loc(gt)
    cells%layout = MCD_LAYOUT_TILED8
    stat = c_mcd_flux_batch_dij(mcd_handle_ptr(ws), int(MCD_MODEL_MAXWELL_STEFAN, c_int), &
         int(N, c_size_t), c_null_ptr, Dt, cc, cells, int(MCD_BASIS_MOLE, c_int), ft)
    call check(stat == MCD_OK, 'tiled batch (raw interface) succeeds')
    do kk = 1, K
       call check(all(abs(ft(kk, :, :, 1) - fdij(kk, :, :)) <= &
            1e-15_c_double * maxval(abs(fdij(kk, :, :)))), &
            'tiled batch equals SoA batch, cell ' // itoa(kk))
    end do
    call check(all(abs(ft(8, :, :, 1) - GUARD) < tiny(GUARD)), 'tiled batch leaves padding alone')
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

  ! Wilke-Lee and Wilke-Chang: the raw wrappers against the closed forms
  ! computed here, and the database wrappers (1-based indices, optional
  ! outputs) against the raw ones fed with the database's parameters.
  subroutine check_raw_and_liquid_binaries()
    ! exact SI values of the Boltzmann and Avogadro constants (2019 SI)
    real(c_double), parameter :: KB = 1.380649e-23_c_double, NA = 6.02214076e23_c_double
    real(c_double), parameter :: PI = 3.14159265358979323846_c_double
    type(mcd_db_t) :: db
    integer :: stat, in2, ico2, iben, iwat, warn
    real(c_double) :: T, P, MA, MB, sA, sB, eA, eB, Dwl, Dce, Dgas, Mab, ratio, ref
    real(c_double) :: mu, Mw, phi, Vb, Dwc, Dliq, err, xv(MCD_EXPLAIN_COUNT)
    character(len=256) :: msg

    call mcd_db_new_builtin(db, stat, msg)
    call mcd_db_find(db, 'nitrogen', in2, stat, msg)
    call mcd_db_find(db, 'carbon-dioxide', ico2, stat, msg)
    call check_stat(stat, msg, 'find N2 and CO2')
    T = 350.0_c_double
    P = 1.5_c_double * MCD_ATM
    call mcd_db_param(db, in2, MCD_PARAM_MOLAR_MASS, MA, stat, msg)
    call mcd_db_param(db, ico2, MCD_PARAM_MOLAR_MASS, MB, stat, msg)
    call mcd_db_param(db, in2, MCD_PARAM_LJ_SIGMA, sA, stat, msg)
    call mcd_db_param(db, ico2, MCD_PARAM_LJ_SIGMA, sB, stat, msg)
    call mcd_db_param(db, in2, MCD_PARAM_LJ_EPS_K, eA, stat, msg)
    call mcd_db_param(db, ico2, MCD_PARAM_LJ_EPS_K, eB, stat, msg)
    call check_stat(stat, msg, 'Lennard-Jones parameters of N2 and CO2')
    Dwl = GUARD
    call mcd_binary_wilke_lee(T, P, MA, MB, sA, sB, eA, eB, Dwl, stat, msg)
    call check_stat(stat, msg, 'Wilke-Lee raw')
    call mcd_binary_chapman_enskog(T, P, MA, MB, sA, sB, eA, eB, Dce, stat, msg)
    call check_stat(stat, msg, 'Chapman-Enskog raw')
    ! Same collision integral in both: their ratio is Wilke-Lee's factor
    ! (3.03 - 0.98/M_AB^0.5) 1e-3 [cm^2/s, bar, A, g/mol] over the first
    ! Chapman-Enskog coefficient (3/16) sqrt(4 pi k^3 N_A / M_AB) / pi (SI).
    Mab = 2 / (1 / MA + 1 / MB)
    ratio = (3.03_c_double - 0.98_c_double / sqrt(1000 * Mab)) * 1e-22_c_double &
         / sqrt(1000 * Mab) / (3.0_c_double / 16 * sqrt(4 * PI * KB**3 * NA / Mab) / PI)
    call check(abs(Dwl / Dce - ratio) <= 1e-12_c_double * ratio, &
         'Wilke-Lee / Chapman-Enskog = ratio of their coefficients')
    Dgas = GUARD
    call mcd_db_binary_gas(db, in2, ico2, MCD_METHOD_WILKE_LEE, T, P, Dgas, stat, msg)
    call check_stat(stat, msg, 'Wilke-Lee N2-CO2 from the database')
    call check(abs(Dgas - Dwl) <= 1e-13_c_double * Dwl, &
         'mcd_db_binary_gas(WILKE_LEE) equals mcd_binary_wilke_lee with the database values')

    ! benzene (solute) infinitely dilute in water at 298.15 K, water
    ! viscosity 0.89 mPa s
    call mcd_db_find(db, 'benzene', iben, stat, msg)
    call mcd_db_find(db, 'water', iwat, stat, msg)
    call check_stat(stat, msg, 'find benzene and water')
    T = 298.15_c_double
    mu = 0.89e-3_c_double
    call mcd_db_param(db, iwat, MCD_PARAM_MOLAR_MASS, Mw, stat, msg)
    call mcd_db_param(db, iwat, MCD_PARAM_ASSOC, phi, stat, msg)
    call mcd_db_param(db, iben, MCD_PARAM_VB, Vb, stat, msg)
    call check_stat(stat, msg, 'Wilke-Chang parameters of benzene and water')
    Dwc = GUARD
    call mcd_binary_wilke_chang(T, mu, Mw, phi, Vb, Dwc, stat, msg)
    call check_stat(stat, msg, 'Wilke-Chang raw')
    ! D [cm^2/s] = 7.4e-8 (phi M [g/mol])^0.5 T / (mu [cP] Vb [cm^3/mol]^0.6)
    ref = 1e-4_c_double * 7.4e-8_c_double * sqrt(phi * 1000 * Mw) * T &
         / (1000 * mu * (1e6_c_double * Vb)**0.6_c_double)
    call check(abs(Dwc - ref) <= 1e-12_c_double * ref, 'Wilke-Chang closed form')
    call check(Dwc > 5e-10_c_double .and. Dwc < 5e-9_c_double, &
         'benzene in water: D of order 1e-9 m^2/s')
    Dliq = GUARD
    err = -1
    warn = -1
    call mcd_db_binary_liquid(db, iben, iwat, T, mu, Dliq, stat, msg, rel_err=err, warn=warn)
    call check_stat(stat, msg, 'Wilke-Chang benzene in water from the database')
    call check(abs(Dliq - Dwc) <= 1e-14_c_double * Dwc, &
         'mcd_db_binary_liquid equals mcd_binary_wilke_chang with the database values')
    call check(abs(err - mcd_method_typical_error(MCD_METHOD_WILKE_CHANG)) <= 0, &
         'liquid rel_err is the method''s typical error')
    call check(warn >= 0 .and. iand(warn, MCD_WARN_TEMPERATURE) == 0, &
         'no temperature warning at 298.15 K')
    ! the intermediates of the same estimate: D the same, pieces that
    ! rebuild it by the Wilke-Chang formula above
    xv = GUARD
    call mcd_db_binary_explain(db, iben, iwat, MCD_METHOD_WILKE_CHANG, T, 1e5_c_double, &
         mu, xv, stat, msg)
    call check_stat(stat, msg, 'mcd_db_binary_explain Wilke-Chang')
    ! the same double: exact equality intended (written so as not to compare reals with ==)
    call check(abs(xv(MCD_EXPLAIN_D + 1) - Dliq) <= 0.0_c_double, 'explain: D equals the estimate')
    call check(abs(xv(MCD_EXPLAIN_PHI + 1) - phi) <= 0.0_c_double .and. &
         abs(xv(MCD_EXPLAIN_VB_A + 1) - Vb) <= 0.0_c_double, &
         'explain: phi and V_A of the database (1-based slot = C slot + 1)')
    call mcd_typical_error_widened(MCD_METHOD_WILKE_CHANG, MCD_WARN_ASSOCIATING, err, &
         stat, msg)
    call check_stat(stat, msg, 'mcd_typical_error_widened')
    call check(abs(err - MCD_WIDEN_MAJOR * mcd_method_typical_error(MCD_METHOD_WILKE_CHANG)) &
         <= 0, 'widened error: one major warning doubles it')
    ! solvent and solute swapped: water's own Vb, benzene's factor (1.0)
    call mcd_db_binary_liquid(db, iwat, iben, T, mu, Dliq, stat, msg)
    call check_stat(stat, msg, 'water in benzene (optional outputs absent)')
    call mcd_db_param(db, iben, MCD_PARAM_MOLAR_MASS, Mw, stat, msg)
    call mcd_db_param(db, iben, MCD_PARAM_ASSOC, phi, stat, msg)
    call mcd_db_param(db, iwat, MCD_PARAM_VB, Vb, stat, msg)
    call mcd_binary_wilke_chang(T, mu, Mw, phi, Vb, Dwc, stat, msg)
    call check(abs(Dliq - Dwc) <= 1e-14_c_double * Dwc, 'solute and solvent by index')
  end subroutine check_raw_and_liquid_binaries

  ! Frame changes of a ternary flux set, against the defining formulas
  ! evaluated here.
  subroutine check_frames()
    real(c_double) :: x(3), M(3), Vbar(3), J(2, 3), JV(2, 3), Jk(2, 3), vmu(2)
    real(c_double) :: ref(2), c, s(2), scale
    integer :: stat, i, d
    character(len=256) :: msg
    c = 40.0_c_double
    x = [0.2_c_double, 0.5_c_double, 0.3_c_double]
    M = [2.016e-3_c_double, 28.014e-3_c_double, 44.009e-3_c_double]
    J(:, 1) = [-3.0e-3_c_double, 1.2e-3_c_double]
    J(:, 2) = [1.9e-3_c_double, -0.4e-3_c_double]
    J(:, 3) = -(J(:, 1) + J(:, 2))
    scale = maxval(abs(J))
    ! partial molar volumes with sum x Vbar = 1/c, not all equal
    Vbar(1:2) = [0.8_c_double / c, 1.1_c_double / c]
    Vbar(3) = (1 / c - x(1) * Vbar(1) - x(2) * Vbar(2)) / x(3)
    JV = GUARD
    call mcd_flux_to_volume_frame(3, 2, c, x, Vbar, J, JV, stat, msg)
    call check_stat(stat, msg, 'volume frame')
    s = matmul(J, Vbar)
    do i = 1, 3
       call check(all(abs(JV(:, i) - (J(:, i) - c * x(i) * s)) <= 1e-14_c_double * scale), &
            'J^V = J - c x sum Vbar J, species ' // itoa(i))
    end do
    ! ideal gas (Vbar = 1/c): the volume- and molar-average frames agree
    Vbar = 1 / c
    call mcd_flux_to_volume_frame(3, 2, c, x, Vbar, J, JV, stat, msg)
    call check(maxval(abs(JV - J)) <= 1e-15_c_double * scale, 'ideal gas: J^V = J')

    Jk = GUARD
    call mcd_flux_to_species_frame(3, 2, x, J, 2, Jk, stat, msg)
    call check_stat(stat, msg, 'species frame')
    call check(all(abs(Jk(:, 2)) <= 0), 'species 2 (1-based) is at rest in its own frame')
    do i = 1, 3
       ref = J(:, i) - x(i) * J(:, 2) / x(2)
       call check(all(abs(Jk(:, i) - ref) <= 1e-14_c_double * scale), &
            'J^k = J - x J_k / x_k, species ' // itoa(i))
    end do

    vmu = GUARD
    call mcd_flux_velocity_difference(3, 2, M, c, x, J, vmu, stat, msg)
    call check_stat(stat, msg, 'velocity difference')
    do d = 1, 2
       ref(d) = sum(M * J(d, :)) / (c * sum(x * M))
    end do
    call check(all(abs(vmu - ref) <= 1e-13_c_double * maxval(abs(ref))), &
         'v - u = sum M J / (c Mbar)')
  end subroutine check_frames

  ! Temperature fit of a Chapman-Enskog mixture: the range and error read
  ! back are those declared and returned by the set call.
  subroutine check_temperature_fit()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    real(c_double) :: lo, hi, e_set, e_get
    integer :: stat
    character(len=256) :: msg
    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'hydrogen', 'nitrogen', &
         'carbon-dioxide'], stat, msg, default_method=MCD_METHOD_CHAPMAN_ENSKOG)
    call check_stat(stat, msg, 'Chapman-Enskog mixture')
    lo = GUARD
    hi = GUARD
    e_get = GUARD
    call mcd_mixture_temperature_fit(mix, lo, hi, e_get, stat, msg)
    call check_stat(stat, msg, 'temperature fit before any is declared')
    call check(max(abs(lo), abs(hi), abs(e_get)) <= 0, 'no fit declared: all 0')
    e_set = -1
    call mcd_mixture_set_temperature_fit(mix, 250.0_c_double, 1200.0_c_double, stat, msg, &
         max_rel_err=e_set)
    call check_stat(stat, msg, 'declare a fit over 250..1200 K')
    call mcd_mixture_temperature_fit(mix, lo, hi, e_get, stat, msg)
    call check_stat(stat, msg, 'read the fit back')
    call check(abs(lo - 250) <= 0 .and. abs(hi - 1200) <= 0, 'declared range read back')
    call check(abs(e_get - e_set) <= 0, 'fit error read back equals the one returned')
    call check(e_set > 0 .and. e_set < 1e-9_c_double, 'Chapman-Enskog pairs are fitted closely')
    call mcd_mixture_set_temperature_fit(mix, 0.0_c_double, 0.0_c_double, stat, msg)
    call mcd_mixture_temperature_fit(mix, lo, hi, e_get, stat, msg)
    call check(max(abs(lo), abs(hi), abs(e_get)) <= 0, 'fit removed')
  end subroutine check_temperature_fit

  ! A mixture with MCD_GAS_RECOMMENDED: the polar pair water/air takes
  ! Brokaw's correction and gives the database pair's Brokaw value; the
  ! nonpolar pair nitrogen/air takes FSG; a given value reads back as USER.
  subroutine check_recommended_mixture()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    real(c_double) :: Dij(3, 3), Ddb
    integer :: stat, m, iw, ia
    character(len=256) :: msg
    call mcd_db_new_builtin(db, stat, msg)
    call mcd_mixture_new(mix, db, [character(len=16) :: 'water', 'air', 'nitrogen'], &
         stat, msg, default_method=MCD_GAS_RECOMMENDED)
    call check_stat(stat, msg, 'recommended mixture')
    m = -1
    call mcd_mixture_pair_method(mix, 1, 2, m, stat, msg)
    call check_stat(stat, msg, 'pair method water/air')
    call check(m == MCD_METHOD_BROKAW, 'water/air recommended: brokaw')
    call mcd_mixture_pair_method(mix, 3, 2, m, stat, msg)
    call check(m == MCD_METHOD_FSG, 'nitrogen/air recommended: fsg')
    call mcd_mixture_binaries(mix, 313.15_c_double, MCD_ATM, Dij, stat, msg)
    call check_stat(stat, msg, 'recommended binaries')
    call mcd_db_find(db, 'water', iw, stat, msg)
    call mcd_db_find(db, 'air', ia, stat, msg)
    call mcd_db_binary_gas(db, iw, ia, MCD_GAS_BROKAW, 313.15_c_double, MCD_ATM, Ddb, &
         stat, msg)
    call check_stat(stat, msg, 'database Brokaw water/air')
    ! the same expression from the same parameters: equal to round-off
    call check(abs(Dij(1, 2) - Ddb) <= 1e-14_c_double * Ddb, &
         'mixture Brokaw pair equals the database pair')
    ! any value: only the method it sets is checked
    call mcd_mixture_set_binary(mix, 1, 2, 2.6e-5_c_double, 313.15_c_double, MCD_ATM, &
         stat, msg)
    call mcd_mixture_pair_method(mix, 2, 1, m, stat, msg)
    call check(m == MCD_METHOD_USER, 'a given value reads back as user')
    m = -7
    call mcd_mixture_pair_method(mix, 2, 2, m, stat, msg)
    call check(stat == MCD_EINVAL .and. m == -7, 'pair (i, i) refused, output untouched')
  end subroutine check_recommended_mixture

  ! Two-bulb cell, binary: [D] = D12 at every composition and the
  ! equimolar binary film carries N = c D12 (x1 - x2) / L, so both
  ! theories give Delta(t) = Delta(0) exp(-beta D12 t),
  ! beta = A (V1 + V2) / (L V1 V2), around the volume-weighted mean.
  subroutine check_bulbs()
    integer, parameter :: NT = 4
    type(mcd_workspace_t) :: ws
    real(c_double) :: Dij(2, 2), x1_0(2), x2_0(2), t(NT), x1(2, NT), x2(2, NT)
    real(c_double) :: xi(2, NT), x2i(2, NT), mean(2), c, V1, V2, A, L, beta, dlt
    real(c_double) :: worst_lin, worst_int, worst_cons
    integer :: stat, k
    character(len=256) :: msg
    Dij = reshape([0.0_c_double, 4.0e-5_c_double, 4.0e-5_c_double, 0.0_c_double], [2, 2])
    c = 40.0_c_double
    V1 = 1.0e-4_c_double
    V2 = 2.0e-4_c_double
    A = 1.0e-6_c_double
    L = 0.05_c_double
    x1_0 = [0.9_c_double, 0.1_c_double]
    x2_0 = [0.2_c_double, 0.8_c_double]
    t = [0.0_c_double, 2.0e4_c_double, 5.0e4_c_double, 1.5e5_c_double]
    beta = A * (V1 + V2) / (L * V1 * V2)
    mean = (V1 * x1_0 + V2 * x2_0) / (V1 + V2)
    call mcd_workspace_new(ws, 2, stat, msg)
    x1 = GUARD
    x2 = GUARD
    call mcd_bulbs_linearized(ws, 2, Dij, c, V1, V2, A, L, x1_0, x2_0, NT, t, x1, x2, &
         stat, msg)
    call check_stat(stat, msg, 'two bulbs, linearized')
    xi = GUARD
    x2i = GUARD
    call mcd_bulbs_integrate(ws, 2, Dij, c, V1, V2, A, L, x1_0, x2_0, NT, t, &
         1e-10_c_double, xi, x2i, stat, msg)
    call check_stat(stat, msg, 'two bulbs, integrated')
    worst_lin = 0
    worst_int = 0
    worst_cons = 0
    do k = 1, NT
       dlt = (x1_0(1) - x2_0(1)) * exp(-beta * Dij(1, 2) * t(k))
       worst_lin = max(worst_lin, abs(x1(1, k) - (mean(1) + V2 / (V1 + V2) * dlt)), &
            abs(x2(1, k) - (mean(1) - V1 / (V1 + V2) * dlt)))
       worst_int = max(worst_int, abs(xi(1, k) - (mean(1) + V2 / (V1 + V2) * dlt)), &
            abs(x2i(1, k) - (mean(1) - V1 / (V1 + V2) * dlt)))
       worst_cons = max(worst_cons, maxval(abs(V1 * x1(:, k) + V2 * x2(:, k) &
            - (V1 + V2) * mean)) / (V1 + V2), maxval(abs(V1 * xi(:, k) + V2 * x2i(:, k) &
            - (V1 + V2) * mean)) / (V1 + V2))
    end do
    write (*, '(a, 3es10.3)') 'two bulbs vs closed form (linearized, integrated, &
         &conservation): ', worst_lin, worst_int, worst_cons
    ! linearized: one exponential, round-off only; integrated: Runge-Kutta
    ! with local tolerance 1e-10 over about 5 time constants.
    call check(worst_lin <= 1e-12_c_double, 'linearized two bulbs = closed form')
    call check(worst_int <= 1e-9_c_double, 'integrated two bulbs = closed form')
    call check(worst_cons <= 1e-14_c_double, 'every species conserved')
    call check(all(abs(x1(:, 1) - x1_0) <= 1e-15_c_double), 'x1(t = 0) = x1_0')
  end subroutine check_bulbs

  ! Thermal diffusion from kinetic theory: Omega(1,1)* against Bird,
  ! Stewart and Lightfoot (2002), Table E.2 (1.440 at T* = 1), the
  ! rigid-sphere isotopic limit 105/118 (from memory), the heavier species
  ! to the cold side, zero-sum mixture ratios, and the Dufour flux
  ! R T sum_i theta_i J_i of a hand-made binary state.
  subroutine check_thermal_kt()
    type(mcd_db_t) :: db
    type(mcd_mixture_t) :: mix
    integer :: stat, ia, ih, w
    character(len=256) :: msg
    real(c_double) :: om(4), r(3), a, b, err, kT(2), th(2), q(1), J(1, 2), pa(6)
    real(c_double) :: xb(2, 2), thb(2, 2), Tb(2), fb(2, 2, 2), qb(2, 2), q1(2)
    integer :: k
    call mcd_lj_collision_integrals(1.0_c_double, om, r, stat, msg)
    call check(stat == MCD_OK .and. abs(om(1) / 1.440_c_double - 1) < 2e-3_c_double, &
         'Omega11(1) (Bird, Stewart and Lightfoot, Table E.2)')
    call check(abs(r(3) - om(2) / om(1)) < 1e-15_c_double, 'C* = Omega12 / Omega11')
    call mcd_thermal_factor_kinetic(1.0_c_double + 1e-7_c_double, 1.0_c_double - 1e-7_c_double, &
         0.4_c_double, 1.0_c_double, 1.0_c_double, 1.0_c_double, 1.0_c_double, 1.0_c_double, &
         a, stat, msg)
    call check(stat == MCD_OK .and. abs(a / 1e-7_c_double - 105.0_c_double / 118) < 1e-6_c_double, &
         'rigid-sphere isotopic limit 105/118')
    call mcd_db_new_builtin(db, stat, msg)
    call mcd_db_find(db, 'argon', ia, stat, msg)
    call mcd_db_find(db, 'helium', ih, stat, msg)
    call mcd_db_thermal_factor(db, ia, ih, 300.0_c_double, 0.5_c_double, a, stat, msg, &
         rel_err=err, warn=w)
    call check_stat(stat, msg, 'thermal diffusion factor Ar-He')
    call check(a > 0 .and. abs(err - MCD_THERMAL_CE_TYPICAL_ERROR) < 1e-15_c_double, &
         'argon to the cold side; typical error')
    ! the raw call with the table's own parameters gives the database route's number
    call mcd_db_param(db, ia, MCD_PARAM_MOLAR_MASS, pa(1), stat, msg)
    call mcd_db_param(db, ih, MCD_PARAM_MOLAR_MASS, pa(2), stat, msg)
    call mcd_db_param(db, ia, MCD_PARAM_LJ_SIGMA, pa(3), stat, msg)
    call mcd_db_param(db, ih, MCD_PARAM_LJ_SIGMA, pa(4), stat, msg)
    call mcd_db_param(db, ia, MCD_PARAM_LJ_EPS_K, pa(5), stat, msg)
    call mcd_db_param(db, ih, MCD_PARAM_LJ_EPS_K, pa(6), stat, msg)
    call mcd_thermal_factor_ce(300.0_c_double, pa(1), pa(2), pa(3), pa(4), pa(5), pa(6), &
         0.5_c_double, b, stat, msg, warn=w)
    call check(stat == MCD_OK .and. abs(a - b) <= 1e-14_c_double, 'raw = database route')
    call mcd_mixture_new(mix, db, [character(len=16) :: 'argon', 'helium'], &
         stat, msg, default_method=MCD_GAS_CHAPMAN_ENSKOG)
    call mcd_mixture_thermal_ratios(mix, 300.0_c_double, [0.5_c_double, 0.5_c_double], kT, th, &
         stat, msg)
    call check_stat(stat, msg, 'mixture thermal ratios')
    call check(abs(kT(1) + kT(2)) < 1e-16_c_double .and. abs(kT(1) - 0.25_c_double * a) &
         < 1e-15_c_double .and. abs(th(1) - 0.5_c_double * a) < 1e-15_c_double, &
         'binary mixture ratios = x1 x2 alpha')
    J(1, :) = [1.0_c_double, -1.0_c_double]
    call mcd_dufour_heat_flux(2, 1, [0.5_c_double, 0.5_c_double], [0.04_c_double, 0.004_c_double], &
         [0.2_c_double, -0.2_c_double], 300.0_c_double, MCD_BASIS_MOLE, J, q, stat, msg)
    call check(stat == MCD_OK .and. abs(q(1) - 0.4_c_double * MCD_GAS_CONSTANT * 300) &
         <= 1e-12_c_double * q(1), 'Dufour heat flux R T sum theta J')
    ! batched (cell first) = the single-state call per cell, to the bit
    xb(1, :) = [0.3_c_double, 0.7_c_double]
    xb(2, :) = [0.0_c_double, 1.0_c_double]
    thb(1, :) = [0.21_c_double, -0.09_c_double]
    thb(2, :) = [0.35_c_double, 0.0_c_double]
    Tb = [300.0_c_double, 1250.0_c_double]
    fb(1, :, 1) = [1.0e-3_c_double, -2.0e-3_c_double]
    fb(1, :, 2) = [-1.0e-3_c_double, 2.0e-3_c_double]
    fb(2, :, 1) = [5.0e-4_c_double, 0.0_c_double]
    fb(2, :, 2) = [-5.0e-4_c_double, 0.0_c_double]
    call mcd_dufour_heat_flux_batch(2, 2, 2, xb, [0.04_c_double, 0.004_c_double], thb, Tb, &
         MCD_BASIS_MASS, fb, qb, stat, msg)
    call check_stat(stat, msg, 'batched Dufour heat flux')
    do k = 1, 2
      call mcd_dufour_heat_flux(2, 2, xb(k, :), [0.04_c_double, 0.004_c_double], thb(k, :), &
           Tb(k), MCD_BASIS_MASS, fb(k, :, :), q1, stat, msg)
      call check(stat == MCD_OK .and. maxval(abs(qb(k, :) - q1)) <= 0, &
           'batched Dufour = single-state per cell')
    end do
    call mcd_free(mix)
    call mcd_free(db)
  end subroutine check_thermal_kt

  ! Viscosity against the CRC Handbook (Viscosity of Gases, Huber and
  ! Harvey: N2 17.9 uPa s at 300 K), Wilke's pure-species limit, and the
  ! Dusty Gas Model: Graham's law under uniform pressure, the closed end
  ! (fluxes summing to 0) and the inverse returning the gradients.
  subroutine check_porous()
    type(mcd_db_t) :: db
    type(mcd_workspace_t) :: ws
    type(mcd_pore_t) :: pore
    integer :: stat, i, w
    character(len=256) :: msg
    real(c_double) :: mu, err, mix, B0, DK, De, Dbos, om
    real(c_double) :: M(2), Dij(2, 2), x(2), gx(1, 2), N(1, 2), gP(1), Nt(1)
    real(c_double) :: gx2(1, 2), gP2(1), mus(2)
    call mcd_db_new_builtin(db, stat, msg)
    call check_stat(stat, msg, 'builtin db for viscosity')
    call mcd_db_find(db, 'nitrogen', i, stat, msg)
    call mcd_db_viscosity_gas(db, i, 300.0_c_double, mu, stat, msg, rel_err=err, warn=w)
    call check_stat(stat, msg, 'viscosity of nitrogen')
    ! bound: typical error 1.5 % plus the table's 3 %
    call check(abs(mu / 17.9e-6_c_double - 1) < 0.045_c_double, 'N2 viscosity at 300 K')
    call check(abs(err - MCD_VISC_CE_TYPICAL_ERROR) < 1e-15_c_double, 'viscosity typical error')
    call mcd_viscosity_omega22(1.0_c_double, om, stat, msg)
    call check(stat == MCD_OK .and. abs(om / 1.593_c_double - 1) < 6e-3_c_double, &
         'Omega22(1) (Bird, Stewart and Lightfoot, Table E.2)')
    call mcd_viscosity_chapman_enskog(300.0_c_double, 28.014e-3_c_double, 3.798e-10_c_double, &
         71.4_c_double, mix, stat, msg)
    call check(stat == MCD_OK .and. abs(mix - mu) <= 1e-14_c_double * mu, &
         'raw Chapman-Enskog viscosity = database route')
    M = [28.014e-3_c_double, 4.0026e-3_c_double]
    mus = [17.9e-6_c_double, 19.9e-6_c_double]
    x = [1.0_c_double, 0.0_c_double]
    call mcd_viscosity_wilke(2, M, mus, x, mix, stat, msg)
    call check(stat == MCD_OK .and. abs(mix - mus(1)) <= 1e-15_c_double * mix, &
         'Wilke pure-species limit')
    pore%porosity = 0.4_c_double
    pore%tortuosity = 3.0_c_double
    pore%d_pore = 1e-7_c_double
    call mcd_pore_permeability(pore, B0, stat, msg)
    call check(stat == MCD_OK .and. abs(B0 - 0.4_c_double / 3 * 1e-14_c_double / 32) &
         <= 1e-12_c_double * B0, 'permeability of a bundle of straight pores')
    call mcd_knudsen_diffusivity(300.0_c_double, M(1), pore%d_pore, DK, stat, msg)
    call mcd_pore_effective(pore, DK, De, stat, msg)
    call mcd_bosanquet(1e-5_c_double, 1e-5_c_double, Dbos, stat, msg)
    call check(stat == MCD_OK .and. abs(Dbos - 5e-6_c_double) < 1e-18_c_double, 'Bosanquet')
    Dij = reshape([0.0_c_double, 7e-5_c_double, 7e-5_c_double, 0.0_c_double], [2, 2])
    x = [0.3_c_double, 0.7_c_double]
    gx(1, :) = [-20.0_c_double, 20.0_c_double]
    call mcd_workspace_new(ws, 2, stat, msg)
    call mcd_dgm_fluxes(ws, pore, 2, 1, 300.0_c_double, 1e5_c_double, 2e-5_c_double, M, &
         Dij, x, gx, N, stat, msg)
    call check_stat(stat, msg, 'Dusty Gas Model fluxes')
    call check(abs(N(1, 1) / N(1, 2) + sqrt(M(2) / M(1))) <= 1e-12_c_double * &
         sqrt(M(2) / M(1)), "Graham's law N_A/N_B = -sqrt(M_B/M_A)")
    Nt = 0
    call mcd_dgm_closed(ws, pore, 2, 1, 300.0_c_double, 1e5_c_double, 2e-5_c_double, M, &
         Dij, x, gx, Nt, N, gP, stat, msg)
    call check(stat == MCD_OK .and. abs(N(1, 1) + N(1, 2)) <= 1e-12_c_double * &
         abs(N(1, 1)), 'closed end: zero total flux')
    call mcd_dgm_gradients(ws, pore, 2, 1, 300.0_c_double, 1e5_c_double, 2e-5_c_double, &
         M, Dij, x, N, gx2, gP2, stat, msg)
    call check(stat == MCD_OK .and. abs(gP2(1) - gP(1)) <= 1e-9_c_double * abs(gP(1)) &
         .and. maxval(abs(gx2 - gx)) <= 1e-9_c_double * 20, &
         'inverse Dusty Gas Model returns the gradients')
    ! two cells of the batched call equal two single-state calls
    block
      real(c_double) :: Tb(2), Pb(2), mub(2), Db(2, 2, 2), xb(2, 2), gb(2, 1, 2), Nb(2, 1, 2)
      integer :: k
      Tb = [300.0_c_double, 400.0_c_double]
      Pb = [1e5_c_double, 2e5_c_double]
      mub = [2e-5_c_double, 2.4e-5_c_double]
      do k = 1, 2
         Db(k, :, :) = Dij
         xb(k, :) = x
         gb(k, 1, :) = gx(1, :) * k
      end do
      call mcd_dgm_fluxes_batch(ws, pore, 2, M, 2, 1, Tb, Pb, mub, Db, xb, gb, Nb, stat, msg)
      call check_stat(stat, msg, 'batched Dusty Gas Model')
      do k = 1, 2
         call mcd_dgm_fluxes(ws, pore, 2, 1, Tb(k), Pb(k), mub(k), M, Dij, x, &
              gb(k, :, :), N, stat, msg)
         call check(all(abs(N(1, :) - Nb(k, 1, :)) <= 0), 'batched = single-state fluxes')
      end do
    end block
    ! slab with equal end pressures: the isobaric binary closed form
    ! (Cunningham and Williams 1980), N_A L = (De c / a) ln((b - a xL) /
    ! (b - a x0)), a = 1 - sqrt(M_A/M_B), b = 1 + De / DeK_A
    block
      real(c_double) :: Ns(2), x0s(2), xLs(2), PLo, De, DKe, a, b, cc, ref
      x0s = [0.8_c_double, 0.2_c_double]
      xLs = [0.1_c_double, 0.9_c_double]
      call mcd_slab_solve(ws, pore, 2, 300.0_c_double, 2e-5_c_double, 1e-3_c_double, &
           1e5_c_double, M, Dij, x0s, 1e5_c_double, xLs, 1e5_c_double, MCD_SLAB_PRESSURES, &
           Ns, stat, msg, PL_out=PLo)
      call check_stat(stat, msg, 'slab solve')
      call mcd_pore_effective(pore, Dij(1, 2), De, stat, msg)
      call mcd_knudsen_diffusivity(300.0_c_double, M(1), pore%d_pore, DKe, stat, msg)
      DKe = DKe * pore%porosity / pore%tortuosity
      a = 1 - sqrt(M(1) / M(2))
      b = 1 + De / DKe
      cc = 1e5_c_double / (8.31446261815324_c_double * 300)
      ref = De * cc / a * log((b - a * xLs(1)) / (b - a * x0s(1))) / 1e-3_c_double
      call check(abs(Ns(1) - ref) <= 1e-8_c_double * abs(ref), 'slab = isobaric closed form')
    end block
    ! slab with the flux ratios of 2 A -> B at the far face: N_B = -N_A / 2
    ! exactly, and the profile of those fluxes ends at the matched x_A
    block
      real(c_double) :: Ns(2), x0s(2), xLs(2), zr(2), PLo, zL(1), xe(2, 1), Pe(1)
      x0s = [0.9_c_double, 0.1_c_double]
      xLs = [0.6_c_double, 0.4_c_double]
      zr = [2.0_c_double, -1.0_c_double]
      call mcd_slab_solve_ratios(ws, pore, 2, 300.0_c_double, 2e-5_c_double, 1e-3_c_double, &
           1e5_c_double, M, Dij, x0s, 1e5_c_double, xLs, 1, zr, Ns, stat, msg, PL_out=PLo)
      call check_stat(stat, msg, 'slab solve with ratios')
      call check(abs(Ns(2) + 0.5_c_double * Ns(1)) <= 1e-15_c_double * abs(Ns(1)) &
           .and. Ns(1) > 0, 'slab ratios: N_B = -N_A/2, A moves towards z = L')
      zL(1) = 1e-3_c_double
      call mcd_slab_profile(ws, pore, 2, 300.0_c_double, 2e-5_c_double, 1e-3_c_double, &
           1e5_c_double, M, Dij, x0s, 1e5_c_double, Ns, 1, zL, xe, Pe, stat, msg)
      call check_stat(stat, msg, 'slab profile with ratios')
      call check(abs(xe(1, 1) - 0.6_c_double) <= 1e-8_c_double .and. &
           abs(Pe(1) - PLo) <= 1e-8_c_double * PLo, 'slab ratios: profile ends at xL_A, PL')
    end block
    pore%porosity = 1.5_c_double
    N = GUARD
    call mcd_dgm_fluxes(ws, pore, 2, 1, 300.0_c_double, 1e5_c_double, 2e-5_c_double, M, &
         Dij, x, gx, N, stat, msg)
    call check(stat == MCD_EDOM .and. index(msg, 'porosity') > 0 .and. all(abs(N - GUARD) < tiny(B0)), &
         'porosity out of range: EDOM naming it, output untouched')
    call mcd_free(ws)
    call mcd_free(db)
  end subroutine check_porous

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
    call mcd_workspace_new(ws, 3, stat, msg)
    call mcd_flux_compute(ws, MCD_MODEL_MAXWELL_STEFAN, 3, 1, Dij, c, MCD_BASIS_MOLE, &
         x, grad, MCD_BASIS_MOLE, J, stat, msg)
    call check(stat == MCD_EDOM, 'composition summing to 0.9 is MCD_EDOM')
    call check(all(abs(J - GUARD) < tiny(c)), 'fluxes untouched on error')
    call check(len(mcd_last_error()) > 0, 'mcd_last_error set')
    call check(index(msg, mcd_last_error()) > 0, &
         'errmsg carries the detail: ' // trim(msg))

    ! a workspace too small is EBADLEN
    call mcd_workspace_new(ws, 2, stat, msg)
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
    call check(mcd_db_species_count(a) >= 40, 'source still holds the species')
    call mcd_free(a)
    call mcd_free(a)
    call check(.not. mcd_associated(a), 'double free is a no-op')
    call check(mcd_db_species_count(a) == 0, 'count of empty handle is 0')
  end subroutine check_handles

  ! Liquids: a binary NRTL liquid with alpha = 0 is the two-suffix Margules
  ! equation (Renon and Prausnitz 1968): ln gamma_1 = A x_2^2, reduced
  ! Gamma = 1 - 2 A x_1 x_2 (A = tau_12 + tau_21); Vignes Đ = D12^x2 D21^x1;
  ! the binary flux through mcd_flux_compute is -c Đ Gamma grad x_1; an
  ! unstable composition fails with MCD_EDOM; a missing pair is ENODATA.
  subroutine check_liquid()
    type(mcd_liquid_t) :: liq
    type(mcd_workspace_t) :: ws
    real(c_double) :: x(2), lng(2), G(4), D(4), c12(3), T, Dtc, Dhm
    integer :: stat, warn
    character(len=256) :: msg
    c12 = [1.0_c_double, 0.0_c_double, 0.0_c_double]
    call mcd_workspace_new(ws, 2, stat, msg)
    call check_stat(stat, msg, 'liquid workspace')
    call mcd_liquid_new(liq, 2, MCD_ACTIVITY_NRTL, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_new')
    x = [0.3_c_double, 0.7_c_double]
    call mcd_liquid_eval(ws, liq, 300.0_c_double, x, stat, msg, lngamma=lng)
    call check(stat == MCD_ENODATA .and. index(msg, 'pair (0, 1)') > 0, &
         'missing pair names the pair: ' // trim(msg))
    call mcd_liquid_set_pair(liq, 1, 2, c12, c12, 0.0_c_double, 0.0_c_double, &
         0.0_c_double, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_set_pair')
    call mcd_liquid_set_dinf(liq, 1, 2, 2.0e-9_c_double, 1.0e-9_c_double, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_set_dinf')
    call mcd_liquid_set_species(liq, 1, MCD_LIQ_MOLAR_VOLUME, 4e-5_c_double, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_set_species')
    warn = -1
    call mcd_liquid_eval(ws, liq, 300.0_c_double, x, stat, msg, lngamma=lng, &
         Gamma=G, Dij=D, warn=warn)
    call check_stat(stat, msg, 'mcd_liquid_eval')
    call check(abs(lng(1) - 2 * 0.49_c_double) <= 1e-14_c_double, 'Margules ln gamma_1')
    ! G in C order: G(1) = Gamma_11, G(2) = Gamma_12
    call check(abs(G(1) - G(2) - (1 - 4 * 0.21_c_double)) <= 1e-13_c_double, &
         'Margules reduced Gamma')
    call check(abs(D(2) / (2.0e-9_c_double**0.7_c_double * 1.0e-9_c_double**0.3_c_double) &
         - 1) <= 1e-14_c_double, 'Vignes')
    call check(warn == 0, 'no warning')
    ! Batched fluxes of the same liquid at 3 cells (SoA: comp(cell, species)):
    ! the binary closed form J_1 = -c Dvignes (1 - 2 A x_1 x_2) grad x_1
    ! (Taylor and Krishna 1993, ch. 2), A = 2; then an unstable cell 2
    ! (x_1 = 0.5, 2 A x_1 x_2 = 1) is refused by name, flux untouched.
    block
      real(c_double) :: yb(3, 2), gb(3, 1, 2), fb(3, 1, 2), Tb(3), cb(3), ref, x1
      integer :: k
      yb(:, 1) = [0.3_c_double, 0.1_c_double, 0.85_c_double]
      yb(:, 2) = 1 - yb(:, 1)
      gb(:, 1, 1) = [1.0_c_double, -2.0_c_double, 0.5_c_double]
      gb(:, 1, 2) = -gb(:, 1, 1)
      Tb = 300.0_c_double
      cb = 2.0e4_c_double
      warn = -1
      call mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, 2, 3, 1, Tb, cb, &
           MCD_BASIS_MOLE, yb, gb, MCD_BASIS_MOLE, fb, stat, msg, warn=warn)
      call check_stat(stat, msg, 'mcd_liquid_flux_batch')
      call check(warn == 0, 'batched: no warning')
      do k = 1, 3
         x1 = yb(k, 1)
         ref = -cb(k) * 2.0e-9_c_double**(1 - x1) * 1.0e-9_c_double**x1 &
              * (1 - 4 * x1 * (1 - x1)) * gb(k, 1, 1)
         call check(abs(fb(k, 1, 1) - ref) <= 1e-12_c_double * abs(ref) .and. &
              abs(fb(k, 1, 2) + ref) <= 1e-12_c_double * abs(ref), &
              'batched liquid flux: binary closed form')
      end do
      yb(2, :) = [0.5_c_double, 0.5_c_double]
      fb = 7.0_c_double
      call mcd_liquid_flux_batch(ws, liq, MCD_MODEL_MAXWELL_STEFAN, 2, 3, 1, Tb, cb, &
           MCD_BASIS_MOLE, yb, gb, MCD_BASIS_MOLE, fb, stat, msg)
      call check(stat == MCD_EDOM .and. index(msg, 'cell 1:') > 0 .and. &
           index(msg, 'not stable') > 0, 'batched: unstable cell named: ' // trim(msg))
      ! cell 1 (0-based; 2 here) is refused: it and the cells after it untouched
      call check(all(fb(2:3, :, :) > 6.5_c_double .and. fb(2:3, :, :) < 7.5_c_double), &
           'batched: flux of the refused cell and after untouched')
    end block
    x = [0.5_c_double, 0.5_c_double]
    call mcd_liquid_eval(ws, liq, 300.0_c_double, x, stat, msg, Gamma=G)
    call check(stat == MCD_EDOM .and. index(msg, 'not stable') > 0, &
         'unstable liquid refused: ' // trim(msg))
    call mcd_free(liq)
    call check(.not. mcd_associated(liq), 'liquid freed')
    T = 298.15_c_double
    call mcd_binary_tyn_calus(T, 0.89e-3_c_double, 96e-6_c_double, 18.9e-6_c_double, &
         Dtc, stat, msg)
    call check_stat(stat, msg, 'Tyn-Calus')
    ! D [cm^2/s] = 8.93e-8 V_B^0.267 V_A^-0.433 T / mu [cP]
    call check(abs(Dtc - 1e-4_c_double * 8.93e-8_c_double * 18.9_c_double**0.267_c_double &
         * 96.0_c_double**(-0.433_c_double) * T / 0.89_c_double) <= 1e-12_c_double * Dtc, &
         'Tyn-Calus closed form')
    call mcd_binary_hayduk_minhas(T, 0.89e-3_c_double, 96e-6_c_double, Dhm, stat, msg)
    call check_stat(stat, msg, 'Hayduk-Minhas')
    call check(Dhm > 5e-10_c_double .and. Dhm < 2e-9_c_double, 'Hayduk-Minhas magnitude')
    block
      real(c_double) :: tlo, thi
      integer :: w
      call mcd_method_temperature_range(MCD_METHOD_HAYDUK_MINHAS, 400.0_c_double, tlo, thi, &
           w, stat, msg)
      call check_stat(stat, msg, 'correlation range')
      call check(w == MCD_WARN_TEMPERATURE .and. abs(tlo - 273.15_c_double) < 1e-12_c_double &
           .and. abs(thi - 373.15_c_double) < 1e-12_c_double, 'Hayduk-Minhas at 400 K flagged')
    end block
    call mcd_free(ws)
    call check_liquid_evaporation()
  end subroutine check_liquid

  ! Water into dry air through 5 cm at 298.15 K, 1 atm: Stefan's law
  ! N = (c D / L) ln(1 / (1 - y0)), y0 = P^sat / P with the Antoine
  ! constants of water (Stull 1947 via the NIST WebBook, from memory).
  subroutine check_liquid_evaporation()
    type(mcd_liquid_t) :: liq
    type(mcd_workspace_t) :: ws
    real(c_double) :: D(2, 2), xL(2), M(2), x(1), p(1), N(2), y0(2), rate, level, c, ref
    real(c_double), parameter :: T = 298.15_c_double, P0 = 101325.0_c_double
    integer :: stat
    character(len=256) :: msg
    call mcd_workspace_new(ws, 2, stat, msg)
    call mcd_liquid_new(liq, 1, MCD_ACTIVITY_IDEAL, stat, msg)
    call mcd_liquid_set_antoine(liq, 1, 9.6543_c_double, 1435.264_c_double, &
         -64.848_c_double, 255.9_c_double, 373.0_c_double, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_set_antoine')
    x = 1
    call mcd_liquid_vle(ws, liq, T, x, p, stat, msg)
    call check_stat(stat, msg, 'mcd_liquid_vle')
    call check(abs(p(1) / 3169.9_c_double - 1) < 0.02_c_double, 'water vapour pressure')
    D = reshape([0.0_c_double, 2.6e-5_c_double, 2.6e-5_c_double, 0.0_c_double], [2, 2])
    xL = [0.0_c_double, 1.0_c_double]
    M = [0.018015_c_double, 0.028964_c_double]
    c = P0 / (MCD_GAS_CONSTANT * T)
    call mcd_liquid_evaporation(ws, liq, 2, D, c, 0.05_c_double, xL, T, P0, x, M, &
         997.05_c_double, N, stat, msg, y0=y0, mass_rate=rate, level_rate=level)
    call check_stat(stat, msg, 'mcd_liquid_evaporation')
    ref = c * 2.6e-5_c_double / 0.05_c_double * log(1 / (1 - p(1) / P0))
    call check(abs(N(1) / ref - 1) < 1e-10_c_double, 'Stefan law')
    call check(abs(level - rate / 997.05_c_double * 3.6e6_c_double) <= 1e-12_c_double * level, &
         'level rate in mm/h')
    call mcd_free(liq)
    call mcd_free(ws)
  end subroutine check_liquid_evaporation

end program test_mcdiff
