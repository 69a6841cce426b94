! consumer.f90 - a Fortran program outside the mcdiff build, compiled with
! the installed mcdiff.mod and libraries by run_install_test.sh.
program consumer
  use, intrinsic :: iso_c_binding, only: c_double
  use mcdiff
  implicit none
  type(mcd_db_t) :: db
  integer :: stat, a, b
  real(c_double) :: D, err
  character(len=200) :: msg

  call mcd_db_new_builtin(db, stat, msg)
  if (stat /= MCD_OK) error stop 'builtin database'
  call mcd_db_find(db, 'carbon-dioxide', a, stat, msg)
  call mcd_db_find(db, 'nitrogen', b, stat, msg)
  if (stat /= MCD_OK) error stop 'find'
  call mcd_db_binary_gas(db, a, b, MCD_METHOD_FSG, 298.2_c_double, MCD_ATM, D, stat, &
       msg, rel_err=err)
  if (stat /= MCD_OK) error stop 'binary'
  ! 0.165 cm^2/s measured: Bird, Stewart and Lightfoot 2002, Table 17.1-1
  if (abs(D - 0.165e-4_c_double) > err * 0.165e-4_c_double) error stop 'FSG value'
  call mcd_free(db)
  write (*, '(a, a)') 'fortran consumer OK: mcdiff ', mcd_version_string()
end program consumer
