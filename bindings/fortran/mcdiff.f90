! mcdiff.f90 - Fortran 2008 module over the mcdiff C API (include/mcdiff.h).
!
! Two layers, both public:
!
!   c_mcd_<name>   bind(c) interfaces to the C functions mcd_<name>
!                  (generated from include/mcdiff.h into mcdiff_c_api.inc
!                  by tools/gen_bindings.py), argument
!                  for argument: scalars by value, counts and indices
!                  integer(c_size_t) and 0-based, arrays assumed-size,
!                  strings NUL-terminated, handles and nullable pointers as
!                  type(c_ptr). Use them when a wrapper is missing or when
!                  you already hold C pointers (mcd_handle_ptr gives one).
!
!   mcd_<name>     thin Fortran wrappers: handles are the opaque types
!                  mcd_db_t, mcd_mixture_t and mcd_workspace_t; counts and
!                  enums are default integers; species indices are 1-BASED;
!                  strings are ordinary character variables (trailing blanks
!                  of inputs are ignored); optional arguments replace NULL.
!                  Every fallible wrapper is a subroutine with a required
!                  `stat` (integer, intent(out); MCD_OK = 0 on success, else
!                  one of the MCD_E* codes) and an optional `errmsg`
!                  (character(*), intent(out)): the status text followed by
!                  the call's detail (the error buffer or the workspace's
!                  last error), blank on success. The wrappers never stop the
!                  program. Output arrays are intent(inout): on error they
!                  are left untouched, as in C.
!
! Array layout. C stores matrices row-major, element (i,j) at i*n + j, and
! flux and gradient arrays species-major, element (species i, direction d)
! at i*n_dim + d. Fortran stores arrays column-major, so the same memory is
! seen from Fortran with the indices swapped:
!
!   * flux and gradient arrays: declare them (n_dim, n_species);
!     flux(d, i) is direction d of species i. No copy, no transpose.
!   * N x N matrices: a Fortran array A(n, n) holds the C matrix transposed,
!     A(j, i) = C element (i, j). Pass transpose(Gamma) for the thermodynamic
!     factor matrix Gamma(i, j); the Fick matrix comes back as
!     transpose([D]), so [D] = transpose(D) or, without any copy,
!     J(:, others) = -c * matmul(grad(:, others), D).
!     Binary diffusivities Dij are symmetric: no transpose needed.
!   * tables with one row per time or position (film profile, two-bulb
!     results): declare them (n_species, n_points); x(:, k) is point k.
!   * batched calls, structure-of-arrays layout (mcd_flux_batch,
!     mcd_flux_batch_dij): the cell index is the fastest in C, so it comes
!     FIRST in Fortran: comp(n_cells, n_species), grad and flux
!     (n_cells, n_dim, n_species), grad_lnP(n_cells, n_dim), Dij
!     (n_cells, n_species, n_species); T, P, c (n_cells).
!   * batched calls, per-cell layout (mcd_flux_batch_aos): comp
!     (n_species, n_cells), grad and flux (n_dim, n_species, n_cells),
!     grad_lnP(n_dim, n_cells).
!
! Handles. mcd_db_t, mcd_mixture_t and mcd_workspace_t wrap a C pointer that
! starts as c_null_ptr. Create them with the mcd_*_new / mcd_workspace_new
! subroutines (which first free what the handle held), release them with
! mcd_free (generic) or let them go out of scope (final procedures). Handles
! cannot be copied: `b = a` frees what b held and leaves b empty (a keeps the
! object), so no object is ever freed twice. Pass handles as arguments.
! Threads: as in C, a database or mixture no longer modified may be shared
! read-only; a workspace belongs to one thread at a time.
!
! Enums are passed as C int, which is how every supported C compiler passes
! enum types of this size.
module mcdiff
  use, intrinsic :: iso_c_binding
  implicit none
  private

  ! ------------------------------------------------------------------
  ! Kinds
  ! ------------------------------------------------------------------
  integer, parameter, public :: mcd_rk = c_double

  ! ------------------------------------------------------------------
  ! Generated from include/mcdiff.h by tools/gen_bindings.py (do not edit
  ! the included file; run python3 tools/gen_bindings.py --write):
  !   * the enumerators and numeric macros as public parameters, values as
  !     in C (MCD_OK, MCD_E*, MCD_PARAM_*, MCD_METHOD_*, MCD_WARN_*,
  !     MCD_BASIS_*, MCD_MODEL_*, MCD_BOOT_*, MCD_DIAG_*, MCD_FILM_*,
  !     MCD_MAX_SPECIES, MCD_MAX_DIM, MCD_SUM_TOL, MCD_GAS_CONSTANT,
  !     MCD_ATM; MCD_DEPENDENT_AUTO, integer(c_size_t), is C's
  !     (size_t)-1 for the c_mcd_* layer: the wrappers use an absent
  !     `dependent` argument instead);
  !   * mcd_allocator_t, C's mcd_allocator for mcd_workspace_new_with:
  !     alloc and free are c_funloc of bind(c) procedures with the C
  !     signatures
  !       type(c_ptr) function alloc(ud, size) (ud: c_ptr value, size:
  !       c_size_t value; memory aligned for double or c_null_ptr), and
  !       subroutine free(ud, p) (both c_ptr value); ud is passed to both;
  !   * the raw bind(c) interfaces c_mcd_<name>, public, one per function.
  ! ------------------------------------------------------------------
  include 'mcdiff_c_api.inc'

  ! ------------------------------------------------------------------
  ! Opaque handles
  ! ------------------------------------------------------------------
  type, public :: mcd_db_t
     private
     type(c_ptr) :: ptr = c_null_ptr
   contains
     procedure, private :: db_assign
     generic :: assignment(=) => db_assign
     final :: db_final
  end type mcd_db_t

  type, public :: mcd_mixture_t
     private
     type(c_ptr) :: ptr = c_null_ptr
   contains
     procedure, private :: mix_assign
     generic :: assignment(=) => mix_assign
     final :: mix_final
  end type mcd_mixture_t

  type, public :: mcd_workspace_t
     private
     type(c_ptr) :: ptr = c_null_ptr
   contains
     procedure, private :: ws_assign
     generic :: assignment(=) => ws_assign
     final :: ws_final
  end type mcd_workspace_t

  type, public :: mcd_liquid_t
     private
     type(c_ptr) :: ptr = c_null_ptr
   contains
     procedure, private :: liq_assign
     generic :: assignment(=) => liq_assign
     final :: liq_final
  end type mcd_liquid_t

  ! ------------------------------------------------------------------
  ! C library helpers used by the wrappers
  ! ------------------------------------------------------------------
  interface
     function c_strlen(s) bind(c, name='strlen') result(n)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: s
       integer(c_size_t) :: n
     end function c_strlen
  end interface

  ! ------------------------------------------------------------------
  ! Fortran wrappers
  ! ------------------------------------------------------------------
  public :: mcd_version_number, mcd_version_string, mcd_status_string, &
       mcd_free, mcd_associated, mcd_handle_ptr, &
       mcd_formula_molar_mass, mcd_param_name, mcd_param_unit, &
       mcd_db_new, mcd_db_new_builtin, mcd_db_species_count, mcd_db_find, &
       mcd_db_name, mcd_db_formula, mcd_db_source, mcd_db_param, mcd_db_add, &
       mcd_db_set_param, mcd_db_load_file, mcd_db_load_string, &
       mcd_comp_normalize, mcd_comp_x_to_w, mcd_comp_w_to_x, &
       mcd_comp_mean_molar_mass_x, mcd_comp_mean_molar_mass_w, &
       mcd_comp_x_to_c, mcd_comp_c_to_x, mcd_comp_ideal_gas_c, &
       mcd_comp_grad_x_to_w, mcd_comp_grad_w_to_x, &
       mcd_method_name, mcd_method_from_name, mcd_method_typical_error, &
       mcd_warning_string, mcd_binary_fsg, mcd_binary_chapman_enskog, &
       mcd_binary_scale, mcd_db_binary_gas, &
       mcd_mixture_new, mcd_mixture_species_count, mcd_mixture_name, &
       mcd_mixture_molar_masses, mcd_mixture_set_method, mcd_mixture_pair_method, &
       mcd_mixture_set_binary, mcd_mixture_binaries, &
       mcd_workspace_new, mcd_workspace_capacity, mcd_last_error, &
       mcd_flux_compute, mcd_thermal_ratios, mcd_flux_jacobian_comp, &
       mcd_flux_jacobian, mcd_flux_jacobian_tp, mcd_flux_batch_jacobian, &
       mcd_fick_matrix, mcd_fick_fluxes, &
       mcd_fick_eigenvalues, mcd_flux_convert, mcd_flux_total, &
       mcd_flux_project, mcd_flux_diagnose, mcd_film_solve, mcd_film_profile, &
       mcd_flux_batch, mcd_flux_batch_dij, mcd_flux_batch_aos, &
       mcd_workspace_set_iterative, mcd_workspace_iterative_outcome, &
       mcd_workspace_set_threads, mcd_workspace_set_dij_read, &
       mcd_mixture_set_temperature_fit, &
       mcd_formula_elements, mcd_formula_diffusion_volume, &
       mcd_formula_molecule_volume, mcd_element_symbol, mcd_element_weight, &
       mcd_binary_omega_d, mcd_workspace_new_with, &
       mcd_binary_wilke_lee, mcd_binary_wilke_chang, mcd_db_binary_liquid, &
       mcd_binary_brokaw, &
       mcd_typical_error_widened, mcd_db_binary_explain, &
       mcd_flux_to_volume_frame, mcd_flux_to_species_frame, &
       mcd_flux_velocity_difference, mcd_mixture_temperature_fit, &
       mcd_bulbs_linearized, mcd_bulbs_integrate, &
       mcd_liquid_new, mcd_liquid_set_species, mcd_liquid_set_pair, &
       mcd_liquid_set_dinf, mcd_liquid_eval, mcd_liquid_flux_batch, mcd_binary_tyn_calus, &
       mcd_binary_hayduk_minhas, mcd_method_temperature_range, mcd_liquid_set_antoine, &
       mcd_liquid_vle, &
       mcd_liquid_evaporation, &
       mcd_viscosity_omega22, mcd_viscosity_chapman_enskog, mcd_viscosity_wilke, &
       mcd_db_viscosity_gas, mcd_mixture_viscosities, mcd_pore_permeability, &
       mcd_lj_collision_integrals, mcd_thermal_factor_kinetic, mcd_thermal_factor_ce, &
       mcd_db_thermal_factor, mcd_mixture_thermal_ratios, mcd_dufour_heat_flux, &
       mcd_dufour_heat_flux_batch, &
       mcd_pore_effective, mcd_knudsen_diffusivity, mcd_bosanquet, &
       mcd_dgm_fluxes, mcd_dgm_closed, mcd_dgm_gradients, mcd_dgm_fluxes_batch, &
       mcd_slab_solve, mcd_slab_solve_ratios, mcd_slab_profile

  !> Release a handle (any of the three types); an empty handle is a no-op.
  interface mcd_free
     module procedure db_free, mix_free, ws_free, liq_free
  end interface mcd_free

  !> .true. when the handle holds an object.
  interface mcd_associated
     module procedure db_associated, mix_associated, ws_associated, liq_associated
  end interface mcd_associated

  !> The C pointer inside a handle, for the c_mcd_* layer. The handle keeps
  !> ownership: do not free the pointer yourself.
  interface mcd_handle_ptr
     module procedure db_ptr, mix_ptr, ws_ptr, liq_ptr
  end interface mcd_handle_ptr

contains

  ! ==================================================================
  ! Private helpers: strings and status messages
  ! ==================================================================

  !> Copy of a NUL-terminated C string ('' for a NULL pointer).
  function from_c(p) result(s)
    type(c_ptr), intent(in) :: p
    character(len=:), allocatable :: s
    character(kind=c_char), pointer :: a(:)
    integer :: i, n
    if (.not. c_associated(p)) then
       s = ''
       return
    end if
    n = int(c_strlen(p))
    call c_f_pointer(p, a, [n])
    allocate (character(len=n) :: s)
    do i = 1, n
       s(i:i) = a(i)
    end do
  end function from_c

  !> NUL-terminated copy of a Fortran string without its trailing blanks.
  pure function to_c(s) result(r)
    character(len=*), intent(in) :: s
    character(kind=c_char, len=len_trim(s) + 1) :: r
    r = trim(s) // c_null_char
  end function to_c

  !> stat from a C status and, when asked, errmsg = status text [: detail].
  subroutine finish(s, stat, errmsg, detail)
    integer(c_int), intent(in) :: s
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    character(len=*), intent(in), optional :: detail
    character(len=:), allocatable :: d
    stat = int(s)
    if (.not. present(errmsg)) return
    if (s == 0) then
       errmsg = ''
       return
    end if
    ! The library's detail of this failing call (mcd_last_error), or the
    ! wrapper's own words when it has some.
    d = from_c(c_mcd_last_error())
    if (present(detail)) then
       if (len_trim(detail) > 0) d = trim(detail)
    end if
    if (len_trim(d) > 0) then
       errmsg = from_c(c_mcd_status_string(s)) // ': ' // trim(d)
    else
       errmsg = from_c(c_mcd_status_string(s))
    end if
  end subroutine finish

  !> finish() for an estimate: on success, its typical relative error and
  !> warning bits into the optional outputs.
  subroutine finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
    integer(c_int), intent(in) :: s, w
    real(c_double), intent(in) :: e
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    if (s == 0) then
       if (present(rel_err)) rel_err = e
       if (present(warn)) warn = int(w)
    end if
    call finish(s, stat, errmsg)
  end subroutine finish_estimate


  !> 1-based Fortran index to a 0-based C index; indices below 1 map to a
  !> huge value that C rejects as out of range (never to an "auto" value).
  pure function cidx(i) result(k)
    integer, intent(in) :: i
    integer(c_size_t) :: k
    if (i >= 1) then
       k = int(i - 1, c_size_t)
    else
       k = -2_c_size_t
    end if
  end function cidx

  !> Count to size_t; negative counts map to a huge value that C rejects.
  pure function csz(n) result(k)
    integer, intent(in) :: n
    integer(c_size_t) :: k
    if (n >= 0) then
       k = int(n, c_size_t)
    else
       k = -2_c_size_t
    end if
  end function csz

  ! ==================================================================
  ! Handles: finalisation, assignment, free, queries
  ! ==================================================================

  impure elemental subroutine db_final(self)
    type(mcd_db_t), intent(inout) :: self
    call c_mcd_db_free(self%ptr)
    self%ptr = c_null_ptr
  end subroutine db_final

  impure elemental subroutine mix_final(self)
    type(mcd_mixture_t), intent(inout) :: self
    call c_mcd_mixture_free(self%ptr)
    self%ptr = c_null_ptr
  end subroutine mix_final

  impure elemental subroutine ws_final(self)
    type(mcd_workspace_t), intent(inout) :: self
    call c_mcd_workspace_free(self%ptr)
    self%ptr = c_null_ptr
  end subroutine ws_final

  ! Assignment never shares an object: the target is freed and left empty.
  subroutine db_assign(lhs, rhs)
    class(mcd_db_t), intent(inout) :: lhs
    type(mcd_db_t), intent(in) :: rhs
    if (c_associated(lhs%ptr, rhs%ptr)) return
    call c_mcd_db_free(lhs%ptr)
    lhs%ptr = c_null_ptr
  end subroutine db_assign

  subroutine mix_assign(lhs, rhs)
    class(mcd_mixture_t), intent(inout) :: lhs
    type(mcd_mixture_t), intent(in) :: rhs
    if (c_associated(lhs%ptr, rhs%ptr)) return
    call c_mcd_mixture_free(lhs%ptr)
    lhs%ptr = c_null_ptr
  end subroutine mix_assign

  subroutine ws_assign(lhs, rhs)
    class(mcd_workspace_t), intent(inout) :: lhs
    type(mcd_workspace_t), intent(in) :: rhs
    if (c_associated(lhs%ptr, rhs%ptr)) return
    call c_mcd_workspace_free(lhs%ptr)
    lhs%ptr = c_null_ptr
  end subroutine ws_assign

  subroutine db_free(h)
    type(mcd_db_t), intent(inout) :: h
    call db_final(h)
  end subroutine db_free

  subroutine mix_free(h)
    type(mcd_mixture_t), intent(inout) :: h
    call mix_final(h)
  end subroutine mix_free

  impure elemental subroutine liq_final(self)
    type(mcd_liquid_t), intent(inout) :: self
    call c_mcd_liquid_free(self%ptr)
    self%ptr = c_null_ptr
  end subroutine liq_final

  subroutine liq_assign(lhs, rhs)
    class(mcd_liquid_t), intent(inout) :: lhs
    type(mcd_liquid_t), intent(in) :: rhs
    if (c_associated(lhs%ptr, rhs%ptr)) return
    call c_mcd_liquid_free(lhs%ptr)
    lhs%ptr = c_null_ptr
  end subroutine liq_assign

  subroutine liq_free(h)
    type(mcd_liquid_t), intent(inout) :: h
    call liq_final(h)
  end subroutine liq_free

  logical function liq_associated(h)
    type(mcd_liquid_t), intent(in) :: h
    liq_associated = c_associated(h%ptr)
  end function liq_associated

  type(c_ptr) function liq_ptr(h)
    type(mcd_liquid_t), intent(in) :: h
    liq_ptr = h%ptr
  end function liq_ptr

  subroutine ws_free(h)
    type(mcd_workspace_t), intent(inout) :: h
    call ws_final(h)
  end subroutine ws_free

  logical function db_associated(h)
    type(mcd_db_t), intent(in) :: h
    db_associated = c_associated(h%ptr)
  end function db_associated

  logical function mix_associated(h)
    type(mcd_mixture_t), intent(in) :: h
    mix_associated = c_associated(h%ptr)
  end function mix_associated

  logical function ws_associated(h)
    type(mcd_workspace_t), intent(in) :: h
    ws_associated = c_associated(h%ptr)
  end function ws_associated

  type(c_ptr) function db_ptr(h)
    type(mcd_db_t), intent(in) :: h
    db_ptr = h%ptr
  end function db_ptr

  type(c_ptr) function mix_ptr(h)
    type(mcd_mixture_t), intent(in) :: h
    mix_ptr = h%ptr
  end function mix_ptr

  type(c_ptr) function ws_ptr(h)
    type(mcd_workspace_t), intent(in) :: h
    ws_ptr = h%ptr
  end function ws_ptr

  ! ==================================================================
  ! Version, status and names
  ! ==================================================================

  !> Runtime version MAJOR*10000 + MINOR*100 + PATCH.
  integer function mcd_version_number()
    mcd_version_number = int(c_mcd_version_number())
  end function mcd_version_number

  !> Runtime version "MAJOR.MINOR.PATCH".
  function mcd_version_string() result(s)
    character(len=:), allocatable :: s
    s = from_c(c_mcd_version_string())
  end function mcd_version_string

  !> English text of a status code.
  function mcd_status_string(status) result(s)
    integer, intent(in) :: status
    character(len=:), allocatable :: s
    s = from_c(c_mcd_status_string(int(status, c_int)))
  end function mcd_status_string

  !> Short machine name of an MCD_PARAM_* value ('' if unknown).
  function mcd_param_name(p) result(s)
    integer, intent(in) :: p
    character(len=:), allocatable :: s
    s = from_c(c_mcd_param_name(int(p, c_int)))
  end function mcd_param_name

  !> SI unit text of an MCD_PARAM_* value ('' if unknown).
  function mcd_param_unit(p) result(s)
    integer, intent(in) :: p
    character(len=:), allocatable :: s
    s = from_c(c_mcd_param_unit(int(p, c_int)))
  end function mcd_param_unit

  !> Short name of an MCD_METHOD_* value ('' if unknown).
  function mcd_method_name(m) result(s)
    integer, intent(in) :: m
    character(len=:), allocatable :: s
    s = from_c(c_mcd_method_name(int(m, c_int)))
  end function mcd_method_name

  !> Method from its short name (case-insensitive).
  subroutine mcd_method_from_name(name, method, stat, errmsg)
    character(len=*), intent(in) :: name
    integer, intent(inout) :: method
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_int) :: m, s
    s = c_mcd_method_from_name(to_c(name), m)
    if (s == 0) method = int(m)
    call finish(s, stat, errmsg, trim(name))
  end subroutine mcd_method_from_name

  !> Typical relative error of a method (NaN for USER).
  real(c_double) function mcd_method_typical_error(m)
    integer, intent(in) :: m
    mcd_method_typical_error = c_mcd_method_typical_error(int(m, c_int))
  end function mcd_method_typical_error

  !> Text of one MCD_WARN_* bit ('' for an unknown bit).
  function mcd_warning_string(bit) result(s)
    integer, intent(in) :: bit
    character(len=:), allocatable :: s
    s = from_c(c_mcd_warning_string(int(bit, c_int)))
  end function mcd_warning_string

  !> Molar mass [kg/mol] of a chemical formula.
  subroutine mcd_formula_molar_mass(formula, M, stat, errmsg)
    character(len=*), intent(in) :: formula
    real(c_double), intent(inout) :: M
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_formula_molar_mass(to_c(formula), v)
    if (s == 0) M = v
    call finish(s, stat, errmsg)
  end subroutine mcd_formula_molar_mass

  ! ==================================================================
  ! Species database
  ! ==================================================================

  !> New empty database in db (what db held is freed first).
  subroutine mcd_db_new(db, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call db_final(db)
    p = c_null_ptr
    s = c_mcd_db_new(p)
    if (s == 0) db%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_db_new

  !> New database holding the built-in species table.
  subroutine mcd_db_new_builtin(db, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call db_final(db)
    p = c_null_ptr
    s = c_mcd_db_new_builtin(p)
    if (s == 0) db%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_db_new_builtin

  !> Number of species (0 for an empty handle).
  integer function mcd_db_species_count(db)
    type(mcd_db_t), intent(in) :: db
    mcd_db_species_count = int(c_mcd_db_species_count(db%ptr))
  end function mcd_db_species_count

  !> 1-based index of a species by name (case-insensitive) or unique formula.
  subroutine mcd_db_find(db, name, index, stat, errmsg)
    type(mcd_db_t), intent(in) :: db
    character(len=*), intent(in) :: name
    integer, intent(inout) :: index
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_size_t) :: k
    integer(c_int) :: s
    s = c_mcd_db_find(db%ptr, to_c(name), k)
    if (s == 0) index = int(k) + 1
    call finish(s, stat, errmsg, trim(name))
  end subroutine mcd_db_find

  !> Name of species i (1-based), '' when out of range.
  function mcd_db_name(db, i) result(s)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: i
    character(len=:), allocatable :: s
    s = from_c(c_mcd_db_name(db%ptr, cidx(i)))
  end function mcd_db_name

  !> Formula of species i (1-based), '' when out of range.
  function mcd_db_formula(db, i) result(s)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: i
    character(len=:), allocatable :: s
    s = from_c(c_mcd_db_formula(db%ptr, cidx(i)))
  end function mcd_db_formula

  !> Source text of parameter p of species i (1-based), '' if none.
  function mcd_db_source(db, i, p) result(s)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: i, p
    character(len=:), allocatable :: s
    s = from_c(c_mcd_db_source(db%ptr, cidx(i), int(p, c_int)))
  end function mcd_db_source

  !> Value of parameter p (MCD_PARAM_*) of species i (1-based), SI units.
  subroutine mcd_db_param(db, i, p, value, stat, errmsg)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: i, p
    real(c_double), intent(inout) :: value
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_db_param(db%ptr, cidx(i), int(p, c_int), v)
    if (s == 0) value = v
    call finish(s, stat, errmsg)
  end subroutine mcd_db_param

  !> Add (or reset) a species from its formula; index is 1-based.
  subroutine mcd_db_add(db, name, formula, index, stat, errmsg, n_rings)
    type(mcd_db_t), intent(inout) :: db
    character(len=*), intent(in) :: name, formula
    integer, intent(inout) :: index
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: n_rings
    integer(c_size_t) :: k
    integer(c_int) :: s, r
    r = 0
    if (present(n_rings)) r = int(n_rings, c_int)
    s = c_mcd_db_add(db%ptr, to_c(name), to_c(formula), r, k)
    if (s == 0) index = int(k) + 1
    call finish(s, stat, errmsg)
  end subroutine mcd_db_add

  !> Set parameter p of species i (1-based).
  subroutine mcd_db_set_param(db, i, p, value, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    integer, intent(in) :: i, p
    real(c_double), intent(in) :: value
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_db_set_param(db%ptr, cidx(i), int(p, c_int), value), &
         stat, errmsg)
  end subroutine mcd_db_set_param

  !> Load species from a file in the mcdiff species format (all or nothing).
  subroutine mcd_db_load_file(db, path, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    character(len=*), intent(in) :: path
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_int) :: s
    s = c_mcd_db_load_file(db%ptr, to_c(path))
    call finish(s, stat, errmsg)
  end subroutine mcd_db_load_file

  !> Load species from text in the mcdiff species format. Lines are
  !> separated by new_line('a').
  subroutine mcd_db_load_string(db, text, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    character(len=*), intent(in) :: text
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_int) :: s
    s = c_mcd_db_load_string(db%ptr, text // c_null_char)
    call finish(s, stat, errmsg)
  end subroutine mcd_db_load_string

  ! ==================================================================
  ! Compositions
  ! ==================================================================

  subroutine mcd_comp_normalize(n, y, out_y, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: y(n)
    real(c_double), intent(inout) :: out_y(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_normalize(csz(n), y, out_y), stat, errmsg)
  end subroutine mcd_comp_normalize

  subroutine mcd_comp_x_to_w(n, M, x, w, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: M(n), x(n)
    real(c_double), intent(inout) :: w(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_x_to_w(csz(n), M, x, w), stat, errmsg)
  end subroutine mcd_comp_x_to_w

  subroutine mcd_comp_w_to_x(n, M, w, x, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: M(n), w(n)
    real(c_double), intent(inout) :: x(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_w_to_x(csz(n), M, w, x), stat, errmsg)
  end subroutine mcd_comp_w_to_x

  subroutine mcd_comp_mean_molar_mass_x(n, M, x, Mbar, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: M(n), x(n)
    real(c_double), intent(inout) :: Mbar
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_mean_molar_mass_x(csz(n), M, x, Mbar), stat, errmsg)
  end subroutine mcd_comp_mean_molar_mass_x

  subroutine mcd_comp_mean_molar_mass_w(n, M, w, Mbar, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: M(n), w(n)
    real(c_double), intent(inout) :: Mbar
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_mean_molar_mass_w(csz(n), M, w, Mbar), stat, errmsg)
  end subroutine mcd_comp_mean_molar_mass_w

  subroutine mcd_comp_x_to_c(n, c_total, x, c, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: c_total, x(n)
    real(c_double), intent(inout) :: c(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_x_to_c(csz(n), c_total, x, c), stat, errmsg)
  end subroutine mcd_comp_x_to_c

  subroutine mcd_comp_c_to_x(n, c, x, c_total, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: c(n)
    real(c_double), intent(inout) :: x(n), c_total
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_c_to_x(csz(n), c, x, c_total), stat, errmsg)
  end subroutine mcd_comp_c_to_x

  !> Ideal-gas total concentration c = P/(R T) [mol/m^3].
  subroutine mcd_comp_ideal_gas_c(T, P, c, stat, errmsg)
    real(c_double), intent(in) :: T, P
    real(c_double), intent(inout) :: c
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_ideal_gas_c(T, P, c), stat, errmsg)
  end subroutine mcd_comp_ideal_gas_c

  !> Mass-fraction gradients, arrays (n_dim, n).
  subroutine mcd_comp_grad_x_to_w(n, n_dim, M, x, grad_x, grad_w, stat, errmsg)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: M(n), x(n), grad_x(n_dim, n)
    real(c_double), intent(inout) :: grad_w(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_grad_x_to_w(csz(n), csz(n_dim), M, x, grad_x, grad_w), &
         stat, errmsg)
  end subroutine mcd_comp_grad_x_to_w

  !> Mole-fraction gradients, arrays (n_dim, n).
  subroutine mcd_comp_grad_w_to_x(n, n_dim, M, w, grad_w, grad_x, stat, errmsg)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: M(n), w(n), grad_w(n_dim, n)
    real(c_double), intent(inout) :: grad_x(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_comp_grad_w_to_x(csz(n), csz(n_dim), M, w, grad_w, grad_x), &
         stat, errmsg)
  end subroutine mcd_comp_grad_w_to_x

  ! ==================================================================
  ! Binary diffusivities
  ! ==================================================================

  subroutine mcd_binary_fsg(T, P, MA, MB, VA, VB, D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, VA, VB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_fsg(T, P, MA, MB, VA, VB, D), stat, errmsg)
  end subroutine mcd_binary_fsg

  subroutine mcd_binary_chapman_enskog(T, P, MA, MB, sigA, sigB, epsA, epsB, D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, sigA, sigB, epsA, epsB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_chapman_enskog(T, P, MA, MB, sigA, sigB, epsA, epsB, D), &
         stat, errmsg)
  end subroutine mcd_binary_chapman_enskog

  !> Wilke-Lee from raw Lennard-Jones parameters (conventions of
  !> mcd_binary_chapman_enskog: sigA, sigB [m], epsA, epsB epsilon/k [K]).
  subroutine mcd_binary_wilke_lee(T, P, MA, MB, sigA, sigB, epsA, epsB, D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, sigA, sigB, epsA, epsB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_wilke_lee(T, P, MA, MB, sigA, sigB, epsA, epsB, D), &
         stat, errmsg)
  end subroutine mcd_binary_wilke_lee

  !> Chapman-Enskog with Brokaw's polar correction [m^2/s]: MA, MB
  !> [kg/mol], dipA, dipB dipole moments [C m], VbA, VbB molar volumes at
  !> the normal boiling point [m^3/mol], TbA, TbB normal boiling points [K].
  subroutine mcd_binary_brokaw(T, P, MA, MB, dipA, dipB, VbA, VbB, TbA, TbB, &
       D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, dipA, dipB, VbA, VbB, TbA, TbB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_brokaw(T, P, MA, MB, dipA, dipB, VbA, VbB, TbA, &
         TbB, D), stat, errmsg)
  end subroutine mcd_binary_brokaw

  !> Wilke-Chang infinite-dilution diffusivity [m^2/s] of a solute in a
  !> liquid: mu_solvent [Pa s] at T, M_solvent [kg/mol], phi association
  !> factor [-], Vb_solute molar volume at the normal boiling point [m^3/mol].
  subroutine mcd_binary_wilke_chang(T, mu_solvent, M_solvent, phi, Vb_solute, D, stat, errmsg)
    real(c_double), intent(in) :: T, mu_solvent, M_solvent, phi, Vb_solute
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_wilke_chang(T, mu_solvent, M_solvent, phi, Vb_solute, D), &
         stat, errmsg)
  end subroutine mcd_binary_wilke_chang

  subroutine mcd_binary_scale(D_ref, T_ref, P_ref, T, P, exponent, D, stat, errmsg)
    real(c_double), intent(in) :: D_ref, T_ref, P_ref, T, P, exponent
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_scale(D_ref, T_ref, P_ref, T, P, exponent, D), &
         stat, errmsg)
  end subroutine mcd_binary_scale

  !> Gas binary diffusivity [m^2/s] of species a and b (1-based) of db.
  subroutine mcd_db_binary_gas(db, a, b, method, T, P, D, stat, errmsg, rel_err, warn)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: a, b, method
    real(c_double), intent(in) :: T, P
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    real(c_double), target :: e
    integer(c_int), target :: w
    integer(c_int) :: s
    e = 0
    w = 0
    s = c_mcd_db_binary_gas(db%ptr, cidx(a), cidx(b), int(method, c_int), T, P, D, &
         c_loc(e), c_loc(w))
    call finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
  end subroutine mcd_db_binary_gas

  !> Wilke-Chang infinite-dilution diffusivity [m^2/s] of species solute in
  !> species solvent (1-based) of db; mu_solvent [Pa s] at T.
  subroutine mcd_db_binary_liquid(db, solute, solvent, T, mu_solvent, D, stat, errmsg, &
       rel_err, warn)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: solute, solvent
    real(c_double), intent(in) :: T, mu_solvent
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    real(c_double), target :: e
    integer(c_int), target :: w
    integer(c_int) :: s
    e = 0
    w = 0
    s = c_mcd_db_binary_liquid(db%ptr, cidx(solute), cidx(solvent), T, mu_solvent, D, &
         c_loc(e), c_loc(w))
    call finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
  end subroutine mcd_db_binary_liquid

  !> Typical error of method m widened by the MCD_WARN_* bits warn
  !> (MCD_WIDEN_* factors); NaN for MCD_METHOD_USER.
  subroutine mcd_typical_error_widened(m, warn, rel_err, stat, errmsg)
    integer, intent(in) :: m, warn
    real(c_double), intent(inout) :: rel_err
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_typical_error_widened(int(m, c_int), int(warn, c_int), v)
    if (s == 0) rel_err = v
    call finish(s, stat, errmsg)
  end subroutine mcd_typical_error_widened

  !> Intermediates of the estimate of species a and b (1-based; a the solute
  !> for MCD_METHOD_WILKE_CHANG) in values(MCD_EXPLAIN_COUNT): the C slot
  !> MCD_EXPLAIN_X is values(MCD_EXPLAIN_X + 1). Unused slots are NaN.
  subroutine mcd_db_binary_explain(db, a, b, method, T, P, mu_solvent, values, &
       stat, errmsg)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: a, b, method
    real(c_double), intent(in) :: T, P, mu_solvent
    real(c_double), intent(inout) :: values(MCD_EXPLAIN_COUNT)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_int) :: s
    s = c_mcd_db_binary_explain(db%ptr, cidx(a), cidx(b), int(method, c_int), &
         T, P, mu_solvent, values)
    call finish(s, stat, errmsg)
  end subroutine mcd_db_binary_explain

  ! ==================================================================
  ! Mixtures
  ! ==================================================================

  !> New mixture of the species named in names(:) (trailing blanks ignored).
  !> default_method defaults to MCD_METHOD_FSG.
  subroutine mcd_mixture_new(mix, db, names, stat, errmsg, default_method)
    type(mcd_mixture_t), intent(inout) :: mix
    type(mcd_db_t), intent(in) :: db
    character(len=*), intent(in) :: names(:)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: default_method
    character(kind=c_char), allocatable, target :: cnames(:, :)
    type(c_ptr), allocatable :: ptrs(:)
    type(c_ptr) :: p
    integer(c_int) :: m, s
    integer :: i, k, n, l

    call mix_final(mix)
    n = size(names)
    l = len(names)
    m = int(MCD_METHOD_FSG, c_int)
    if (present(default_method)) m = int(default_method, c_int)
    allocate (cnames(l + 1, max(n, 1)), ptrs(max(n, 1)))
    cnames = c_null_char
    do i = 1, n
       do k = 1, len_trim(names(i))
          cnames(k, i) = names(i)(k:k)
       end do
       ptrs(i) = c_loc(cnames(1, i))
    end do
    p = c_null_ptr
    s = c_mcd_mixture_new(db%ptr, int(n, c_size_t), ptrs, m, p)
    if (s == 0) mix%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_mixture_new

  integer function mcd_mixture_species_count(mix)
    type(mcd_mixture_t), intent(in) :: mix
    mcd_mixture_species_count = int(c_mcd_mixture_species_count(mix%ptr))
  end function mcd_mixture_species_count

  !> Name of species i (1-based), '' when out of range.
  function mcd_mixture_name(mix, i) result(s)
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: i
    character(len=:), allocatable :: s
    s = from_c(c_mcd_mixture_name(mix%ptr, cidx(i)))
  end function mcd_mixture_name

  !> Molar masses [kg/mol]; M must hold mcd_mixture_species_count(mix) values.
  subroutine mcd_mixture_molar_masses(mix, M, stat, errmsg)
    type(mcd_mixture_t), intent(in) :: mix
    real(c_double), intent(inout) :: M(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_mixture_molar_masses(mix%ptr, M), stat, errmsg)
  end subroutine mcd_mixture_molar_masses

  !> Use method m for pair (i, j), 1-based.
  subroutine mcd_mixture_set_method(mix, i, j, method, stat, errmsg)
    type(mcd_mixture_t), intent(inout) :: mix
    integer, intent(in) :: i, j, method
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_mixture_set_method(mix%ptr, cidx(i), cidx(j), &
         int(method, c_int)), stat, errmsg)
  end subroutine mcd_mixture_set_method

  !> Method of pair (i, j), 1-based: the one set, the one MCD_GAS_RECOMMENDED
  !> picked, or MCD_METHOD_USER for a given value (untouched on failure).
  subroutine mcd_mixture_pair_method(mix, i, j, method, stat, errmsg)
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: i, j
    integer, intent(inout) :: method
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_int) :: m, s
    m = 0
    s = c_mcd_mixture_pair_method(mix%ptr, cidx(i), cidx(j), m)
    if (s == 0) method = int(m)
    call finish(s, stat, errmsg)
  end subroutine mcd_mixture_pair_method

  !> Measured D [m^2/s] at (T_ref, P_ref) for pair (i, j), 1-based.
  subroutine mcd_mixture_set_binary(mix, i, j, D, T_ref, P_ref, stat, errmsg)
    type(mcd_mixture_t), intent(inout) :: mix
    integer, intent(in) :: i, j
    real(c_double), intent(in) :: D, T_ref, P_ref
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_mixture_set_binary(mix%ptr, cidx(i), cidx(j), D, T_ref, P_ref), &
         stat, errmsg)
  end subroutine mcd_mixture_set_binary

  !> Binary diffusivities at (T, P): D(n, n) symmetric, so the Fortran
  !> array equals the C matrix; rel_err(n, n) and warn(n, n) optional.
  subroutine mcd_mixture_binaries(mix, T, P, D, stat, errmsg, rel_err, warn)
    type(mcd_mixture_t), intent(in) :: mix
    real(c_double), intent(in) :: T, P
    real(c_double), intent(inout) :: D(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional, target :: rel_err(*)
    integer(c_int), intent(inout), optional, target :: warn(*)
    type(c_ptr) :: pe, pw
    pe = c_null_ptr
    pw = c_null_ptr
    if (present(rel_err)) pe = c_loc(rel_err(1))
    if (present(warn)) pw = c_loc(warn(1))
    call finish(c_mcd_mixture_binaries(mix%ptr, T, P, D, pe, pw), stat, errmsg)
  end subroutine mcd_mixture_binaries

  ! ==================================================================
  ! Workspaces
  ! ==================================================================

  !> Workspace for up to n_species species (what ws held is freed first).
  subroutine mcd_workspace_new(ws, n_species, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_species
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call ws_final(ws)
    p = c_null_ptr
    s = c_mcd_workspace_new(csz(n_species), p)
    if (s == 0) ws%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_new

  !> As mcd_workspace_new with the caller's allocator (copied by C).
  subroutine mcd_workspace_new_with(ws, n_species, allocator, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_species
    type(mcd_allocator_t), intent(in) :: allocator
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call ws_final(ws)
    p = c_null_ptr
    s = c_mcd_workspace_new_with(csz(n_species), allocator, p)
    if (s == 0) ws%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_new_with

  integer function mcd_workspace_capacity(ws)
    type(mcd_workspace_t), intent(in) :: ws
    mcd_workspace_capacity = int(c_mcd_workspace_capacity(ws%ptr))
  end function mcd_workspace_capacity

  !> Detail of the last failing call of this thread ('' after a success).
  function mcd_last_error() result(s)
    character(len=:), allocatable :: s
    s = from_c(c_mcd_last_error())
  end function mcd_last_error

  ! ==================================================================
  ! Diffusion fluxes
  ! ==================================================================

  !> Diffusion fluxes of n species at one state.
  !>   Dij(n, n) symmetric; comp(n); grad_comp(n_dim, n); flux(n_dim, n).
  !>   M(n) needed for MASS bases and pressure diffusion.
  !>   Gamma(n, n): pass the TRANSPOSE of the thermodynamic factor matrix
  !>   (Gamma(j, i) = Gamma_ij); absent = ideal. grad_lnP(n_dim) optional.
  !>   Thermal diffusion: kT(n) thermal diffusion ratios with grad_lnT(n_dim),
  !>   both or neither (mcd_thermal_ratios makes kT from D^T).
  subroutine mcd_flux_compute(ws, model, n, n_dim, Dij, c, comp_basis, comp, &
       grad_comp, flux_basis, flux, stat, errmsg, M, Gamma, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_dim, comp_basis, flux_basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n), grad_comp(n_dim, n)
    real(c_double), intent(in) :: c
    real(c_double), intent(inout) :: flux(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    real(c_double), intent(in), optional, target :: kT(n), grad_lnT(n_dim)
    type(mcd_state_t) :: st
    st%n_species = csz(n)
    st%n_dim = csz(n_dim)
    st%comp_basis = int(comp_basis, c_int)
    st%c = c
    st%Dij = c_loc(Dij)
    st%comp = c_loc(comp)
    st%grad = c_loc(grad_comp)
    if (present(M)) st%M = c_loc(M)
    if (present(Gamma)) st%Gamma = c_loc(Gamma)
    if (present(grad_lnP)) st%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) st%kT = c_loc(kT)
    if (present(grad_lnT)) st%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_compute(ws%ptr, int(model, c_int), st, &
         int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_compute

  !> Derivatives of the exact fluxes with respect to the mole fractions at
  !> fixed gradients: dJ(n, n_dim, n), dJ(k, d, i) = dJ_{i,d}/dx_k (the
  !> C array (N n_dim) x N read column-major). Arguments as mcd_flux_compute
  !> (mole fractions only).
  subroutine mcd_flux_jacobian_comp(ws, n, n_dim, Dij, c, comp, grad_comp, dJ, &
       stat, errmsg, M, Gamma, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in), target :: Dij(n, n), comp(n), grad_comp(n_dim, n)
    real(c_double), intent(in) :: c
    real(c_double), intent(inout) :: dJ(n, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    real(c_double), intent(in), optional, target :: kT(n), grad_lnT(n_dim)
    type(mcd_state_t) :: st
    st%n_species = csz(n)
    st%n_dim = csz(n_dim)
    st%comp_basis = int(MCD_BASIS_MOLE, c_int)
    st%c = c
    st%Dij = c_loc(Dij)
    st%comp = c_loc(comp)
    st%grad = c_loc(grad_comp)
    if (present(M)) st%M = c_loc(M)
    if (present(Gamma)) st%Gamma = c_loc(Gamma)
    if (present(grad_lnP)) st%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) st%kT = c_loc(kT)
    if (present(grad_lnT)) st%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_jacobian_comp(ws%ptr, st, dJ), stat, errmsg)
  end subroutine mcd_flux_jacobian_comp

  !> Derivatives of the fluxes of mcd_flux_compute (model MAXWELL_STEFAN or
  !> MIXTURE_AVERAGED, either basis) with respect to the input fractions at
  !> fixed gradients: dF(n, n_dim, n), dF(k, d, i) = dF_{i,d}/dy_k (the C
  !> array (N n_dim) x N read column-major). Arguments as mcd_flux_compute.
  subroutine mcd_flux_jacobian(ws, model, n, n_dim, Dij, c, comp_basis, comp, &
       grad_comp, flux_basis, dF, stat, errmsg, M, Gamma, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_dim, comp_basis, flux_basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n), grad_comp(n_dim, n)
    real(c_double), intent(in) :: c
    real(c_double), intent(inout) :: dF(n, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    real(c_double), intent(in), optional, target :: kT(n), grad_lnT(n_dim)
    type(mcd_state_t) :: st
    call jac_state(st, n, n_dim, Dij, c, comp_basis, comp, grad_comp, M, Gamma, &
         grad_lnP, kT, grad_lnT)
    call finish(c_mcd_flux_jacobian(ws%ptr, int(model, c_int), st, &
         int(flux_basis, c_int), dF), stat, errmsg)
  end subroutine mcd_flux_jacobian

  !> Derivatives of the fluxes with respect to T [K] and P [Pa] through
  !> c = P / (R T) and the caller's dDij_dT, dDij_dP (n, n; symmetric, so
  !> the transpose is the same): dF_dT(n_dim, n), dF_dP(n_dim, n). Both
  !> outputs are required here (pass zero matrices for no dependence).
  subroutine mcd_flux_jacobian_tp(ws, model, n, n_dim, Dij, c, comp_basis, comp, &
       grad_comp, flux_basis, T, P, dDij_dT, dDij_dP, dF_dT, dF_dP, stat, errmsg, &
       M, Gamma, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_dim, comp_basis, flux_basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n), grad_comp(n_dim, n)
    real(c_double), intent(in) :: c, T, P
    real(c_double), intent(in), target :: dDij_dT(n, n), dDij_dP(n, n)
    real(c_double), intent(inout), target :: dF_dT(n_dim, n), dF_dP(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    real(c_double), intent(in), optional, target :: kT(n), grad_lnT(n_dim)
    type(mcd_state_t) :: st
    call jac_state(st, n, n_dim, Dij, c, comp_basis, comp, grad_comp, M, Gamma, &
         grad_lnP, kT, grad_lnT)
    call finish(c_mcd_flux_jacobian_tp(ws%ptr, int(model, c_int), st, &
         int(flux_basis, c_int), T, P, c_loc(dDij_dT), c_loc(dDij_dP), &
         c_loc(dF_dT), c_loc(dF_dP)), stat, errmsg)
  end subroutine mcd_flux_jacobian_tp

  !> The mcd_state of the Jacobian wrappers.
  subroutine jac_state(st, n, n_dim, Dij, c, comp_basis, comp, grad_comp, M, Gamma, &
       grad_lnP, kT, grad_lnT)
    type(mcd_state_t), intent(out) :: st
    integer, intent(in) :: n, n_dim, comp_basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n), grad_comp(n_dim, n)
    real(c_double), intent(in) :: c
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    real(c_double), intent(in), optional, target :: kT(n), grad_lnT(n_dim)
    st%n_species = csz(n)
    st%n_dim = csz(n_dim)
    st%comp_basis = int(comp_basis, c_int)
    st%c = c
    st%Dij = c_loc(Dij)
    st%comp = c_loc(comp)
    st%grad = c_loc(grad_comp)
    if (present(M)) st%M = c_loc(M)
    if (present(Gamma)) st%Gamma = c_loc(Gamma)
    if (present(grad_lnP)) st%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) st%kT = c_loc(kT)
    if (present(grad_lnT)) st%grad_lnT = c_loc(grad_lnT)
  end subroutine jac_state

  !> Thermal diffusion ratios kT(n) from thermal diffusion coefficients
  !> DT(n) [kg/(m s)] at a state (M(n) required).
  subroutine mcd_thermal_ratios(ws, n, Dij, c, comp_basis, comp, M, DT, kT, &
       stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, comp_basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n), M(n)
    real(c_double), intent(in) :: c, DT(n)
    real(c_double), intent(inout) :: kT(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(mcd_state_t) :: st
    st%n_species = csz(n)
    st%comp_basis = int(comp_basis, c_int)
    st%c = c
    st%Dij = c_loc(Dij)
    st%comp = c_loc(comp)
    st%M = c_loc(M)
    call finish(c_mcd_thermal_ratios(ws%ptr, st, DT, kT), stat, errmsg)
  end subroutine mcd_thermal_ratios

  !> Generalized Fick matrix. D(n-1, n-1) receives the TRANSPOSE of [D]
  !> (D(j, i) = [D]_ij over the species other than the dependent one, in
  !> their order): use transpose(D), or J(:, others) = -c matmul(grad(:,
  !> others), D). dependent (1-based) absent = the most abundant species;
  !> dependent_used returns the one used (1-based).
  subroutine mcd_fick_matrix(ws, n, Dij, comp_basis, comp, basis, D, stat, errmsg, &
       M, Gamma, dependent, dependent_used)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, comp_basis, basis
    real(c_double), intent(in), target :: Dij(n, n), comp(n)
    real(c_double), intent(inout) :: D(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n)
    integer, intent(in), optional :: dependent
    integer, intent(inout), optional :: dependent_used
    integer(c_size_t), target :: used
    integer(c_size_t) :: dep
    type(mcd_state_t) :: st
    integer(c_int) :: s
    st%n_species = csz(n)
    st%comp_basis = int(comp_basis, c_int)
    st%Dij = c_loc(Dij)
    st%comp = c_loc(comp)
    if (present(M)) st%M = c_loc(M)
    if (present(Gamma)) st%Gamma = c_loc(Gamma)
    dep = MCD_DEPENDENT_AUTO
    if (present(dependent)) dep = cidx(dependent)
    used = 0
    s = c_mcd_fick_matrix(ws%ptr, st, int(basis, c_int), dep, D, c_loc(used))
    if (s == 0 .and. present(dependent_used)) dependent_used = int(used) + 1
    call finish(s, stat, errmsg)
  end subroutine mcd_fick_matrix

  !> Fluxes from a Fick matrix as returned by mcd_fick_matrix (the
  !> transposed layout is what C expects: pass D unchanged). grad and flux
  !> are (n_dim, n); dependent is 1-based.
  subroutine mcd_fick_fluxes(n, n_dim, D, dependent, conc, grad, flux, stat, errmsg)
    integer, intent(in) :: n, n_dim, dependent
    real(c_double), intent(in) :: D(*), conc, grad(n_dim, n)
    real(c_double), intent(inout) :: flux(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_fick_fluxes(csz(n), csz(n_dim), D, cidx(dependent), conc, &
         grad, flux), stat, errmsg)
  end subroutine mcd_fick_fluxes

  !> Eigenvalues of an m x m Fick matrix (either layout: a matrix and its
  !> transpose have the same eigenvalues), sorted by decreasing real part.
  subroutine mcd_fick_eigenvalues(ws, m, D, re, im, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: m
    real(c_double), intent(in) :: D(*)
    real(c_double), intent(inout) :: re(*), im(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_fick_eigenvalues(ws%ptr, csz(m), D, re, im), stat, errmsg)
  end subroutine mcd_fick_eigenvalues

  ! ==================================================================
  ! Frames and total fluxes
  ! ==================================================================

  !> Convert diffusion fluxes between MOLE and MASS bases (n_dim, n).
  subroutine mcd_flux_convert(n, n_dim, M, x, from, flux_in, to, flux_out, stat, errmsg)
    integer, intent(in) :: n, n_dim, from, to
    real(c_double), intent(in) :: M(n), x(n), flux_in(n_dim, n)
    real(c_double), intent(inout) :: flux_out(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_flux_convert(csz(n), csz(n_dim), M, x, int(from, c_int), &
         flux_in, int(to, c_int), flux_out), stat, errmsg)
  end subroutine mcd_flux_convert

  !> Molar fluxes J(n_dim, n) relative to the volume-average velocity:
  !> JV(:, i) = J(:, i) - c x(i) sum_k Vbar(k) J(:, k); partial molar volumes
  !> Vbar(n) [m^3/mol] with sum x Vbar = 1/c.
  subroutine mcd_flux_to_volume_frame(n, n_dim, c, x, Vbar, J, JV, stat, errmsg)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: c, x(n), Vbar(n), J(n_dim, n)
    real(c_double), intent(inout) :: JV(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_flux_to_volume_frame(csz(n), csz(n_dim), c, x, Vbar, J, JV), &
         stat, errmsg)
  end subroutine mcd_flux_to_volume_frame

  !> Molar fluxes J(n_dim, n) relative to the velocity of species k
  !> (1-based, x(k) > 0): Jk(:, i) = J(:, i) - x(i) J(:, k) / x(k).
  subroutine mcd_flux_to_species_frame(n, n_dim, x, J, k, Jk, stat, errmsg)
    integer, intent(in) :: n, n_dim, k
    real(c_double), intent(in) :: x(n), J(n_dim, n)
    real(c_double), intent(inout) :: Jk(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_flux_to_species_frame(csz(n), csz(n_dim), x, J, cidx(k), Jk), &
         stat, errmsg)
  end subroutine mcd_flux_to_species_frame

  !> Mass- minus molar-average velocity [m/s], v_minus_u(n_dim), from molar
  !> diffusion fluxes J(n_dim, n): (1/rho) sum_k M(k) J(:, k), rho = c Mbar.
  subroutine mcd_flux_velocity_difference(n, n_dim, M, c, x, J, v_minus_u, stat, errmsg)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: M(n), c, x(n), J(n_dim, n)
    real(c_double), intent(inout) :: v_minus_u(n_dim)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_flux_velocity_difference(csz(n), csz(n_dim), M, c, x, J, v_minus_u), &
         stat, errmsg)
  end subroutine mcd_flux_velocity_difference

  !> Total fluxes from diffusion fluxes and a bootstrap condition.
  !>   species: 1-based (STAGNANT); values: N_t(n_dim) for TOTAL, nu(n) for
  !>   WEIGHTS; bulk(n_dim) optional output.
  subroutine mcd_flux_total(n, n_dim, basis, comp, diff, kind, total, stat, errmsg, &
       species, values, bulk)
    integer, intent(in) :: n, n_dim, basis, kind
    real(c_double), intent(in) :: comp(n), diff(n_dim, n)
    real(c_double), intent(inout) :: total(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: species
    real(c_double), intent(in), optional, target :: values(*)
    real(c_double), intent(inout), optional, target :: bulk(n_dim)
    type(c_ptr) :: pv, pb
    integer(c_size_t) :: k
    pv = c_null_ptr
    pb = c_null_ptr
    if (present(values)) pv = c_loc(values(1))
    if (present(bulk)) pb = c_loc(bulk)
    k = 0
    if (present(species)) k = cidx(species)
    call finish(c_mcd_flux_total(csz(n), csz(n_dim), int(basis, c_int), comp, diff, &
         int(kind, c_int), k, pv, total, pb), stat, errmsg)
  end subroutine mcd_flux_total

  !> Project fluxes (n_dim, n) onto the zero-sum in place; weights(n)
  !> optional (absent = orthogonal projection); residual(n_dim) optional.
  subroutine mcd_flux_project(n, n_dim, flux, stat, errmsg, weights, residual)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(inout) :: flux(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: weights(n)
    real(c_double), intent(inout), optional, target :: residual(n_dim)
    type(c_ptr) :: pw, pr
    pw = c_null_ptr
    pr = c_null_ptr
    if (present(weights)) pw = c_loc(weights)
    if (present(residual)) pr = c_loc(residual)
    call finish(c_mcd_flux_project(csz(n), csz(n_dim), pw, flux, pr), stat, errmsg)
  end subroutine mcd_flux_project

  !> Coupling flags (MCD_DIAG_* bits) per species; grad and flux (n_dim, n).
  subroutine mcd_flux_diagnose(n, n_dim, grad, flux, rel_tol, flags, stat, errmsg)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: grad(n_dim, n), flux(n_dim, n), rel_tol
    integer(c_int), intent(inout) :: flags(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_flux_diagnose(csz(n), csz(n_dim), grad, flux, rel_tol, flags), &
         stat, errmsg)
  end subroutine mcd_flux_diagnose

  ! ==================================================================
  ! Mass transfer
  ! ==================================================================

  !> Steady fluxes N(n) [mol/(m^2 s)] through a film between x0 and xL.
  !>   species: 1-based (STAGNANT, RATIOS); values: N_t(1) for TOTAL, nu(n)
  !>   for WEIGHTS, z(n) for RATIOS; method defaults to MCD_FILM_EXACT.
  subroutine mcd_film_solve(ws, n, Dij, c, L, x0, xL, kind, N_flux, stat, errmsg, &
       species, values, method, iterations, residual)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, kind
    real(c_double), intent(in), target :: Dij(n, n), x0(n), xL(n)
    real(c_double), intent(in) :: c, L
    real(c_double), intent(inout) :: N_flux(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: species, method
    real(c_double), intent(in), optional, target :: values(*)
    integer, intent(inout), optional :: iterations
    real(c_double), intent(inout), optional :: residual
    integer(c_size_t), target :: it
    real(c_double), target :: res
    type(c_ptr) :: pv
    integer(c_size_t) :: k
    integer(c_int) :: meth, s
    pv = c_null_ptr
    if (present(values)) pv = c_loc(values(1))
    k = 0
    if (present(species)) k = cidx(species)
    meth = int(MCD_FILM_EXACT, c_int)
    if (present(method)) meth = int(method, c_int)
    it = 0
    res = 0
    s = c_mcd_film_solve(ws%ptr, film_of(n, Dij, c, L, x0, xL), int(kind, c_int), &
         k, pv, meth, N_flux, c_loc(it), c_loc(res))
    if (s == 0) then
       if (present(iterations)) iterations = int(it)
       if (present(residual)) residual = res
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_film_solve

  !> Film composition profile: x(n, n_points), x(:, k) at position z(k).
  subroutine mcd_film_profile(ws, n, Dij, c, L, x0, N_flux, n_points, z, x, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, n_points
    real(c_double), intent(in), target :: Dij(n, n), x0(n)
    real(c_double), intent(in) :: c, L, N_flux(n), z(*)
    real(c_double), intent(inout) :: x(n, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_film_profile(ws%ptr, film_of(n, Dij, c, L, x0, x0), N_flux, &
         csz(n_points), z, x), stat, errmsg)
  end subroutine mcd_film_profile

  !> Two-bulb cell by the linearized theory: bulbs of volumes V1, V2 [m^3]
  !> joined by a capillary of cross-section A [m^2] and length L [m];
  !> x1_0(n), x2_0(n) initial mole fractions; x1(n, n_times) and
  !> x2(n, n_times) the compositions at times t(n_times) [s], x1(:, k) at t(k).
  subroutine mcd_bulbs_linearized(ws, n, Dij, c, V1, V2, A, L, x1_0, x2_0, n_times, t, &
       x1, x2, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, n_times
    real(c_double), intent(in), target :: Dij(n, n), x1_0(n), x2_0(n)
    real(c_double), intent(in) :: c, V1, V2, A, L
    real(c_double), intent(in) :: t(*)
    real(c_double), intent(inout) :: x1(n, *), x2(n, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_bulbs_linearized(ws%ptr, &
         bulbs_of(n, Dij, c, V1, V2, A, L, x1_0, x2_0), csz(n_times), t, x1, x2), &
         stat, errmsg)
  end subroutine mcd_bulbs_linearized

  !> Two-bulb cell by time integration of the exact equimolar film flux
  !> (local error tolerance rel_tol in [1e-12, 1e-2]); t non-decreasing;
  !> other arguments as in mcd_bulbs_linearized.
  subroutine mcd_bulbs_integrate(ws, n, Dij, c, V1, V2, A, L, x1_0, x2_0, n_times, t, &
       rel_tol, x1, x2, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, n_times
    real(c_double), intent(in), target :: Dij(n, n), x1_0(n), x2_0(n)
    real(c_double), intent(in) :: c, V1, V2, A, L
    real(c_double), intent(in) :: t(*), rel_tol
    real(c_double), intent(inout) :: x1(n, *), x2(n, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_bulbs_integrate(ws%ptr, &
         bulbs_of(n, Dij, c, V1, V2, A, L, x1_0, x2_0), csz(n_times), t, rel_tol, &
         x1, x2), stat, errmsg)
  end subroutine mcd_bulbs_integrate

  ! ==================================================================
  ! Gas viscosity
  ! ==================================================================

  !> Neufeld-Janzen-Aziz Omega(2,2)* at T* = k T / eps.
  subroutine mcd_viscosity_omega22(T_star, omega, stat, errmsg)
    real(c_double), intent(in) :: T_star
    real(c_double), intent(inout) :: omega
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_viscosity_omega22(T_star, omega), stat, errmsg)
  end subroutine mcd_viscosity_omega22

  !> Pure-gas viscosity mu [Pa s] by Chapman-Enskog: T [K], M [kg/mol],
  !> sigma [m], eps_k epsilon/k [K].
  subroutine mcd_viscosity_chapman_enskog(T, M, sigma, eps_k, mu, stat, errmsg)
    real(c_double), intent(in) :: T, M, sigma, eps_k
    real(c_double), intent(inout) :: mu
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_viscosity_chapman_enskog(T, M, sigma, eps_k, mu), stat, errmsg)
  end subroutine mcd_viscosity_chapman_enskog

  !> Mixture viscosity mu_mix [Pa s] by Wilke's rule from M(n), the species'
  !> viscosities mu(n) [Pa s] and mole fractions x(n).
  subroutine mcd_viscosity_wilke(n, M, mu, x, mu_mix, stat, errmsg)
    integer, intent(in) :: n
    real(c_double), intent(in) :: M(n), mu(n), x(n)
    real(c_double), intent(inout) :: mu_mix
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_viscosity_wilke(csz(n), M, mu, x, mu_mix), stat, errmsg)
  end subroutine mcd_viscosity_wilke

  !> Viscosity mu [Pa s] of species i (1-based) of db at T [K].
  subroutine mcd_db_viscosity_gas(db, i, T, mu, stat, errmsg, rel_err, warn)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: i
    real(c_double), intent(in) :: T
    real(c_double), intent(inout) :: mu
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    real(c_double), target :: e
    integer(c_int), target :: w
    integer(c_int) :: s
    e = 0
    w = 0
    s = c_mcd_db_viscosity_gas(db%ptr, cidx(i), T, mu, c_loc(e), c_loc(w))
    call finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
  end subroutine mcd_db_viscosity_gas

  !> Viscosities mu(n) [Pa s] of the species of a mixture at T [K]; warn is
  !> the OR of their warning bits.
  subroutine mcd_mixture_viscosities(mix, T, mu, stat, errmsg, warn)
    type(mcd_mixture_t), intent(in) :: mix
    real(c_double), intent(in) :: T
    real(c_double), intent(inout) :: mu(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(inout), optional :: warn
    integer(c_int), target :: w
    integer(c_int) :: s
    w = 0
    s = c_mcd_mixture_viscosities(mix%ptr, T, mu, c_loc(w))
    if (s == 0 .and. present(warn)) warn = int(w)
    call finish(s, stat, errmsg)
  end subroutine mcd_mixture_viscosities

  !> Lennard-Jones collision integrals omega(4) = Omega(1,1)*, Omega(1,2)*,
  !> Omega(1,3)*, Omega(2,2)* and ratios(3) = A*, B*, C* at T_star in
  !> 0.3..100.
  subroutine mcd_lj_collision_integrals(T_star, omega, ratios, stat, errmsg)
    real(c_double), intent(in) :: T_star
    real(c_double), intent(inout), target :: omega(4), ratios(3)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_lj_collision_integrals(T_star, c_loc(omega), &
         c_loc(ratios)), stat, errmsg)
  end subroutine mcd_lj_collision_integrals

  !> Binary thermal diffusion factor alpha [-] (first Chapman-Enskog
  !> approximation) from molar masses M1, M2 [kg/mol], x1 and the
  !> collision quantities A, B, C, R1, R2.
  subroutine mcd_thermal_factor_kinetic(M1, M2, x1, A, B, C, R1, R2, alpha, &
       stat, errmsg)
    real(c_double), intent(in) :: M1, M2, x1, A, B, C, R1, R2
    real(c_double), intent(inout) :: alpha
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_thermal_factor_kinetic(M1, M2, x1, A, B, C, R1, R2, &
         alpha), stat, errmsg)
  end subroutine mcd_thermal_factor_kinetic

  !> Binary thermal diffusion factor alpha [-] of two Lennard-Jones gases:
  !> T [K], M [kg/mol], sigma [m], eps epsilon/k [K], x1 [-].
  subroutine mcd_thermal_factor_ce(T, M1, M2, sig1, sig2, eps1, eps2, x1, &
       alpha, stat, errmsg, warn)
    real(c_double), intent(in) :: T, M1, M2, sig1, sig2, eps1, eps2, x1
    real(c_double), intent(inout) :: alpha
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(inout), optional :: warn
    integer(c_int), target :: w
    integer(c_int) :: s
    w = 0
    s = c_mcd_thermal_factor_ce(T, M1, M2, sig1, sig2, eps1, eps2, x1, alpha, &
         c_loc(w))
    if (s == 0 .and. present(warn)) warn = int(w)
    call finish(s, stat, errmsg)
  end subroutine mcd_thermal_factor_ce

  !> Thermal diffusion factor alpha [-] of species a and b (1-based) of db
  !> at T [K] and mole fraction x_a of a.
  subroutine mcd_db_thermal_factor(db, a, b, T, x_a, alpha, stat, errmsg, &
       rel_err, warn)
    type(mcd_db_t), intent(in) :: db
    integer, intent(in) :: a, b
    real(c_double), intent(in) :: T, x_a
    real(c_double), intent(inout) :: alpha
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    real(c_double), target :: e
    integer(c_int), target :: w
    integer(c_int) :: s
    e = 0
    w = 0
    s = c_mcd_db_thermal_factor(db%ptr, cidx(a), cidx(b), T, x_a, alpha, &
         c_loc(e), c_loc(w))
    call finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
  end subroutine mcd_db_thermal_factor

  !> Thermal diffusion ratios kT(n) and theta(n) = kT / x of a mixture at
  !> T [K] and mole fractions x(n) (pairwise first approximations).
  subroutine mcd_mixture_thermal_ratios(mix, T, x, kT, theta, stat, errmsg, &
       rel_err, warn)
    type(mcd_mixture_t), intent(in) :: mix
    real(c_double), intent(in) :: T, x(*)
    real(c_double), intent(inout) :: kT(*)
    real(c_double), intent(inout), target :: theta(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: rel_err
    integer, intent(inout), optional :: warn
    real(c_double), target :: e
    integer(c_int), target :: w
    integer(c_int) :: s
    e = 0
    w = 0
    s = c_mcd_mixture_thermal_ratios(mix%ptr, T, x, kT, c_loc(theta), &
         c_loc(e), c_loc(w))
    call finish_estimate(s, e, w, stat, errmsg, rel_err, warn)
  end subroutine mcd_mixture_thermal_ratios

  !> Dufour heat flux q(n_dim) [W/m^2] from fluxes flux(n_dim, n) (species
  !> in the second index) in flux_basis, mole fractions x(n), molar masses
  !> M(n) [kg/mol], theta(n) = kT / x and T [K].
  subroutine mcd_dufour_heat_flux(n, n_dim, x, M, theta, T, flux_basis, &
       flux, q, stat, errmsg)
    integer, intent(in) :: n, n_dim, flux_basis
    real(c_double), intent(in) :: x(n), theta(n), T, flux(n_dim, n)
    real(c_double), intent(in), target :: M(n)
    real(c_double), intent(inout) :: q(n_dim)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_dufour_heat_flux(csz(n), csz(n_dim), x, c_loc(M), &
         theta, T, int(flux_basis, c_int), flux, q), stat, errmsg)
  end subroutine mcd_dufour_heat_flux

  !> Dufour heat flux of n_cells cells (mcd_dufour_heat_flux_batch), arrays
  !> with the cell in the first index as mcd_flux_batch_dij: x(n_cells, n),
  !> theta(n_cells, n), T(n_cells) [K], flux(n_cells, n_dim, n) in
  !> flux_basis, M(n) [kg/mol] (mass fluxes); q(n_cells, n_dim) [W/m^2].
  subroutine mcd_dufour_heat_flux_batch(n, n_cells, n_dim, x, M, theta, T, &
       flux_basis, flux, q, stat, errmsg)
    integer, intent(in) :: n, n_cells, n_dim, flux_basis
    real(c_double), intent(in) :: x(n_cells, n), theta(n_cells, n), T(n_cells)
    real(c_double), intent(in) :: flux(n_cells, n_dim, n)
    real(c_double), intent(in), target :: M(n)
    real(c_double), intent(inout) :: q(n_cells, n_dim)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_dufour_heat_flux_batch(csz(n), csz(n_cells), csz(n_dim), &
         x, c_loc(M), theta, T, int(flux_basis, c_int), flux, q), stat, errmsg)
  end subroutine mcd_dufour_heat_flux_batch

  ! ==================================================================
  ! Porous media
  ! ==================================================================

  !> Permeability B0 [m^2] of a pore structure (given, or from d_pore).
  subroutine mcd_pore_permeability(pore, B0, stat, errmsg)
    type(mcd_pore_t), intent(in) :: pore
    real(c_double), intent(inout) :: B0
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_pore_permeability(pore, B0), stat, errmsg)
  end subroutine mcd_pore_permeability

  !> Effective diffusivity De = (porosity/tortuosity) D [m^2/s].
  subroutine mcd_pore_effective(pore, D, De, stat, errmsg)
    type(mcd_pore_t), intent(in) :: pore
    real(c_double), intent(in) :: D
    real(c_double), intent(inout) :: De
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_pore_effective(pore, D, De), stat, errmsg)
  end subroutine mcd_pore_effective

  !> Knudsen diffusivity DK [m^2/s] at T [K] of molar mass M [kg/mol] in a
  !> pore of diameter d_pore [m].
  subroutine mcd_knudsen_diffusivity(T, M, d_pore, DK, stat, errmsg)
    real(c_double), intent(in) :: T, M, d_pore
    real(c_double), intent(inout) :: DK
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_knudsen_diffusivity(T, M, d_pore, DK), stat, errmsg)
  end subroutine mcd_knudsen_diffusivity

  !> Bosanquet interpolation 1/D = 1/D_m + 1/D_K [m^2/s].
  subroutine mcd_bosanquet(D_m, D_K, D, stat, errmsg)
    real(c_double), intent(in) :: D_m, D_K
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_bosanquet(D_m, D_K, D), stat, errmsg)
  end subroutine mcd_bosanquet

  !> Dusty Gas Model fluxes N_flux(n_dim, n) [mol/(m^2 s)] at one state:
  !> T [K], P [Pa], mu mixture viscosity [Pa s], M(n), Dij(n, n) open-gas
  !> binary diffusivities, x(n), grad_x(n_dim, n) [1/m]; grad_P(n_dim)
  !> [Pa/m] optional (absent = uniform pressure).
  subroutine mcd_dgm_fluxes(ws, pore, n, n_dim, T, P, mu, M, Dij, x, grad_x, N_flux, &
       stat, errmsg, grad_P)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: T, P, mu
    real(c_double), intent(in), target :: M(n), Dij(n, n), x(n), grad_x(n_dim, n)
    real(c_double), intent(inout) :: N_flux(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_P(n_dim)
    type(mcd_dgm_t) :: g
    g = dgm_of(n, n_dim, T, P, mu, M, Dij, x)
    g%grad_x = c_loc(grad_x)
    if (present(grad_P)) g%grad_P = c_loc(grad_P)
    call finish(c_mcd_dgm_fluxes(ws%ptr, pore, g, N_flux), stat, errmsg)
  end subroutine mcd_dgm_fluxes

  !> Dusty Gas Model with the total flux N_t(n_dim) given (0: closed end):
  !> fluxes N_flux(n_dim, n) and the pressure gradient grad_P(n_dim) [Pa/m].
  subroutine mcd_dgm_closed(ws, pore, n, n_dim, T, P, mu, M, Dij, x, grad_x, N_t, &
       N_flux, grad_P, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: T, P, mu, N_t(n_dim)
    real(c_double), intent(in), target :: M(n), Dij(n, n), x(n), grad_x(n_dim, n)
    real(c_double), intent(inout) :: N_flux(n_dim, n), grad_P(n_dim)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(mcd_dgm_t) :: g
    g = dgm_of(n, n_dim, T, P, mu, M, Dij, x)
    g%grad_x = c_loc(grad_x)
    call finish(c_mcd_dgm_closed(ws%ptr, pore, g, N_t, N_flux, grad_P), stat, errmsg)
  end subroutine mcd_dgm_closed

  !> Inverse Dusty Gas Model: the gradients grad_x(n_dim, n) [1/m] and
  !> grad_P(n_dim) [Pa/m] that carry the fluxes N_flux(n_dim, n).
  subroutine mcd_dgm_gradients(ws, pore, n, n_dim, T, P, mu, M, Dij, x, N_flux, &
       grad_x, grad_P, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: T, P, mu, N_flux(n_dim, n)
    real(c_double), intent(in), target :: M(n), Dij(n, n), x(n)
    real(c_double), intent(inout) :: grad_x(n_dim, n), grad_P(n_dim)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_dgm_gradients(ws%ptr, pore, dgm_of(n, n_dim, T, P, mu, M, Dij, x), &
         N_flux, grad_x, grad_P), stat, errmsg)
  end subroutine mcd_dgm_gradients

  !> Dusty Gas Model fluxes of n_cells cells (SoA layout, as
  !> mcd_flux_batch_dij): T, P, mu(n_cells); Dij(n_cells, n, n);
  !> x(n_cells, n); grad_x and N_flux (n_cells, n_dim, n); grad_P(n_cells,
  !> n_dim) optional (absent = uniform pressure); M(n) shared.
  subroutine mcd_dgm_fluxes_batch(ws, pore, n, M, n_cells, n_dim, T, P, mu, Dij, x, &
       grad_x, N_flux, stat, errmsg, grad_P)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, n_cells, n_dim
    real(c_double), intent(in) :: M(n)
    real(c_double), intent(in), target :: T(n_cells), P(n_cells), mu(n_cells)
    real(c_double), intent(in), target :: Dij(n_cells, n, n), x(n_cells, n)
    real(c_double), intent(in), target :: grad_x(n_cells, n_dim, n)
    real(c_double), intent(inout) :: N_flux(n_cells, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_P(n_cells, n_dim)
    type(mcd_dgm_cells_t) :: cl
    cl%n_cells = csz(n_cells)
    cl%n_dim = csz(n_dim)
    cl%T = c_loc(T)
    cl%P = c_loc(P)
    cl%mu = c_loc(mu)
    cl%Dij = c_loc(Dij)
    cl%x = c_loc(x)
    cl%grad_x = c_loc(grad_x)
    if (present(grad_P)) cl%grad_P = c_loc(grad_P)
    call finish(c_mcd_dgm_fluxes_batch(ws%ptr, pore, csz(n), M, cl, N_flux), stat, errmsg)
  end subroutine mcd_dgm_fluxes_batch

  !> Steady Dusty Gas Model fluxes N_flux(n) through a porous slab of
  !> thickness L [m] between (x0, P0) and (xL, PL); Dij(n, n) open-gas
  !> binary diffusivities at P_ref [Pa]; mu [Pa s] constant; kind
  !> MCD_SLAB_PRESSURES, _STAGNANT (species, 1-based) or _TOTAL (value =
  !> sum N); PL_out the pressure at z = L.
  subroutine mcd_slab_solve(ws, pore, n, T, mu, L, P_ref, M, Dij, x0, P0, xL, PL, kind, &
       N_flux, stat, errmsg, species, value, PL_out, iterations)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, kind
    real(c_double), intent(in) :: T, mu, L, P_ref, P0, PL
    real(c_double), intent(in), target :: M(n), Dij(n, n), x0(n), xL(n)
    real(c_double), intent(inout) :: N_flux(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: species
    real(c_double), intent(in), optional :: value
    real(c_double), intent(inout), optional :: PL_out
    integer, intent(inout), optional :: iterations
    real(c_double), target :: pl_c
    integer(c_size_t), target :: it
    integer(c_size_t) :: k
    real(c_double) :: v
    integer(c_int) :: s
    k = 0
    if (present(species)) k = cidx(species)
    v = 0
    if (present(value)) v = value
    pl_c = 0
    it = 0
    s = c_mcd_slab_solve(ws%ptr, pore, slab_of(n, T, mu, L, P_ref, M, Dij, x0, P0, xL, PL), &
         int(kind, c_int), k, v, N_flux, c_loc(pl_c), c_loc(it))
    call finish_slab(s, pl_c, it, stat, errmsg, PL_out, iterations)
  end subroutine mcd_slab_solve

  !> The optional outputs of a slab solve (on success) and its status.
  subroutine finish_slab(s, pl_c, it, stat, errmsg, PL_out, iterations)
    integer(c_int), intent(in) :: s
    real(c_double), intent(in) :: pl_c
    integer(c_size_t), intent(in) :: it
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: PL_out
    integer, intent(inout), optional :: iterations
    if (s == 0) then
       if (present(PL_out)) PL_out = pl_c
       if (present(iterations)) iterations = int(it)
    end if
    call finish(s, stat, errmsg)
  end subroutine finish_slab

  !> Steady slab fluxes in given ratios, N_flux = ratios * N_t (sum of
  !> ratios 1), matching xL(species) (1-based) at z = L; PL_out the
  !> resulting pressure there. Other arguments as mcd_slab_solve.
  subroutine mcd_slab_solve_ratios(ws, pore, n, T, mu, L, P_ref, M, Dij, x0, P0, xL, &
       species, ratios, N_flux, stat, errmsg, PL_out, iterations)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, species
    real(c_double), intent(in) :: T, mu, L, P_ref, P0, ratios(n)
    real(c_double), intent(in), target :: M(n), Dij(n, n), x0(n), xL(n)
    real(c_double), intent(inout) :: N_flux(n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: PL_out
    integer, intent(inout), optional :: iterations
    real(c_double), target :: pl_c
    integer(c_size_t), target :: it
    integer(c_int) :: s
    pl_c = 0
    it = 0
    s = c_mcd_slab_solve_ratios(ws%ptr, pore, slab_of(n, T, mu, L, P_ref, M, Dij, x0, P0, &
         xL, P0), cidx(species), ratios, N_flux, c_loc(pl_c), c_loc(it))
    call finish_slab(s, pl_c, it, stat, errmsg, PL_out, iterations)
  end subroutine mcd_slab_solve_ratios

  !> Slab profile for fluxes N_flux(n): x(n, n_points) and P(n_points) at
  !> positions z(n_points) [m].
  subroutine mcd_slab_profile(ws, pore, n, T, mu, L, P_ref, M, Dij, x0, P0, N_flux, &
       n_points, z, x, P, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_pore_t), intent(in) :: pore
    integer, intent(in) :: n, n_points
    real(c_double), intent(in) :: T, mu, L, P_ref, P0, N_flux(n), z(*)
    real(c_double), intent(in), target :: M(n), Dij(n, n), x0(n)
    real(c_double), intent(inout) :: x(n, *), P(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_slab_profile(ws%ptr, pore, &
         slab_of(n, T, mu, L, P_ref, M, Dij, x0, P0, x0, P0), N_flux, csz(n_points), z, &
         x, P), stat, errmsg)
  end subroutine mcd_slab_profile

  !> A porous slab (C: mcd_slab) over the caller's arrays.
  function slab_of(n, T, mu, L, P_ref, M, Dij, x0, P0, xL, PL) result(sl)
    integer, intent(in) :: n
    real(c_double), intent(in) :: T, mu, L, P_ref, P0, PL
    real(c_double), intent(in), target :: M(n), Dij(n, n), x0(n), xL(n)
    type(mcd_slab_t) :: sl
    sl%n_species = csz(n)
    sl%T = T
    sl%mu = mu
    sl%L = L
    sl%P_ref = P_ref
    sl%M = c_loc(M)
    sl%Dij = c_loc(Dij)
    sl%x0 = c_loc(x0)
    sl%P0 = P0
    sl%xL = c_loc(xL)
    sl%PL = PL
  end function slab_of

  !> A Dusty Gas Model state (C: mcd_dgm) over the caller's arrays; grad_x
  !> and grad_P are left NULL.
  function dgm_of(n, n_dim, T, P, mu, M, Dij, x) result(g)
    integer, intent(in) :: n, n_dim
    real(c_double), intent(in) :: T, P, mu
    real(c_double), intent(in), target :: M(n), Dij(n, n), x(n)
    type(mcd_dgm_t) :: g
    g%n_species = csz(n)
    g%n_dim = csz(n_dim)
    g%T = T
    g%P = P
    g%mu = mu
    g%M = c_loc(M)
    g%Dij = c_loc(Dij)
    g%x = c_loc(x)
  end function dgm_of

  ! ==================================================================
  ! Batched fluxes (layout: see the module header)
  ! ==================================================================

  !> A film (C: mcd_film) over the caller's arrays.
  function film_of(n, Dij, c, L, x0, xL) result(f)
    integer, intent(in) :: n
    real(c_double), intent(in), target :: Dij(n, n), x0(n), xL(n)
    real(c_double), intent(in) :: c, L
    type(mcd_film_t) :: f
    f%n_species = csz(n)
    f%c = c
    f%L = L
    f%Dij = c_loc(Dij)
    f%x0 = c_loc(x0)
    f%xL = c_loc(xL)
  end function film_of

  !> A two-bulb cell (C: mcd_bulbs) over the caller's arrays.
  function bulbs_of(n, Dij, c, V1, V2, A, L, x1_0, x2_0) result(b)
    integer, intent(in) :: n
    real(c_double), intent(in), target :: Dij(n, n), x1_0(n), x2_0(n)
    real(c_double), intent(in) :: c, V1, V2, A, L
    type(mcd_bulbs_t) :: b
    b%n_species = csz(n)
    b%c = c
    b%V1 = V1
    b%V2 = V2
    b%A = A
    b%L = L
    b%Dij = c_loc(Dij)
    b%x1_0 = c_loc(x1_0)
    b%x2_0 = c_loc(x2_0)
  end function bulbs_of

  !> The per-cell inputs shared by the batched calls (C: mcd_cells).
  subroutine set_cells(cells, n_cells, n_dim, comp_basis, comp, grad)
    type(mcd_cells_t), intent(out) :: cells
    integer, intent(in) :: n_cells, n_dim, comp_basis
    type(c_ptr), intent(in) :: comp, grad
    cells%n_cells = csz(n_cells)
    cells%n_dim = csz(n_dim)
    cells%comp_basis = int(comp_basis, c_int)
    cells%comp = comp
    cells%grad = grad
    cells%grad_lnP = c_null_ptr
  end subroutine set_cells

  !> Fluxes of a mixture at n_cells states, structure-of-arrays layout:
  !> T(n_cells), P(n_cells), comp(n_cells, N), grad(n_cells, n_dim, N),
  !> flux(n_cells, n_dim, N), grad_lnP(n_cells, n_dim) optional, thermal
  !> diffusion kT(n_cells, N) with grad_lnT(n_cells, n_dim) optional;
  !> N = mcd_mixture_species_count(mix). On a cell error other cells' fluxes may
  !> already be written (errmsg names the lowest failing cell).
  subroutine mcd_flux_batch(ws, mix, model, n_cells, n_dim, T, P, comp_basis, comp, &
       grad, flux_basis, flux, stat, errmsg, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: model, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: T(n_cells), P(n_cells)
    real(c_double), intent(in), target :: comp(n_cells, *), grad(n_cells, n_dim, *)
    real(c_double), intent(inout) :: flux(n_cells, n_dim, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_lnP(n_cells, n_dim)
    real(c_double), intent(in), optional, target :: kT(n_cells, *), grad_lnT(n_cells, n_dim)
    type(mcd_cells_t) :: cells
    call set_cells(cells, n_cells, n_dim, comp_basis, c_loc(comp), c_loc(grad))
    if (present(grad_lnP)) cells%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) cells%kT = c_loc(kT)
    if (present(grad_lnT)) cells%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_batch(ws%ptr, mix%ptr, int(model, c_int), T, P, &
         cells, int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch

  !> Batched fluxes with the caller's binary diffusivities Dij(n_cells, n, n)
  !> and concentrations c(n_cells); comp(n_cells, n), grad and flux
  !> (n_cells, n_dim, n); M(n) and grad_lnP(n_cells, n_dim) optional;
  !> kT(n_cells, n) with grad_lnT(n_cells, n_dim) optional.
  subroutine mcd_flux_batch_dij(ws, model, n, n_cells, n_dim, Dij, c, comp_basis, &
       comp, grad, flux_basis, flux, stat, errmsg, M, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: Dij(n_cells, n, n), c(n_cells)
    real(c_double), intent(in), target :: comp(n_cells, n), grad(n_cells, n_dim, n)
    real(c_double), intent(inout) :: flux(n_cells, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), grad_lnP(n_cells, n_dim)
    real(c_double), intent(in), optional, target :: kT(n_cells, n), grad_lnT(n_cells, n_dim)
    type(c_ptr) :: pM
    type(mcd_cells_t) :: cells
    pM = c_null_ptr
    if (present(M)) pM = c_loc(M)
    call set_cells(cells, n_cells, n_dim, comp_basis, c_loc(comp), c_loc(grad))
    if (present(grad_lnP)) cells%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) cells%kT = c_loc(kT)
    if (present(grad_lnT)) cells%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_batch_dij(ws%ptr, int(model, c_int), csz(n), pM, Dij, &
         c, cells, int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch_dij

  !> Batched fluxes (optional) and composition Jacobians with per-cell Dij
  !> and c, arrays as mcd_flux_batch_dij; jac(n_cells, n, n_dim, n):
  !> jac(cell, k, d, i) = dF_{i,d}/dy_k of that cell.
  subroutine mcd_flux_batch_jacobian(ws, model, n, n_cells, n_dim, Dij, c, &
       comp_basis, comp, grad, flux_basis, jac, stat, errmsg, M, grad_lnP, kT, &
       grad_lnT, flux)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: Dij(n_cells, n, n), c(n_cells)
    real(c_double), intent(in), target :: comp(n_cells, n), grad(n_cells, n_dim, n)
    real(c_double), intent(inout) :: jac(n_cells, n, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), grad_lnP(n_cells, n_dim)
    real(c_double), intent(in), optional, target :: kT(n_cells, n), grad_lnT(n_cells, n_dim)
    real(c_double), intent(inout), optional, target :: flux(n_cells, n_dim, n)
    type(c_ptr) :: pM, pF
    type(mcd_cells_t) :: cells
    pM = c_null_ptr
    pF = c_null_ptr
    if (present(M)) pM = c_loc(M)
    if (present(flux)) pF = c_loc(flux)
    call set_cells(cells, n_cells, n_dim, comp_basis, c_loc(comp), c_loc(grad))
    if (present(grad_lnP)) cells%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) cells%kT = c_loc(kT)
    if (present(grad_lnT)) cells%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_batch_jacobian(ws%ptr, int(model, c_int), csz(n), pM, &
         Dij, c, cells, int(flux_basis, c_int), pF, jac), stat, errmsg)
  end subroutine mcd_flux_batch_jacobian

  !> As mcd_flux_batch with per-cell arrays: comp(N, n_cells), grad and
  !> flux (n_dim, N, n_cells), grad_lnP(n_dim, n_cells) optional, kT(N,
  !> n_cells) with grad_lnT(n_dim, n_cells) optional.
  subroutine mcd_flux_batch_aos(ws, mix, model, n_cells, n_dim, T, P, comp_basis, &
       comp, grad, flux_basis, flux, stat, errmsg, grad_lnP, kT, grad_lnT)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: model, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: T(n_cells), P(n_cells)
    real(c_double), intent(in), target :: comp(*), grad(*)
    real(c_double), intent(inout) :: flux(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_lnP(n_dim, n_cells)
    real(c_double), intent(in), optional, target :: kT(*), grad_lnT(n_dim, n_cells)
    type(mcd_cells_t) :: cells
    call set_cells(cells, n_cells, n_dim, comp_basis, c_loc(comp), c_loc(grad))
    if (present(grad_lnP)) cells%grad_lnP = c_loc(grad_lnP)
    if (present(kT)) cells%kT = c_loc(kT)
    if (present(grad_lnT)) cells%grad_lnT = c_loc(grad_lnT)
    call finish(c_mcd_flux_batch_aos(ws%ptr, mix%ptr, int(model, c_int), T, P, &
         cells, int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch_aos

  !> Settings of MCD_MODEL_ITERATIVE for later batched calls on ws.
  subroutine mcd_workspace_set_iterative(ws, max_iter, tol, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: max_iter
    real(c_double), intent(in) :: tol
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_workspace_set_iterative(ws%ptr, csz(max_iter), tol), &
         stat, errmsg)
  end subroutine mcd_workspace_set_iterative

  !> Largest error estimate and iteration count of the last ITERATIVE call.
  subroutine mcd_workspace_iterative_outcome(ws, max_error, max_iter, stat, errmsg)
    type(mcd_workspace_t), intent(in) :: ws
    real(c_double), intent(inout) :: max_error
    integer, intent(inout) :: max_iter
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), target :: e
    integer(c_size_t), target :: it
    integer(c_int) :: s
    e = 0
    it = 0
    s = c_mcd_workspace_iterative_outcome(ws%ptr, c_loc(e), c_loc(it))
    if (s == 0) then
       max_error = e
       max_iter = int(it)
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_iterative_outcome

  !> OpenMP threads for later batched calls on ws (0 = OpenMP default).
  subroutine mcd_workspace_set_threads(ws, n_threads, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_threads
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_workspace_set_threads(ws%ptr, csz(n_threads)), stat, errmsg)
  end subroutine mcd_workspace_set_threads

  !> How later mcd_flux_batch_dij calls on ws read Dij: MCD_DIJ_READ_BOTH
  !> (default; both triangles checked) or MCD_DIJ_READ_UPPER (the upper
  !> triangle only, i < j, symmetry vouched by the caller; see mcdiff.h).
  subroutine mcd_workspace_set_dij_read(ws, mode, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: mode
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_workspace_set_dij_read(ws%ptr, int(mode, c_int)), &
         stat, errmsg)
  end subroutine mcd_workspace_set_dij_read

  !> Declare a temperature range for fitted Chapman-Enskog / Wilke-Lee
  !> pairs in batched calls; max_rel_err (optional) returns the fit error.
  subroutine mcd_mixture_set_temperature_fit(mix, T_min, T_max, stat, errmsg, max_rel_err)
    type(mcd_mixture_t), intent(inout) :: mix
    real(c_double), intent(in) :: T_min, T_max
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional :: max_rel_err
    real(c_double), target :: e
    integer(c_int) :: s
    e = 0
    s = c_mcd_mixture_set_temperature_fit(mix%ptr, T_min, T_max, c_loc(e))
    if (s == 0 .and. present(max_rel_err)) max_rel_err = e
    call finish(s, stat, errmsg)
  end subroutine mcd_mixture_set_temperature_fit

  !> The declared temperature-fit range [T_min, T_max] of mix and the fit's
  !> largest relative error (all 0 when no fit is declared).
  subroutine mcd_mixture_temperature_fit(mix, T_min, T_max, max_rel_err, stat, errmsg)
    type(mcd_mixture_t), intent(in) :: mix
    real(c_double), intent(inout) :: T_min, T_max, max_rel_err
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), target :: lo, hi, e
    integer(c_int) :: s
    lo = 0
    hi = 0
    e = 0
    s = c_mcd_mixture_temperature_fit(mix%ptr, c_loc(lo), c_loc(hi), c_loc(e))
    if (s == 0) then
       T_min = lo
       T_max = hi
       max_rel_err = e
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_mixture_temperature_fit

  !> Element counts of a formula: Z(n_elements), counts(n_elements) with
  !> capacity size(Z) = size(counts) = cap.
  subroutine mcd_formula_elements(formula, cap, Z, counts, n_elements, stat, errmsg)
    character(len=*), intent(in) :: formula
    integer, intent(in) :: cap
    integer(c_int), intent(inout) :: Z(cap)
    integer(c_long), intent(inout) :: counts(cap)
    integer, intent(inout) :: n_elements
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer(c_size_t) :: n
    integer(c_int) :: s
    s = c_mcd_formula_elements(to_c(formula), csz(cap), Z, counts, n)
    if (s == 0) n_elements = int(n)
    call finish(s, stat, errmsg)
  end subroutine mcd_formula_elements

  !> Fuller-Ensley-Giddings diffusion volume of a formula (n_rings aromatic
  !> or heterocyclic rings, default 0).
  subroutine mcd_formula_diffusion_volume(formula, V, stat, errmsg, n_rings)
    character(len=*), intent(in) :: formula
    real(c_double), intent(inout) :: V
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: n_rings
    real(c_double) :: v_out
    integer(c_int) :: s, r
    r = 0
    if (present(n_rings)) r = int(n_rings, c_int)
    s = c_mcd_formula_diffusion_volume(to_c(formula), r, v_out)
    if (s == 0) V = v_out
    call finish(s, stat, errmsg)
  end subroutine mcd_formula_diffusion_volume

  !> Tabulated diffusion volume of a simple molecule, by formula.
  subroutine mcd_formula_molecule_volume(formula, V, stat, errmsg)
    character(len=*), intent(in) :: formula
    real(c_double), intent(inout) :: V
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v_out
    integer(c_int) :: s
    s = c_mcd_formula_molecule_volume(to_c(formula), v_out)
    if (s == 0) V = v_out
    call finish(s, stat, errmsg, trim(formula))
  end subroutine mcd_formula_molecule_volume

  !> Symbol of element Z ('' when out of range).
  function mcd_element_symbol(Z) result(sym)
    integer, intent(in) :: Z
    character(len=:), allocatable :: sym
    sym = from_c(c_mcd_element_symbol(int(Z, c_int)))
  end function mcd_element_symbol

  !> Standard atomic weight of element Z [kg/mol].
  subroutine mcd_element_weight(Z, w, stat, errmsg)
    integer, intent(in) :: Z
    real(c_double), intent(inout) :: w
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_element_weight(int(Z, c_int), v)
    if (s == 0) w = v
    call finish(s, stat, errmsg)
  end subroutine mcd_element_weight

  !> Neufeld-Janzen-Aziz diffusion collision integral Omega_D(T*).
  subroutine mcd_binary_omega_d(T_star, omega, stat, errmsg)
    real(c_double), intent(in) :: T_star
    real(c_double), intent(inout) :: omega
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_binary_omega_d(T_star, v)
    if (s == 0) omega = v
    call finish(s, stat, errmsg)
  end subroutine mcd_binary_omega_d

  ! ==================================================================
  ! Liquids
  ! ==================================================================

  !> New liquid of n species with an activity model (MCD_ACTIVITY_*).
  subroutine mcd_liquid_new(liq, n, model, stat, errmsg)
    type(mcd_liquid_t), intent(inout) :: liq
    integer, intent(in) :: n, model
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call liq_final(liq)
    p = c_null_ptr
    s = c_mcd_liquid_new(csz(n), int(model, c_int), p)
    if (s == 0) liq%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_liquid_new

  !> Species parameter p (MCD_LIQ_*) of species i (1-based).
  subroutine mcd_liquid_set_species(liq, i, p, val, stat, errmsg)
    type(mcd_liquid_t), intent(inout) :: liq
    integer, intent(in) :: i, p
    real(c_double), intent(in) :: val
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_liquid_set_species(liq%ptr, cidx(i), int(p, c_int), val), &
         stat, errmsg)
  end subroutine mcd_liquid_set_species

  !> Pair parameters of (i, j) (1-based): coef_ij(3), coef_ji(3), alpha and
  !> the fitted range [T_min, T_max] (both 0: none).
  subroutine mcd_liquid_set_pair(liq, i, j, coef_ij, coef_ji, alpha, T_min, T_max, &
       stat, errmsg)
    type(mcd_liquid_t), intent(inout) :: liq
    integer, intent(in) :: i, j
    real(c_double), intent(in) :: coef_ij(3), coef_ji(3), alpha, T_min, T_max
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_liquid_set_pair(liq%ptr, cidx(i), cidx(j), coef_ij, coef_ji, &
         alpha, T_min, T_max), stat, errmsg)
  end subroutine mcd_liquid_set_pair

  !> Infinite-dilution diffusivities [m^2/s] of i in j and of j in i.
  subroutine mcd_liquid_set_dinf(liq, i, j, D_i_in_j, D_j_in_i, stat, errmsg)
    type(mcd_liquid_t), intent(inout) :: liq
    integer, intent(in) :: i, j
    real(c_double), intent(in) :: D_i_in_j, D_j_in_i
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_liquid_set_dinf(liq%ptr, cidx(i), cidx(j), D_i_in_j, D_j_in_i), &
         stat, errmsg)
  end subroutine mcd_liquid_set_dinf

  !> ln gamma(n), Gamma(n, n) and Dij(n, n) of the liquid at (T, x), each
  !> optional. Gamma comes in C order: the Fortran array holds the
  !> transpose (Gamma(j, i) = Gamma_ij), which is what mcd_flux_compute's
  !> Gamma argument expects back; Dij is symmetric. warn: MCD_WARN_* bits.
  subroutine mcd_liquid_eval(ws, liq, T, x, stat, errmsg, lngamma, Gamma, Dij, warn)
    type(mcd_workspace_t), intent(in) :: ws
    type(mcd_liquid_t), intent(in) :: liq
    real(c_double), intent(in) :: T, x(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional, target :: lngamma(*), Gamma(*), Dij(*)
    integer, intent(inout), optional :: warn
    type(c_ptr) :: pl, pg, pd
    integer(c_int), target :: w
    integer(c_int) :: s
    pl = c_null_ptr
    pg = c_null_ptr
    pd = c_null_ptr
    if (present(lngamma)) pl = c_loc(lngamma(1))
    if (present(Gamma)) pg = c_loc(Gamma(1))
    if (present(Dij)) pd = c_loc(Dij(1))
    w = 0
    s = c_mcd_liquid_eval(ws%ptr, liq%ptr, T, x, pl, pg, pd, c_loc(w))
    if (s == 0 .and. present(warn)) warn = int(w)
    call finish(s, stat, errmsg)
  end subroutine mcd_liquid_eval

  !> Batched fluxes of a liquid, arrays as mcd_flux_batch_dij: T, c
  !> (n_cells); comp(n_cells, n), grad and flux (n_cells, n_dim, n); M(n)
  !> optional (needed for the mass basis); Vbar(n_cells, n) optional
  !> (fluxes relative to the volume-average velocity); kT(n_cells, n)
  !> with grad_lnT(n_cells, n_dim) optional; warn the OR of the cells'
  !> warning bits.
  subroutine mcd_liquid_flux_batch(ws, liq, model, n, n_cells, n_dim, T, c, &
       comp_basis, comp, grad, flux_basis, flux, stat, errmsg, M, Vbar, kT, &
       grad_lnT, warn)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_liquid_t), intent(in) :: liq
    integer, intent(in) :: model, n, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: T(n_cells), c(n_cells)
    real(c_double), intent(in), target :: comp(n_cells, n), grad(n_cells, n_dim, n)
    real(c_double), intent(inout) :: flux(n_cells, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Vbar(n_cells, n)
    real(c_double), intent(in), optional, target :: kT(n_cells, n), grad_lnT(n_cells, n_dim)
    integer, intent(inout), optional :: warn
    type(c_ptr) :: pM, pV
    type(mcd_cells_t) :: cells
    integer(c_int), target :: w
    integer(c_int) :: s
    pM = c_null_ptr
    pV = c_null_ptr
    if (present(M)) pM = c_loc(M)
    if (present(Vbar)) pV = c_loc(Vbar)
    call set_cells(cells, n_cells, n_dim, comp_basis, c_loc(comp), c_loc(grad))
    if (present(kT)) cells%kT = c_loc(kT)
    if (present(grad_lnT)) cells%grad_lnT = c_loc(grad_lnT)
    w = 0
    s = c_mcd_liquid_flux_batch(ws%ptr, liq%ptr, int(model, c_int), T, c, pM, pV, &
         cells, int(flux_basis, c_int), flux, c_loc(w))
    if (s == 0 .and. present(warn)) warn = int(w)
    call finish(s, stat, errmsg)
  end subroutine mcd_liquid_flux_batch

  subroutine mcd_binary_tyn_calus(T, mu_solvent, Vb_solute, Vb_solvent, D, stat, errmsg)
    real(c_double), intent(in) :: T, mu_solvent, Vb_solute, Vb_solvent
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_tyn_calus(T, mu_solvent, Vb_solute, Vb_solvent, D), &
         stat, errmsg)
  end subroutine mcd_binary_tyn_calus

  subroutine mcd_binary_hayduk_minhas(T, mu_water, Vb_solute, D, stat, errmsg)
    real(c_double), intent(in) :: T, mu_water, Vb_solute
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_hayduk_minhas(T, mu_water, Vb_solute, D), stat, errmsg)
  end subroutine mcd_binary_hayduk_minhas

  !> Temperature range [K] of a liquid correlation (MCD_METHOD_WILKE_CHANG,
  !> _TYN_CALUS, _HAYDUK_MINHAS) and the warning bits at T:
  !> MCD_WARN_TEMPERATURE outside it.
  subroutine mcd_method_temperature_range(method, T, T_min, T_max, warn, stat, errmsg)
    integer, intent(in) :: method
    real(c_double), intent(in) :: T
    real(c_double), intent(inout) :: T_min, T_max
    integer, intent(inout) :: warn
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), target :: lo, hi
    integer(c_int), target :: w
    integer(c_int) :: s
    lo = 0
    hi = 0
    w = 0
    s = c_mcd_method_temperature_range(int(method, c_int), T, c_loc(lo), c_loc(hi), c_loc(w))
    if (s == 0) then
       T_min = lo
       T_max = hi
       warn = int(w)
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_method_temperature_range

  !> Antoine constants of species i (1-based): log10(P/Pa) = A - B/(T/K + C)
  !> over [T_min, T_max].
  subroutine mcd_liquid_set_antoine(liq, i, A, B, C, T_min, T_max, stat, errmsg)
    type(mcd_liquid_t), intent(inout) :: liq
    integer, intent(in) :: i
    real(c_double), intent(in) :: A, B, C, T_min, T_max
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_liquid_set_antoine(liq%ptr, cidx(i), A, B, C, T_min, T_max), &
         stat, errmsg)
  end subroutine mcd_liquid_set_antoine

  !> Partial pressures p(n) [Pa] over the liquid x(n) at T (modified
  !> Raoult's law).
  subroutine mcd_liquid_vle(ws, liq, T, x, p, stat, errmsg, warn)
    type(mcd_workspace_t), intent(in) :: ws
    type(mcd_liquid_t), intent(in) :: liq
    real(c_double), intent(in) :: T, x(*)
    real(c_double), intent(inout) :: p(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(inout), optional :: warn
    integer(c_int), target :: w
    integer(c_int) :: s
    w = 0
    s = c_mcd_liquid_vle(ws%ptr, liq%ptr, T, x, p, c_loc(w))
    if (s == 0 .and. present(warn)) warn = int(w)
    call finish(s, stat, errmsg)
  end subroutine mcd_liquid_vle

  !> Evaporation of the liquid x_liq(n) through a stagnant gas film of the
  !> liquid's n species plus one inert (ng = n + 1 species, inert last):
  !> Dij(ng, ng), xL(ng) at the open end, c, L; M(ng); rho_liquid. N_flux(ng)
  !> [mol/(m^2 s)]; optional y0(ng), mass_rate [kg/(m^2 s)], level_rate
  !> [mm/h], warn.
  subroutine mcd_liquid_evaporation(ws, liq, ng, Dij, c, L, xL, T, P, x_liq, M, &
       rho_liquid, N_flux, stat, errmsg, y0, mass_rate, level_rate, warn)
    type(mcd_workspace_t), intent(in) :: ws
    type(mcd_liquid_t), intent(in) :: liq
    integer, intent(in) :: ng
    real(c_double), intent(in), target :: Dij(ng, ng), xL(ng)
    real(c_double), intent(in) :: c, L, T, P, x_liq(*), M(*), rho_liquid
    real(c_double), intent(inout) :: N_flux(ng)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(inout), optional, target :: y0(ng)
    real(c_double), intent(inout), optional :: mass_rate, level_rate
    integer, intent(inout), optional :: warn
    real(c_double), target :: r(2)
    integer(c_int), target :: w
    type(c_ptr) :: py
    integer(c_int) :: s
    py = c_null_ptr
    if (present(y0)) py = c_loc(y0(1))
    w = 0
    r = 0
    s = c_mcd_liquid_evaporation(ws%ptr, liq%ptr, film_of(ng, Dij, c, L, xL, xL), T, P, &
         x_liq, M, rho_liquid, py, N_flux, c_loc(r(1)), c_loc(r(2)), c_loc(w))
    if (s == 0) then
       if (present(mass_rate)) mass_rate = r(1)
       if (present(level_rate)) level_rate = r(2)
       if (present(warn)) warn = int(w)
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_liquid_evaporation

end module mcdiff
