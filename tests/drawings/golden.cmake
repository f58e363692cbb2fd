# Runs one drawings golden case: `firn draw` with the arguments in CASE.args
# (one a line, the model first) must write exactly the files of the folder
# CASE/ (every SVG and the list of files; report.html holds the text report,
# whose layout the report goldens pin), byte for byte, twice in a row.
# Invoked by CTest:  cmake -DFIRN=<firn> -DCASE=tests/drawings/<name> -DWORK=<folder> -P ...
get_filename_component(CASE "${CASE}" ABSOLUTE)
file(STRINGS "${CASE}.args" args)
file(REMOVE_RECURSE "${WORK}")
foreach(run first second)
  execute_process(COMMAND ${FIRN} draw ${args} -o ${WORK}/${run}
                  OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
  if(NOT status EQUAL 0)
    message(FATAL_ERROR "firn draw ${args} exited with ${status}\n${out}${err}")
  endif()
endforeach()
file(GLOB_RECURSE written RELATIVE ${WORK}/first ${WORK}/first/*)
list(REMOVE_ITEM written report.html)
file(GLOB_RECURSE expected RELATIVE ${CASE} ${CASE}/*)
list(SORT written)
list(SORT expected)
if(NOT written STREQUAL expected)
  message(FATAL_ERROR "${CASE}: firn draw wrote\n  ${written}\nbut the golden folder holds\n  "
                      "${expected}\nRun tests/refresh_golden and read the git diff.")
endif()
foreach(f ${written})
  file(READ ${WORK}/first/${f} a)
  file(READ ${WORK}/second/${f} b)
  if(NOT a STREQUAL b)
    message(FATAL_ERROR "${CASE}: two runs wrote different ${f}")
  endif()
  file(READ ${CASE}/${f} golden)
  if(NOT a STREQUAL golden)
    message(FATAL_ERROR "${CASE}: ${f} differs from the golden; compare "
                        "${WORK}/first/${f} with ${CASE}/${f} (diff -u)")
  endif()
endforeach()
