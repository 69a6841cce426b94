! mcdiff.f90 - Fortran 2008 module over the mcdiff C API (include/mcdiff.h).
!
! Two layers, both public:
!
!   c_mcd_<name>   bind(c) interfaces to the C functions mcd_<name>, argument
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
! starts as c_null_ptr. Create them with the mcd_*_new / mcd_workspace_alloc
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
  ! Kinds and constants (values as in include/mcdiff.h)
  ! ------------------------------------------------------------------
  integer, parameter, public :: mcd_rk = c_double

  integer, parameter, public :: MCD_OK = 0, MCD_EINVAL = 1, MCD_EDOM = 2, &
       MCD_EBADLEN = 3, MCD_ENOMEM = 4, MCD_ESING = 5, MCD_EINTERNAL = 6, &
       MCD_ENOTFOUND = 7, MCD_EPARSE = 8, MCD_ENODATA = 9, MCD_ENOCONV = 10, &
       MCD_EIO = 11

  integer, parameter, public :: MCD_MAX_SPECIES = 1024, MCD_MAX_DIM = 3
  real(c_double), parameter, public :: MCD_SUM_TOL = 1.0e-6_c_double
  real(c_double), parameter, public :: MCD_GAS_CONSTANT = 8.31446261815324_c_double
  real(c_double), parameter, public :: MCD_ATM = 101325.0_c_double
  !> C's MCD_DEPENDENT_AUTO ((size_t)-1) for the c_mcd_* layer; the wrappers
  !> use an absent `dependent` argument instead.
  integer(c_size_t), parameter, public :: MCD_DEPENDENT_AUTO = -1_c_size_t

  integer, parameter, public :: MCD_PARAM_MOLAR_MASS = 0, &
       MCD_PARAM_DIFF_VOLUME = 1, MCD_PARAM_LJ_SIGMA = 2, &
       MCD_PARAM_LJ_EPS_K = 3, MCD_PARAM_DIPOLE = 4, MCD_PARAM_VB = 5, &
       MCD_PARAM_TB = 6, MCD_PARAM_ASSOC = 7, MCD_PARAM_TC = 8, &
       MCD_PARAM_PC = 9, MCD_PARAM_COUNT = 10

  integer, parameter, public :: MCD_METHOD_FSG = 1, &
       MCD_METHOD_CHAPMAN_ENSKOG = 2, MCD_METHOD_WILKE_LEE = 3, &
       MCD_METHOD_WILKE_CHANG = 4, MCD_METHOD_USER = 5

  integer, parameter, public :: MCD_WARN_HIGH_PRESSURE = 1, &
       MCD_WARN_POLAR = 2, MCD_WARN_TEMPERATURE = 4, MCD_WARN_QUANTUM = 8, &
       MCD_WARN_ASSOCIATING = 16, MCD_WARN_ESTIMATED_PARAM = 32, &
       MCD_WARN_SCALED = 64

  integer, parameter, public :: MCD_BASIS_MOLE = 0, MCD_BASIS_MASS = 1
  integer, parameter, public :: MCD_MODEL_MAXWELL_STEFAN = 0, &
       MCD_MODEL_MIXTURE_AVERAGED = 1, MCD_MODEL_ITERATIVE = 2

  integer, parameter, public :: MCD_BOOT_TOTAL = 0, MCD_BOOT_STAGNANT = 1, &
       MCD_BOOT_EQUIMOLAR = 2, MCD_BOOT_WEIGHTS = 3, MCD_BOOT_RATIOS = 4

  integer, parameter, public :: MCD_DIAG_REVERSE = 1, MCD_DIAG_OSMOTIC = 2, &
       MCD_DIAG_BARRIER = 4

  integer, parameter, public :: MCD_FILM_EXACT = 0, MCD_FILM_LINEARIZED = 1

  !> Length of the error buffers handed to C (messages are truncated there).
  integer, parameter :: ERRLEN = 512

  !> C's mcd_allocator for mcd_workspace_alloc_with: alloc and free are
  !> c_funloc of bind(c) procedures with the C signatures
  !>   type(c_ptr) function alloc(ud, size) (ud: c_ptr value, size:
  !>   c_size_t value; memory aligned for double or c_null_ptr), and
  !>   subroutine free(ud, p) (both c_ptr value); ud is passed to both.
  type, bind(c), public :: mcd_allocator_t
     type(c_funptr) :: alloc = c_null_funptr
     type(c_funptr) :: free = c_null_funptr
     type(c_ptr) :: ud = c_null_ptr
  end type mcd_allocator_t

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

  ! ------------------------------------------------------------------
  ! Raw C interfaces (names c_mcd_*, bound to mcd_*)
  ! ------------------------------------------------------------------
  public :: c_mcd_version_number, c_mcd_version_string, c_mcd_status_string, &
       c_mcd_formula_molar_mass, c_mcd_param_name, c_mcd_param_unit, &
       c_mcd_db_new, c_mcd_db_new_builtin, c_mcd_db_free, c_mcd_db_count, &
       c_mcd_db_find, c_mcd_db_name, c_mcd_db_formula, c_mcd_db_source, &
       c_mcd_db_param, c_mcd_db_add, c_mcd_db_set_param, c_mcd_db_load_file, &
       c_mcd_db_load_string, &
       c_mcd_comp_normalize, c_mcd_comp_x_to_w, c_mcd_comp_w_to_x, &
       c_mcd_comp_mean_molar_mass_x, c_mcd_comp_mean_molar_mass_w, &
       c_mcd_comp_x_to_c, c_mcd_comp_c_to_x, c_mcd_ideal_gas_c, &
       c_mcd_comp_grad_x_to_w, c_mcd_comp_grad_w_to_x, &
       c_mcd_method_name, c_mcd_method_from_name, c_mcd_method_typical_error, &
       c_mcd_warning_string, c_mcd_fsg_raw, c_mcd_chapman_enskog_raw, &
       c_mcd_wilke_lee_raw, c_mcd_wilke_chang_raw, c_mcd_binary_scale, &
       c_mcd_binary_gas, c_mcd_binary_liquid, &
       c_mcd_mixture_new, c_mcd_mixture_free, c_mcd_mixture_count, &
       c_mcd_mixture_name, c_mcd_mixture_molar_masses, &
       c_mcd_mixture_set_method, c_mcd_mixture_set_binary, &
       c_mcd_mixture_binaries, &
       c_mcd_workspace_alloc, c_mcd_workspace_free, c_mcd_workspace_species, &
       c_mcd_workspace_last_error, &
       c_mcd_flux_compute, c_mcd_fick_matrix, c_mcd_fick_fluxes, &
       c_mcd_fick_eigenvalues, c_mcd_flux_convert, &
       c_mcd_flux_to_volume_frame, c_mcd_flux_to_species_frame, &
       c_mcd_flux_total, c_mcd_velocity_difference, c_mcd_flux_project, &
       c_mcd_flux_diagnose, c_mcd_film_solve, c_mcd_film_profile, &
       c_mcd_bulbs_linearized, c_mcd_bulbs_integrate, &
       c_mcd_flux_batch, c_mcd_flux_batch_dij, c_mcd_flux_batch_aos, &
       c_mcd_workspace_set_iterative, c_mcd_workspace_iterative_info, &
       c_mcd_workspace_set_threads, c_mcd_mixture_set_temperature_fit, &
       c_mcd_mixture_temperature_fit, c_mcd_formula_elements, &
       c_mcd_formula_diffusion_volume, c_mcd_fsg_molecule_volume, &
       c_mcd_element_symbol, c_mcd_element_weight, c_mcd_collision_omega_d, &
       c_mcd_workspace_alloc_with

  interface
     function c_strlen(s) bind(c, name='strlen') result(n)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: s
       integer(c_size_t) :: n
     end function c_strlen

     ! --- version and status ---
     function c_mcd_version_number() bind(c, name='mcd_version_number') result(v)
       import :: c_int
       integer(c_int) :: v
     end function c_mcd_version_number
     function c_mcd_version_string() bind(c, name='mcd_version_string') result(p)
       import :: c_ptr
       type(c_ptr) :: p
     end function c_mcd_version_string
     function c_mcd_status_string(status) bind(c, name='mcd_status_string') result(p)
       import :: c_ptr, c_int
       integer(c_int), value :: status
       type(c_ptr) :: p
     end function c_mcd_status_string

     ! --- formulas and parameters ---
     function c_mcd_formula_molar_mass(formula, out_M, errbuf, errlen) &
          bind(c, name='mcd_formula_molar_mass') result(s)
       import :: c_char, c_double, c_size_t, c_int
       character(kind=c_char), intent(in) :: formula(*)
       real(c_double), intent(out) :: out_M
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_formula_molar_mass
     function c_mcd_formula_elements(formula, cap, out_Z, out_count, out_n, errbuf, errlen) &
          bind(c, name='mcd_formula_elements') result(s)
       import :: c_char, c_size_t, c_int, c_long
       character(kind=c_char), intent(in) :: formula(*)
       integer(c_size_t), value :: cap
       integer(c_int), intent(inout) :: out_Z(*)
       integer(c_long), intent(inout) :: out_count(*)
       integer(c_size_t), intent(out) :: out_n
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_formula_elements
     function c_mcd_formula_diffusion_volume(formula, n_rings, out_V, errbuf, errlen) &
          bind(c, name='mcd_formula_diffusion_volume') result(s)
       import :: c_char, c_size_t, c_int, c_double
       character(kind=c_char), intent(in) :: formula(*)
       integer(c_int), value :: n_rings
       real(c_double), intent(out) :: out_V
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_formula_diffusion_volume
     function c_mcd_fsg_molecule_volume(formula, out_V) &
          bind(c, name='mcd_fsg_molecule_volume') result(s)
       import :: c_char, c_int, c_double
       character(kind=c_char), intent(in) :: formula(*)
       real(c_double), intent(out) :: out_V
       integer(c_int) :: s
     end function c_mcd_fsg_molecule_volume
     function c_mcd_element_symbol(Z) bind(c, name='mcd_element_symbol') result(p)
       import :: c_ptr, c_int
       integer(c_int), value :: Z
       type(c_ptr) :: p
     end function c_mcd_element_symbol
     function c_mcd_element_weight(Z, out_kg_per_mol) &
          bind(c, name='mcd_element_weight') result(s)
       import :: c_int, c_double
       integer(c_int), value :: Z
       real(c_double), intent(out) :: out_kg_per_mol
       integer(c_int) :: s
     end function c_mcd_element_weight
     function c_mcd_collision_omega_d(T_star, out_omega) &
          bind(c, name='mcd_collision_omega_d') result(s)
       import :: c_int, c_double
       real(c_double), value :: T_star
       real(c_double), intent(out) :: out_omega
       integer(c_int) :: s
     end function c_mcd_collision_omega_d
     function c_mcd_param_name(p) bind(c, name='mcd_param_name') result(r)
       import :: c_ptr, c_int
       integer(c_int), value :: p
       type(c_ptr) :: r
     end function c_mcd_param_name
     function c_mcd_param_unit(p) bind(c, name='mcd_param_unit') result(r)
       import :: c_ptr, c_int
       integer(c_int), value :: p
       type(c_ptr) :: r
     end function c_mcd_param_unit

     ! --- species database ---
     function c_mcd_db_new(out_db) bind(c, name='mcd_db_new') result(s)
       import :: c_ptr, c_int
       type(c_ptr), intent(out) :: out_db
       integer(c_int) :: s
     end function c_mcd_db_new
     function c_mcd_db_new_builtin(out_db) bind(c, name='mcd_db_new_builtin') result(s)
       import :: c_ptr, c_int
       type(c_ptr), intent(out) :: out_db
       integer(c_int) :: s
     end function c_mcd_db_new_builtin
     subroutine c_mcd_db_free(db) bind(c, name='mcd_db_free')
       import :: c_ptr
       type(c_ptr), value :: db
     end subroutine c_mcd_db_free
     function c_mcd_db_count(db) bind(c, name='mcd_db_count') result(n)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: db
       integer(c_size_t) :: n
     end function c_mcd_db_count
     function c_mcd_db_find(db, name, out_index) bind(c, name='mcd_db_find') result(s)
       import :: c_ptr, c_char, c_size_t, c_int
       type(c_ptr), value :: db
       character(kind=c_char), intent(in) :: name(*)
       integer(c_size_t), intent(out) :: out_index
       integer(c_int) :: s
     end function c_mcd_db_find
     function c_mcd_db_name(db, i) bind(c, name='mcd_db_name') result(p)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: db
       integer(c_size_t), value :: i
       type(c_ptr) :: p
     end function c_mcd_db_name
     function c_mcd_db_formula(db, i) bind(c, name='mcd_db_formula') result(p)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: db
       integer(c_size_t), value :: i
       type(c_ptr) :: p
     end function c_mcd_db_formula
     function c_mcd_db_source(db, i, param) bind(c, name='mcd_db_source') result(p)
       import :: c_ptr, c_size_t, c_int
       type(c_ptr), value :: db
       integer(c_size_t), value :: i
       integer(c_int), value :: param
       type(c_ptr) :: p
     end function c_mcd_db_source
     function c_mcd_db_param(db, i, param, out_value) bind(c, name='mcd_db_param') result(s)
       import :: c_ptr, c_size_t, c_int, c_double
       type(c_ptr), value :: db
       integer(c_size_t), value :: i
       integer(c_int), value :: param
       real(c_double), intent(out) :: out_value
       integer(c_int) :: s
     end function c_mcd_db_param
     function c_mcd_db_add(db, name, formula, n_rings, out_index, errbuf, errlen) &
          bind(c, name='mcd_db_add') result(s)
       import :: c_ptr, c_char, c_int, c_size_t
       type(c_ptr), value :: db
       character(kind=c_char), intent(in) :: name(*), formula(*)
       integer(c_int), value :: n_rings
       integer(c_size_t), intent(out) :: out_index
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_db_add
     function c_mcd_db_set_param(db, i, param, val) bind(c, name='mcd_db_set_param') result(s)
       import :: c_ptr, c_size_t, c_int, c_double
       type(c_ptr), value :: db
       integer(c_size_t), value :: i
       integer(c_int), value :: param
       real(c_double), value :: val
       integer(c_int) :: s
     end function c_mcd_db_set_param
     function c_mcd_db_load_file(db, path, errbuf, errlen) &
          bind(c, name='mcd_db_load_file') result(s)
       import :: c_ptr, c_char, c_size_t, c_int
       type(c_ptr), value :: db
       character(kind=c_char), intent(in) :: path(*)
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_db_load_file
     function c_mcd_db_load_string(db, text, errbuf, errlen) &
          bind(c, name='mcd_db_load_string') result(s)
       import :: c_ptr, c_char, c_size_t, c_int
       type(c_ptr), value :: db
       character(kind=c_char), intent(in) :: text(*)
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_db_load_string

     ! --- compositions ---
     function c_mcd_comp_normalize(n, y, out_y) bind(c, name='mcd_comp_normalize') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: y(*)
       real(c_double), intent(inout) :: out_y(*)
       integer(c_int) :: s
     end function c_mcd_comp_normalize
     function c_mcd_comp_x_to_w(n, M, x, out_w) bind(c, name='mcd_comp_x_to_w') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: M(*), x(*)
       real(c_double), intent(inout) :: out_w(*)
       integer(c_int) :: s
     end function c_mcd_comp_x_to_w
     function c_mcd_comp_w_to_x(n, M, w, out_x) bind(c, name='mcd_comp_w_to_x') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: M(*), w(*)
       real(c_double), intent(inout) :: out_x(*)
       integer(c_int) :: s
     end function c_mcd_comp_w_to_x
     function c_mcd_comp_mean_molar_mass_x(n, M, x, out_Mbar) &
          bind(c, name='mcd_comp_mean_molar_mass_x') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: M(*), x(*)
       real(c_double), intent(inout) :: out_Mbar
       integer(c_int) :: s
     end function c_mcd_comp_mean_molar_mass_x
     function c_mcd_comp_mean_molar_mass_w(n, M, w, out_Mbar) &
          bind(c, name='mcd_comp_mean_molar_mass_w') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: M(*), w(*)
       real(c_double), intent(inout) :: out_Mbar
       integer(c_int) :: s
     end function c_mcd_comp_mean_molar_mass_w
     function c_mcd_comp_x_to_c(n, c_total, x, out_c) bind(c, name='mcd_comp_x_to_c') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), value :: c_total
       real(c_double), intent(in) :: x(*)
       real(c_double), intent(inout) :: out_c(*)
       integer(c_int) :: s
     end function c_mcd_comp_x_to_c
     function c_mcd_comp_c_to_x(n, c, out_x, out_c_total) bind(c, name='mcd_comp_c_to_x') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: c(*)
       real(c_double), intent(inout) :: out_x(*)
       real(c_double), intent(inout) :: out_c_total
       integer(c_int) :: s
     end function c_mcd_comp_c_to_x
     function c_mcd_ideal_gas_c(T, P, out_c) bind(c, name='mcd_ideal_gas_c') result(s)
       import :: c_double, c_int
       real(c_double), value :: T, P
       real(c_double), intent(inout) :: out_c
       integer(c_int) :: s
     end function c_mcd_ideal_gas_c
     function c_mcd_comp_grad_x_to_w(n, n_dim, M, x, grad_x, out_grad_w) &
          bind(c, name='mcd_comp_grad_x_to_w') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n, n_dim
       real(c_double), intent(in) :: M(*), x(*), grad_x(*)
       real(c_double), intent(inout) :: out_grad_w(*)
       integer(c_int) :: s
     end function c_mcd_comp_grad_x_to_w
     function c_mcd_comp_grad_w_to_x(n, n_dim, M, w, grad_w, out_grad_x) &
          bind(c, name='mcd_comp_grad_w_to_x') result(s)
       import :: c_size_t, c_double, c_int
       integer(c_size_t), value :: n, n_dim
       real(c_double), intent(in) :: M(*), w(*), grad_w(*)
       real(c_double), intent(inout) :: out_grad_x(*)
       integer(c_int) :: s
     end function c_mcd_comp_grad_w_to_x

     ! --- binary diffusivities ---
     function c_mcd_method_name(m) bind(c, name='mcd_method_name') result(p)
       import :: c_ptr, c_int
       integer(c_int), value :: m
       type(c_ptr) :: p
     end function c_mcd_method_name
     function c_mcd_method_from_name(name, out_m) bind(c, name='mcd_method_from_name') result(s)
       import :: c_char, c_int
       character(kind=c_char), intent(in) :: name(*)
       integer(c_int), intent(out) :: out_m
       integer(c_int) :: s
     end function c_mcd_method_from_name
     function c_mcd_method_typical_error(m) bind(c, name='mcd_method_typical_error') result(e)
       import :: c_int, c_double
       integer(c_int), value :: m
       real(c_double) :: e
     end function c_mcd_method_typical_error
     function c_mcd_warning_string(bit) bind(c, name='mcd_warning_string') result(p)
       import :: c_ptr, c_int
       integer(c_int), value :: bit
       type(c_ptr) :: p
     end function c_mcd_warning_string
     function c_mcd_fsg_raw(T, P, MA, MB, VA, VB, out_D) bind(c, name='mcd_fsg_raw') result(s)
       import :: c_double, c_int
       real(c_double), value :: T, P, MA, MB, VA, VB
       real(c_double), intent(inout) :: out_D
       integer(c_int) :: s
     end function c_mcd_fsg_raw
     function c_mcd_chapman_enskog_raw(T, P, MA, MB, sigA, sigB, epsA, epsB, out_D) &
          bind(c, name='mcd_chapman_enskog_raw') result(s)
       import :: c_double, c_int
       real(c_double), value :: T, P, MA, MB, sigA, sigB, epsA, epsB
       real(c_double), intent(inout) :: out_D
       integer(c_int) :: s
     end function c_mcd_chapman_enskog_raw
     function c_mcd_wilke_lee_raw(T, P, MA, MB, sigA, sigB, epsA, epsB, out_D) &
          bind(c, name='mcd_wilke_lee_raw') result(s)
       import :: c_double, c_int
       real(c_double), value :: T, P, MA, MB, sigA, sigB, epsA, epsB
       real(c_double), intent(inout) :: out_D
       integer(c_int) :: s
     end function c_mcd_wilke_lee_raw
     function c_mcd_wilke_chang_raw(T, mu_solvent, M_solvent, phi, Vb_solute, out_D) &
          bind(c, name='mcd_wilke_chang_raw') result(s)
       import :: c_double, c_int
       real(c_double), value :: T, mu_solvent, M_solvent, phi, Vb_solute
       real(c_double), intent(inout) :: out_D
       integer(c_int) :: s
     end function c_mcd_wilke_chang_raw
     function c_mcd_binary_scale(D_ref, T_ref, P_ref, T, P, expo, out_D) &
          bind(c, name='mcd_binary_scale') result(s)
       import :: c_double, c_int
       real(c_double), value :: D_ref, T_ref, P_ref, T, P, expo
       real(c_double), intent(inout) :: out_D
       integer(c_int) :: s
     end function c_mcd_binary_scale
     !> out_rel_err (double*) and out_warn (unsigned*) may be c_null_ptr.
     function c_mcd_binary_gas(db, a, b, method, T, P, out_D, out_rel_err, out_warn) &
          bind(c, name='mcd_binary_gas') result(s)
       import :: c_ptr, c_size_t, c_int, c_double
       type(c_ptr), value :: db
       integer(c_size_t), value :: a, b
       integer(c_int), value :: method
       real(c_double), value :: T, P
       real(c_double), intent(inout) :: out_D
       type(c_ptr), value :: out_rel_err, out_warn
       integer(c_int) :: s
     end function c_mcd_binary_gas
     function c_mcd_binary_liquid(db, solute, solvent, T, mu_solvent, out_D, &
          out_rel_err, out_warn) bind(c, name='mcd_binary_liquid') result(s)
       import :: c_ptr, c_size_t, c_int, c_double
       type(c_ptr), value :: db
       integer(c_size_t), value :: solute, solvent
       real(c_double), value :: T, mu_solvent
       real(c_double), intent(inout) :: out_D
       type(c_ptr), value :: out_rel_err, out_warn
       integer(c_int) :: s
     end function c_mcd_binary_liquid

     ! --- mixtures ---
     !> names: array of n C pointers to NUL-terminated names.
     function c_mcd_mixture_new(db, n, names, default_method, out_mix, errbuf, errlen) &
          bind(c, name='mcd_mixture_new') result(s)
       import :: c_ptr, c_size_t, c_int, c_char
       type(c_ptr), value :: db
       integer(c_size_t), value :: n
       type(c_ptr), intent(in) :: names(*)
       integer(c_int), value :: default_method
       type(c_ptr), intent(out) :: out_mix
       character(kind=c_char), intent(inout) :: errbuf(*)
       integer(c_size_t), value :: errlen
       integer(c_int) :: s
     end function c_mcd_mixture_new
     subroutine c_mcd_mixture_free(mix) bind(c, name='mcd_mixture_free')
       import :: c_ptr
       type(c_ptr), value :: mix
     end subroutine c_mcd_mixture_free
     function c_mcd_mixture_count(mix) bind(c, name='mcd_mixture_count') result(n)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: mix
       integer(c_size_t) :: n
     end function c_mcd_mixture_count
     function c_mcd_mixture_name(mix, i) bind(c, name='mcd_mixture_name') result(p)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: mix
       integer(c_size_t), value :: i
       type(c_ptr) :: p
     end function c_mcd_mixture_name
     function c_mcd_mixture_molar_masses(mix, out_M) &
          bind(c, name='mcd_mixture_molar_masses') result(s)
       import :: c_ptr, c_double, c_int
       type(c_ptr), value :: mix
       real(c_double), intent(inout) :: out_M(*)
       integer(c_int) :: s
     end function c_mcd_mixture_molar_masses
     function c_mcd_mixture_set_method(mix, i, j, m) &
          bind(c, name='mcd_mixture_set_method') result(s)
       import :: c_ptr, c_size_t, c_int
       type(c_ptr), value :: mix
       integer(c_size_t), value :: i, j
       integer(c_int), value :: m
       integer(c_int) :: s
     end function c_mcd_mixture_set_method
     function c_mcd_mixture_set_binary(mix, i, j, D, T_ref, P_ref) &
          bind(c, name='mcd_mixture_set_binary') result(s)
       import :: c_ptr, c_size_t, c_int, c_double
       type(c_ptr), value :: mix
       integer(c_size_t), value :: i, j
       real(c_double), value :: D, T_ref, P_ref
       integer(c_int) :: s
     end function c_mcd_mixture_set_binary
     !> out_rel_err (double*, n x n) and out_warn (unsigned*, n x n) may be
     !> c_null_ptr.
     function c_mcd_mixture_binaries(mix, T, P, out_D, out_rel_err, out_warn) &
          bind(c, name='mcd_mixture_binaries') result(s)
       import :: c_ptr, c_double, c_int
       type(c_ptr), value :: mix
       real(c_double), value :: T, P
       real(c_double), intent(inout) :: out_D(*)
       type(c_ptr), value :: out_rel_err, out_warn
       integer(c_int) :: s
     end function c_mcd_mixture_binaries

     ! --- workspaces ---
     function c_mcd_workspace_alloc(n_species, out_ws) &
          bind(c, name='mcd_workspace_alloc') result(s)
       import :: c_ptr, c_size_t, c_int
       integer(c_size_t), value :: n_species
       type(c_ptr), intent(out) :: out_ws
       integer(c_int) :: s
     end function c_mcd_workspace_alloc
     function c_mcd_workspace_alloc_with(n_species, allocator, out_ws) &
          bind(c, name='mcd_workspace_alloc_with') result(s)
       import :: c_ptr, c_size_t, c_int, mcd_allocator_t
       integer(c_size_t), value :: n_species
       type(mcd_allocator_t), intent(in) :: allocator
       type(c_ptr), intent(out) :: out_ws
       integer(c_int) :: s
     end function c_mcd_workspace_alloc_with
     subroutine c_mcd_workspace_free(ws) bind(c, name='mcd_workspace_free')
       import :: c_ptr
       type(c_ptr), value :: ws
     end subroutine c_mcd_workspace_free
     function c_mcd_workspace_species(ws) bind(c, name='mcd_workspace_species') result(n)
       import :: c_ptr, c_size_t
       type(c_ptr), value :: ws
       integer(c_size_t) :: n
     end function c_mcd_workspace_species
     function c_mcd_workspace_last_error(ws) bind(c, name='mcd_workspace_last_error') result(p)
       import :: c_ptr
       type(c_ptr), value :: ws
       type(c_ptr) :: p
     end function c_mcd_workspace_last_error

     ! --- diffusion fluxes ---
     !> M, Gamma and grad_lnP may be c_null_ptr.
     function c_mcd_flux_compute(ws, model, n_species, n_dim, M, Dij, c, comp_basis, &
          comp, grad_comp, Gamma, grad_lnP, flux_basis, out_flux) &
          bind(c, name='mcd_flux_compute') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_int), value :: model
       integer(c_size_t), value :: n_species, n_dim
       type(c_ptr), value :: M
       real(c_double), intent(in) :: Dij(*)
       real(c_double), value :: c
       integer(c_int), value :: comp_basis
       real(c_double), intent(in) :: comp(*), grad_comp(*)
       type(c_ptr), value :: Gamma, grad_lnP
       integer(c_int), value :: flux_basis
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_flux_compute
     !> M, Gamma and out_dependent (size_t*) may be c_null_ptr.
     function c_mcd_fick_matrix(ws, n_species, M, Dij, comp_basis, comp, Gamma, &
          basis, dependent, out_D, out_dependent) &
          bind(c, name='mcd_fick_matrix') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n_species
       type(c_ptr), value :: M
       real(c_double), intent(in) :: Dij(*)
       integer(c_int), value :: comp_basis
       real(c_double), intent(in) :: comp(*)
       type(c_ptr), value :: Gamma
       integer(c_int), value :: basis
       integer(c_size_t), value :: dependent
       real(c_double), intent(inout) :: out_D(*)
       type(c_ptr), value :: out_dependent
       integer(c_int) :: s
     end function c_mcd_fick_matrix
     function c_mcd_fick_fluxes(n_species, n_dim, D, dependent, conc, grad, out_flux) &
          bind(c, name='mcd_fick_fluxes') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), intent(in) :: D(*)
       integer(c_size_t), value :: dependent
       real(c_double), value :: conc
       real(c_double), intent(in) :: grad(*)
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_fick_fluxes
     function c_mcd_fick_eigenvalues(ws, m, D, out_re, out_im) &
          bind(c, name='mcd_fick_eigenvalues') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: m
       real(c_double), intent(in) :: D(*)
       real(c_double), intent(inout) :: out_re(*), out_im(*)
       integer(c_int) :: s
     end function c_mcd_fick_eigenvalues

     ! --- frames and total fluxes ---
     function c_mcd_flux_convert(n_species, n_dim, M, x, from, flux_in, to, out_flux) &
          bind(c, name='mcd_flux_convert') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), intent(in) :: M(*), x(*)
       integer(c_int), value :: from
       real(c_double), intent(in) :: flux_in(*)
       integer(c_int), value :: to
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_flux_convert
     function c_mcd_flux_to_volume_frame(n_species, n_dim, c, x, Vbar, J, out_JV) &
          bind(c, name='mcd_flux_to_volume_frame') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), value :: c
       real(c_double), intent(in) :: x(*), Vbar(*), J(*)
       real(c_double), intent(inout) :: out_JV(*)
       integer(c_int) :: s
     end function c_mcd_flux_to_volume_frame
     function c_mcd_flux_to_species_frame(n_species, n_dim, x, J, k, out_Jk) &
          bind(c, name='mcd_flux_to_species_frame') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), intent(in) :: x(*), J(*)
       integer(c_size_t), value :: k
       real(c_double), intent(inout) :: out_Jk(*)
       integer(c_int) :: s
     end function c_mcd_flux_to_species_frame
     !> values and out_bulk may be c_null_ptr.
     function c_mcd_flux_total(n_species, n_dim, basis, comp, diff, kind, species, &
          values, out_total, out_bulk) bind(c, name='mcd_flux_total') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       integer(c_int), value :: basis
       real(c_double), intent(in) :: comp(*), diff(*)
       integer(c_int), value :: kind
       integer(c_size_t), value :: species
       type(c_ptr), value :: values
       real(c_double), intent(inout) :: out_total(*)
       type(c_ptr), value :: out_bulk
       integer(c_int) :: s
     end function c_mcd_flux_total
     function c_mcd_velocity_difference(n_species, n_dim, M, c, x, J, out_v_minus_u) &
          bind(c, name='mcd_velocity_difference') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), intent(in) :: M(*)
       real(c_double), value :: c
       real(c_double), intent(in) :: x(*), J(*)
       real(c_double), intent(inout) :: out_v_minus_u(*)
       integer(c_int) :: s
     end function c_mcd_velocity_difference
     !> weights and out_residual may be c_null_ptr.
     function c_mcd_flux_project(n_species, n_dim, weights, inout_flux, out_residual) &
          bind(c, name='mcd_flux_project') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       type(c_ptr), value :: weights
       real(c_double), intent(inout) :: inout_flux(*)
       type(c_ptr), value :: out_residual
       integer(c_int) :: s
     end function c_mcd_flux_project
     function c_mcd_flux_diagnose(n_species, n_dim, grad, flux, rel_tol, out_flags) &
          bind(c, name='mcd_flux_diagnose') result(s)
       import :: c_int, c_size_t, c_double
       integer(c_size_t), value :: n_species, n_dim
       real(c_double), intent(in) :: grad(*), flux(*)
       real(c_double), value :: rel_tol
       integer(c_int), intent(inout) :: out_flags(*)
       integer(c_int) :: s
     end function c_mcd_flux_diagnose

     ! --- mass transfer ---
     !> values, out_iterations (size_t*) and out_residual may be c_null_ptr.
     function c_mcd_film_solve(ws, n, Dij, c, L, x0, xL, kind, species, values, &
          method, out_N, out_iterations, out_residual) &
          bind(c, name='mcd_film_solve') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: Dij(*)
       real(c_double), value :: c, L
       real(c_double), intent(in) :: x0(*), xL(*)
       integer(c_int), value :: kind
       integer(c_size_t), value :: species
       type(c_ptr), value :: values
       integer(c_int), value :: method
       real(c_double), intent(inout) :: out_N(*)
       type(c_ptr), value :: out_iterations, out_residual
       integer(c_int) :: s
     end function c_mcd_film_solve
     function c_mcd_film_profile(ws, n, Dij, c, L, x0, flux_N, n_points, z, out_x) &
          bind(c, name='mcd_film_profile') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: Dij(*)
       real(c_double), value :: c, L
       real(c_double), intent(in) :: x0(*), flux_N(*)
       integer(c_size_t), value :: n_points
       real(c_double), intent(in) :: z(*)
       real(c_double), intent(inout) :: out_x(*)
       integer(c_int) :: s
     end function c_mcd_film_profile
     function c_mcd_bulbs_linearized(ws, n, Dij, c, V1, V2, A, L, x1_0, x2_0, &
          n_times, t, out_x1, out_x2) bind(c, name='mcd_bulbs_linearized') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: Dij(*)
       real(c_double), value :: c, V1, V2, A, L
       real(c_double), intent(in) :: x1_0(*), x2_0(*)
       integer(c_size_t), value :: n_times
       real(c_double), intent(in) :: t(*)
       real(c_double), intent(inout) :: out_x1(*), out_x2(*)
       integer(c_int) :: s
     end function c_mcd_bulbs_linearized
     function c_mcd_bulbs_integrate(ws, n, Dij, c, V1, V2, A, L, x1_0, x2_0, &
          n_times, t, rel_tol, out_x1, out_x2) bind(c, name='mcd_bulbs_integrate') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n
       real(c_double), intent(in) :: Dij(*)
       real(c_double), value :: c, V1, V2, A, L
       real(c_double), intent(in) :: x1_0(*), x2_0(*)
       integer(c_size_t), value :: n_times
       real(c_double), intent(in) :: t(*)
       real(c_double), value :: rel_tol
       real(c_double), intent(inout) :: out_x1(*), out_x2(*)
       integer(c_int) :: s
     end function c_mcd_bulbs_integrate

     ! --- batched fluxes ---
     !> grad_lnP may be c_null_ptr. Layout: see the module header.
     function c_mcd_flux_batch(ws, mix, model, n_cells, n_dim, T, P, comp_basis, &
          comp, grad, grad_lnP, flux_basis, out_flux) &
          bind(c, name='mcd_flux_batch') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws, mix
       integer(c_int), value :: model
       integer(c_size_t), value :: n_cells, n_dim
       real(c_double), intent(in) :: T(*), P(*)
       integer(c_int), value :: comp_basis
       real(c_double), intent(in) :: comp(*), grad(*)
       type(c_ptr), value :: grad_lnP
       integer(c_int), value :: flux_basis
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_flux_batch
     !> M and grad_lnP may be c_null_ptr.
     function c_mcd_flux_batch_dij(ws, model, n_species, n_cells, n_dim, M, Dij, c, &
          comp_basis, comp, grad, grad_lnP, flux_basis, out_flux) &
          bind(c, name='mcd_flux_batch_dij') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_int), value :: model
       integer(c_size_t), value :: n_species, n_cells, n_dim
       type(c_ptr), value :: M
       real(c_double), intent(in) :: Dij(*), c(*)
       integer(c_int), value :: comp_basis
       real(c_double), intent(in) :: comp(*), grad(*)
       type(c_ptr), value :: grad_lnP
       integer(c_int), value :: flux_basis
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_flux_batch_dij
     function c_mcd_flux_batch_aos(ws, mix, model, n_cells, n_dim, T, P, comp_basis, &
          comp, grad, grad_lnP, flux_basis, out_flux) &
          bind(c, name='mcd_flux_batch_aos') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws, mix
       integer(c_int), value :: model
       integer(c_size_t), value :: n_cells, n_dim
       real(c_double), intent(in) :: T(*), P(*)
       integer(c_int), value :: comp_basis
       real(c_double), intent(in) :: comp(*), grad(*)
       type(c_ptr), value :: grad_lnP
       integer(c_int), value :: flux_basis
       real(c_double), intent(inout) :: out_flux(*)
       integer(c_int) :: s
     end function c_mcd_flux_batch_aos
     function c_mcd_workspace_set_iterative(ws, max_iter, tol) &
          bind(c, name='mcd_workspace_set_iterative') result(s)
       import :: c_ptr, c_int, c_size_t, c_double
       type(c_ptr), value :: ws
       integer(c_size_t), value :: max_iter
       real(c_double), value :: tol
       integer(c_int) :: s
     end function c_mcd_workspace_set_iterative
     !> Either output (double*, size_t*) may be c_null_ptr.
     function c_mcd_workspace_iterative_info(ws, out_max_error, out_max_iter) &
          bind(c, name='mcd_workspace_iterative_info') result(s)
       import :: c_ptr, c_int
       type(c_ptr), value :: ws, out_max_error, out_max_iter
       integer(c_int) :: s
     end function c_mcd_workspace_iterative_info
     function c_mcd_workspace_set_threads(ws, n_threads) &
          bind(c, name='mcd_workspace_set_threads') result(s)
       import :: c_ptr, c_int, c_size_t
       type(c_ptr), value :: ws
       integer(c_size_t), value :: n_threads
       integer(c_int) :: s
     end function c_mcd_workspace_set_threads
     !> out_max_rel_err may be c_null_ptr.
     function c_mcd_mixture_set_temperature_fit(mix, T_min, T_max, out_max_rel_err) &
          bind(c, name='mcd_mixture_set_temperature_fit') result(s)
       import :: c_ptr, c_int, c_double
       type(c_ptr), value :: mix
       real(c_double), value :: T_min, T_max
       type(c_ptr), value :: out_max_rel_err
       integer(c_int) :: s
     end function c_mcd_mixture_set_temperature_fit
     !> Outputs (double*) may be c_null_ptr.
     function c_mcd_mixture_temperature_fit(mix, out_T_min, out_T_max, out_max_rel_err) &
          bind(c, name='mcd_mixture_temperature_fit') result(s)
       import :: c_ptr, c_int
       type(c_ptr), value :: mix, out_T_min, out_T_max, out_max_rel_err
       integer(c_int) :: s
     end function c_mcd_mixture_temperature_fit
  end interface

  ! ------------------------------------------------------------------
  ! Fortran wrappers
  ! ------------------------------------------------------------------
  public :: mcd_version_number, mcd_version_string, mcd_status_string, &
       mcd_free, mcd_associated, mcd_handle_ptr, &
       mcd_formula_molar_mass, mcd_param_name, mcd_param_unit, &
       mcd_db_new, mcd_db_new_builtin, mcd_db_count, mcd_db_find, &
       mcd_db_name, mcd_db_formula, mcd_db_source, mcd_db_param, mcd_db_add, &
       mcd_db_set_param, mcd_db_load_file, mcd_db_load_string, &
       mcd_comp_normalize, mcd_comp_x_to_w, mcd_comp_w_to_x, &
       mcd_comp_mean_molar_mass_x, mcd_comp_mean_molar_mass_w, &
       mcd_comp_x_to_c, mcd_comp_c_to_x, mcd_ideal_gas_c, &
       mcd_comp_grad_x_to_w, mcd_comp_grad_w_to_x, &
       mcd_method_name, mcd_method_from_name, mcd_method_typical_error, &
       mcd_warning_string, mcd_fsg_raw, mcd_chapman_enskog_raw, &
       mcd_binary_scale, mcd_binary_gas, &
       mcd_mixture_new, mcd_mixture_count, mcd_mixture_name, &
       mcd_mixture_molar_masses, mcd_mixture_set_method, &
       mcd_mixture_set_binary, mcd_mixture_binaries, &
       mcd_workspace_alloc, mcd_workspace_species, mcd_workspace_last_error, &
       mcd_flux_compute, mcd_fick_matrix, mcd_fick_fluxes, &
       mcd_fick_eigenvalues, mcd_flux_convert, mcd_flux_total, &
       mcd_flux_project, mcd_flux_diagnose, mcd_film_solve, mcd_film_profile, &
       mcd_flux_batch, mcd_flux_batch_dij, mcd_flux_batch_aos, &
       mcd_workspace_set_iterative, mcd_workspace_iterative_info, &
       mcd_workspace_set_threads, mcd_mixture_set_temperature_fit, &
       mcd_formula_elements, mcd_formula_diffusion_volume, &
       mcd_fsg_molecule_volume, mcd_element_symbol, mcd_element_weight, &
       mcd_collision_omega_d, mcd_workspace_alloc_with

  !> Release a handle (any of the three types); an empty handle is a no-op.
  interface mcd_free
     module procedure db_free, mix_free, ws_free
  end interface mcd_free

  !> .true. when the handle holds an object.
  interface mcd_associated
     module procedure db_associated, mix_associated, ws_associated
  end interface mcd_associated

  !> The C pointer inside a handle, for the c_mcd_* layer. The handle keeps
  !> ownership: do not free the pointer yourself.
  interface mcd_handle_ptr
     module procedure db_ptr, mix_ptr, ws_ptr
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

  !> Text of an error buffer filled by C (up to its NUL).
  function from_buf(buf) result(s)
    character(kind=c_char), intent(in) :: buf(:)
    character(len=:), allocatable :: s
    integer :: i, n
    n = 0
    do i = 1, size(buf)
       if (buf(i) == c_null_char) exit
       n = i
    end do
    allocate (character(len=n) :: s)
    do i = 1, n
       s(i:i) = buf(i)
    end do
  end function from_buf

  !> stat from a C status and, when asked, errmsg = status text [: detail].
  subroutine finish(s, stat, errmsg, detail)
    integer(c_int), intent(in) :: s
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    character(len=*), intent(in), optional :: detail
    stat = int(s)
    if (.not. present(errmsg)) return
    if (s == 0) then
       errmsg = ''
    else if (present(detail)) then
       if (len_trim(detail) > 0) then
          errmsg = from_c(c_mcd_status_string(s)) // ': ' // trim(detail)
       else
          errmsg = from_c(c_mcd_status_string(s))
       end if
    else
       errmsg = from_c(c_mcd_status_string(s))
    end if
  end subroutine finish

  !> finish() with the workspace's last-error detail.
  subroutine finish_ws(ws, s, stat, errmsg)
    type(mcd_workspace_t), intent(in) :: ws
    integer(c_int), intent(in) :: s
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    if (s /= 0 .and. c_associated(ws%ptr)) then
       call finish(s, stat, errmsg, from_c(c_mcd_workspace_last_error(ws%ptr)))
    else
       call finish(s, stat, errmsg)
    end if
  end subroutine finish_ws

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
    character(kind=c_char) :: buf(ERRLEN)
    real(c_double) :: v
    integer(c_int) :: s
    buf = c_null_char
    s = c_mcd_formula_molar_mass(to_c(formula), v, buf, int(ERRLEN, c_size_t))
    if (s == 0) M = v
    call finish(s, stat, errmsg, from_buf(buf))
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
  integer function mcd_db_count(db)
    type(mcd_db_t), intent(in) :: db
    mcd_db_count = int(c_mcd_db_count(db%ptr))
  end function mcd_db_count

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
    character(kind=c_char) :: buf(ERRLEN)
    integer(c_size_t) :: k
    integer(c_int) :: s, r
    r = 0
    if (present(n_rings)) r = int(n_rings, c_int)
    buf = c_null_char
    s = c_mcd_db_add(db%ptr, to_c(name), to_c(formula), r, k, buf, &
         int(ERRLEN, c_size_t))
    if (s == 0) index = int(k) + 1
    call finish(s, stat, errmsg, from_buf(buf))
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
    character(kind=c_char) :: buf(ERRLEN)
    integer(c_int) :: s
    buf = c_null_char
    s = c_mcd_db_load_file(db%ptr, to_c(path), buf, int(ERRLEN, c_size_t))
    call finish(s, stat, errmsg, from_buf(buf))
  end subroutine mcd_db_load_file

  !> Load species from text in the mcdiff species format. Lines are
  !> separated by new_line('a').
  subroutine mcd_db_load_string(db, text, stat, errmsg)
    type(mcd_db_t), intent(inout) :: db
    character(len=*), intent(in) :: text
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    character(kind=c_char) :: buf(ERRLEN)
    integer(c_int) :: s
    buf = c_null_char
    s = c_mcd_db_load_string(db%ptr, text // c_null_char, buf, int(ERRLEN, c_size_t))
    call finish(s, stat, errmsg, from_buf(buf))
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
  subroutine mcd_ideal_gas_c(T, P, c, stat, errmsg)
    real(c_double), intent(in) :: T, P
    real(c_double), intent(inout) :: c
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_ideal_gas_c(T, P, c), stat, errmsg)
  end subroutine mcd_ideal_gas_c

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

  subroutine mcd_fsg_raw(T, P, MA, MB, VA, VB, D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, VA, VB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_fsg_raw(T, P, MA, MB, VA, VB, D), stat, errmsg)
  end subroutine mcd_fsg_raw

  subroutine mcd_chapman_enskog_raw(T, P, MA, MB, sigA, sigB, epsA, epsB, D, stat, errmsg)
    real(c_double), intent(in) :: T, P, MA, MB, sigA, sigB, epsA, epsB
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_chapman_enskog_raw(T, P, MA, MB, sigA, sigB, epsA, epsB, D), &
         stat, errmsg)
  end subroutine mcd_chapman_enskog_raw

  subroutine mcd_binary_scale(D_ref, T_ref, P_ref, T, P, exponent, D, stat, errmsg)
    real(c_double), intent(in) :: D_ref, T_ref, P_ref, T, P, exponent
    real(c_double), intent(inout) :: D
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish(c_mcd_binary_scale(D_ref, T_ref, P_ref, T, P, exponent, D), &
         stat, errmsg)
  end subroutine mcd_binary_scale

  !> Gas binary diffusivity [m^2/s] of species a and b (1-based) of db.
  subroutine mcd_binary_gas(db, a, b, method, T, P, D, stat, errmsg, rel_err, warn)
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
    s = c_mcd_binary_gas(db%ptr, cidx(a), cidx(b), int(method, c_int), T, P, D, &
         c_loc(e), c_loc(w))
    if (s == 0) then
       if (present(rel_err)) rel_err = e
       if (present(warn)) warn = int(w)
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_binary_gas

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
    character(kind=c_char) :: buf(ERRLEN)
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
    buf = c_null_char
    p = c_null_ptr
    s = c_mcd_mixture_new(db%ptr, int(n, c_size_t), ptrs, m, p, buf, &
         int(ERRLEN, c_size_t))
    if (s == 0) mix%ptr = p
    call finish(s, stat, errmsg, from_buf(buf))
  end subroutine mcd_mixture_new

  integer function mcd_mixture_count(mix)
    type(mcd_mixture_t), intent(in) :: mix
    mcd_mixture_count = int(c_mcd_mixture_count(mix%ptr))
  end function mcd_mixture_count

  !> Name of species i (1-based), '' when out of range.
  function mcd_mixture_name(mix, i) result(s)
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: i
    character(len=:), allocatable :: s
    s = from_c(c_mcd_mixture_name(mix%ptr, cidx(i)))
  end function mcd_mixture_name

  !> Molar masses [kg/mol]; M must hold mcd_mixture_count(mix) values.
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
  subroutine mcd_workspace_alloc(ws, n_species, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_species
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call ws_final(ws)
    p = c_null_ptr
    s = c_mcd_workspace_alloc(csz(n_species), p)
    if (s == 0) ws%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_alloc

  !> As mcd_workspace_alloc with the caller's allocator (copied by C).
  subroutine mcd_workspace_alloc_with(ws, n_species, allocator, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_species
    type(mcd_allocator_t), intent(in) :: allocator
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    type(c_ptr) :: p
    integer(c_int) :: s
    call ws_final(ws)
    p = c_null_ptr
    s = c_mcd_workspace_alloc_with(csz(n_species), allocator, p)
    if (s == 0) ws%ptr = p
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_alloc_with

  integer function mcd_workspace_species(ws)
    type(mcd_workspace_t), intent(in) :: ws
    mcd_workspace_species = int(c_mcd_workspace_species(ws%ptr))
  end function mcd_workspace_species

  !> Detail of the last error of a call on ws ('' if none).
  function mcd_workspace_last_error(ws) result(s)
    type(mcd_workspace_t), intent(in) :: ws
    character(len=:), allocatable :: s
    s = from_c(c_mcd_workspace_last_error(ws%ptr))
  end function mcd_workspace_last_error

  ! ==================================================================
  ! Diffusion fluxes
  ! ==================================================================

  !> Diffusion fluxes of n species at one state.
  !>   Dij(n, n) symmetric; comp(n); grad_comp(n_dim, n); flux(n_dim, n).
  !>   M(n) needed for MASS bases and pressure diffusion.
  !>   Gamma(n, n): pass the TRANSPOSE of the thermodynamic factor matrix
  !>   (Gamma(j, i) = Gamma_ij); absent = ideal. grad_lnP(n_dim) optional.
  subroutine mcd_flux_compute(ws, model, n, n_dim, Dij, c, comp_basis, comp, &
       grad_comp, flux_basis, flux, stat, errmsg, M, Gamma, grad_lnP)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: Dij(n, n), c, comp(n), grad_comp(n_dim, n)
    real(c_double), intent(inout) :: flux(n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n), grad_lnP(n_dim)
    type(c_ptr) :: pM, pG, pL
    pM = c_null_ptr
    pG = c_null_ptr
    pL = c_null_ptr
    if (present(M)) pM = c_loc(M)
    if (present(Gamma)) pG = c_loc(Gamma)
    if (present(grad_lnP)) pL = c_loc(grad_lnP)
    call finish_ws(ws, c_mcd_flux_compute(ws%ptr, int(model, c_int), csz(n), &
         csz(n_dim), pM, Dij, c, int(comp_basis, c_int), comp, grad_comp, pG, pL, &
         int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_compute

  !> Generalized Fick matrix. D(n-1, n-1) receives the TRANSPOSE of [D]
  !> (D(j, i) = [D]_ij over the species other than the dependent one, in
  !> their order): use transpose(D), or J(:, others) = -c matmul(grad(:,
  !> others), D). dependent (1-based) absent = the most abundant species;
  !> dependent_used returns the one used (1-based).
  subroutine mcd_fick_matrix(ws, n, Dij, comp_basis, comp, basis, D, stat, errmsg, &
       M, Gamma, dependent, dependent_used)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, comp_basis, basis
    real(c_double), intent(in) :: Dij(n, n), comp(n)
    real(c_double), intent(inout) :: D(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), Gamma(n, n)
    integer, intent(in), optional :: dependent
    integer, intent(inout), optional :: dependent_used
    integer(c_size_t), target :: used
    integer(c_size_t) :: dep
    type(c_ptr) :: pM, pG
    integer(c_int) :: s
    pM = c_null_ptr
    pG = c_null_ptr
    if (present(M)) pM = c_loc(M)
    if (present(Gamma)) pG = c_loc(Gamma)
    dep = MCD_DEPENDENT_AUTO
    if (present(dependent)) dep = cidx(dependent)
    used = 0
    s = c_mcd_fick_matrix(ws%ptr, csz(n), pM, Dij, int(comp_basis, c_int), comp, &
         pG, int(basis, c_int), dep, D, c_loc(used))
    if (s == 0 .and. present(dependent_used)) dependent_used = int(used) + 1
    call finish_ws(ws, s, stat, errmsg)
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
    call finish_ws(ws, c_mcd_fick_eigenvalues(ws%ptr, csz(m), D, re, im), stat, errmsg)
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
    real(c_double), intent(in) :: Dij(n, n), c, L, x0(n), xL(n)
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
    s = c_mcd_film_solve(ws%ptr, csz(n), Dij, c, L, x0, xL, int(kind, c_int), k, pv, &
         meth, N_flux, c_loc(it), c_loc(res))
    if (s == 0) then
       if (present(iterations)) iterations = int(it)
       if (present(residual)) residual = res
    end if
    call finish_ws(ws, s, stat, errmsg)
  end subroutine mcd_film_solve

  !> Film composition profile: x(n, n_points), x(:, k) at position z(k).
  subroutine mcd_film_profile(ws, n, Dij, c, L, x0, N_flux, n_points, z, x, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n, n_points
    real(c_double), intent(in) :: Dij(n, n), c, L, x0(n), N_flux(n), z(*)
    real(c_double), intent(inout) :: x(n, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish_ws(ws, c_mcd_film_profile(ws%ptr, csz(n), Dij, c, L, x0, N_flux, &
         csz(n_points), z, x), stat, errmsg)
  end subroutine mcd_film_profile

  ! ==================================================================
  ! Batched fluxes (layout: see the module header)
  ! ==================================================================

  !> Fluxes of a mixture at n_cells states, structure-of-arrays layout:
  !> T(n_cells), P(n_cells), comp(n_cells, N), grad(n_cells, n_dim, N),
  !> flux(n_cells, n_dim, N), grad_lnP(n_cells, n_dim) optional;
  !> N = mcd_mixture_count(mix). On a cell error other cells' fluxes may
  !> already be written (errmsg names the lowest failing cell).
  subroutine mcd_flux_batch(ws, mix, model, n_cells, n_dim, T, P, comp_basis, comp, &
       grad, flux_basis, flux, stat, errmsg, grad_lnP)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: model, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: T(n_cells), P(n_cells), comp(n_cells, *)
    real(c_double), intent(in) :: grad(n_cells, n_dim, *)
    real(c_double), intent(inout) :: flux(n_cells, n_dim, *)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_lnP(n_cells, n_dim)
    type(c_ptr) :: pL
    pL = c_null_ptr
    if (present(grad_lnP)) pL = c_loc(grad_lnP)
    call finish_ws(ws, c_mcd_flux_batch(ws%ptr, mix%ptr, int(model, c_int), &
         csz(n_cells), csz(n_dim), T, P, int(comp_basis, c_int), comp, grad, pL, &
         int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch

  !> Batched fluxes with the caller's binary diffusivities Dij(n_cells, n, n)
  !> and concentrations c(n_cells); comp(n_cells, n), grad and flux
  !> (n_cells, n_dim, n); M(n) and grad_lnP(n_cells, n_dim) optional.
  subroutine mcd_flux_batch_dij(ws, model, n, n_cells, n_dim, Dij, c, comp_basis, &
       comp, grad, flux_basis, flux, stat, errmsg, M, grad_lnP)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: model, n, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: Dij(n_cells, n, n), c(n_cells), comp(n_cells, n)
    real(c_double), intent(in) :: grad(n_cells, n_dim, n)
    real(c_double), intent(inout) :: flux(n_cells, n_dim, n)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: M(n), grad_lnP(n_cells, n_dim)
    type(c_ptr) :: pM, pL
    pM = c_null_ptr
    pL = c_null_ptr
    if (present(M)) pM = c_loc(M)
    if (present(grad_lnP)) pL = c_loc(grad_lnP)
    call finish_ws(ws, c_mcd_flux_batch_dij(ws%ptr, int(model, c_int), csz(n), &
         csz(n_cells), csz(n_dim), pM, Dij, c, int(comp_basis, c_int), comp, grad, &
         pL, int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch_dij

  !> As mcd_flux_batch with per-cell arrays: comp(N, n_cells), grad and
  !> flux (n_dim, N, n_cells), grad_lnP(n_dim, n_cells) optional.
  subroutine mcd_flux_batch_aos(ws, mix, model, n_cells, n_dim, T, P, comp_basis, &
       comp, grad, flux_basis, flux, stat, errmsg, grad_lnP)
    type(mcd_workspace_t), intent(inout) :: ws
    type(mcd_mixture_t), intent(in) :: mix
    integer, intent(in) :: model, n_cells, n_dim, comp_basis, flux_basis
    real(c_double), intent(in) :: T(n_cells), P(n_cells), comp(*), grad(*)
    real(c_double), intent(inout) :: flux(*)
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double), intent(in), optional, target :: grad_lnP(n_dim, n_cells)
    type(c_ptr) :: pL
    pL = c_null_ptr
    if (present(grad_lnP)) pL = c_loc(grad_lnP)
    call finish_ws(ws, c_mcd_flux_batch_aos(ws%ptr, mix%ptr, int(model, c_int), &
         csz(n_cells), csz(n_dim), T, P, int(comp_basis, c_int), comp, grad, pL, &
         int(flux_basis, c_int), flux), stat, errmsg)
  end subroutine mcd_flux_batch_aos

  !> Settings of MCD_MODEL_ITERATIVE for later batched calls on ws.
  subroutine mcd_workspace_set_iterative(ws, max_iter, tol, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: max_iter
    real(c_double), intent(in) :: tol
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish_ws(ws, c_mcd_workspace_set_iterative(ws%ptr, csz(max_iter), tol), &
         stat, errmsg)
  end subroutine mcd_workspace_set_iterative

  !> Largest error estimate and iteration count of the last ITERATIVE call.
  subroutine mcd_workspace_iterative_info(ws, max_error, max_iter, stat, errmsg)
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
    s = c_mcd_workspace_iterative_info(ws%ptr, c_loc(e), c_loc(it))
    if (s == 0) then
       max_error = e
       max_iter = int(it)
    end if
    call finish(s, stat, errmsg)
  end subroutine mcd_workspace_iterative_info

  !> OpenMP threads for later batched calls on ws (0 = OpenMP default).
  subroutine mcd_workspace_set_threads(ws, n_threads, stat, errmsg)
    type(mcd_workspace_t), intent(inout) :: ws
    integer, intent(in) :: n_threads
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    call finish_ws(ws, c_mcd_workspace_set_threads(ws%ptr, csz(n_threads)), stat, errmsg)
  end subroutine mcd_workspace_set_threads

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
    character(kind=c_char) :: buf(ERRLEN)
    integer(c_size_t) :: n
    integer(c_int) :: s
    buf = c_null_char
    s = c_mcd_formula_elements(to_c(formula), csz(cap), Z, counts, n, buf, &
         int(ERRLEN, c_size_t))
    if (s == 0) n_elements = int(n)
    call finish(s, stat, errmsg, from_buf(buf))
  end subroutine mcd_formula_elements

  !> Fuller-Ensley-Giddings diffusion volume of a formula (n_rings aromatic
  !> or heterocyclic rings, default 0).
  subroutine mcd_formula_diffusion_volume(formula, V, stat, errmsg, n_rings)
    character(len=*), intent(in) :: formula
    real(c_double), intent(inout) :: V
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    integer, intent(in), optional :: n_rings
    character(kind=c_char) :: buf(ERRLEN)
    real(c_double) :: v_out
    integer(c_int) :: s, r
    r = 0
    if (present(n_rings)) r = int(n_rings, c_int)
    buf = c_null_char
    s = c_mcd_formula_diffusion_volume(to_c(formula), r, v_out, buf, int(ERRLEN, c_size_t))
    if (s == 0) V = v_out
    call finish(s, stat, errmsg, from_buf(buf))
  end subroutine mcd_formula_diffusion_volume

  !> Tabulated diffusion volume of a simple molecule, by formula.
  subroutine mcd_fsg_molecule_volume(formula, V, stat, errmsg)
    character(len=*), intent(in) :: formula
    real(c_double), intent(inout) :: V
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v_out
    integer(c_int) :: s
    s = c_mcd_fsg_molecule_volume(to_c(formula), v_out)
    if (s == 0) V = v_out
    call finish(s, stat, errmsg, trim(formula))
  end subroutine mcd_fsg_molecule_volume

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
  subroutine mcd_collision_omega_d(T_star, omega, stat, errmsg)
    real(c_double), intent(in) :: T_star
    real(c_double), intent(inout) :: omega
    integer, intent(out) :: stat
    character(len=*), intent(out), optional :: errmsg
    real(c_double) :: v
    integer(c_int) :: s
    s = c_mcd_collision_omega_d(T_star, v)
    if (s == 0) omega = v
    call finish(s, stat, errmsg)
  end subroutine mcd_collision_omega_d

end module mcdiff
