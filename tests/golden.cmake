# Runs one golden case: `firn run MODEL` must print exactly MODEL's .golden
# (standard output, then standard error), twice in a row with the same bytes.
# Models named error_*.firn must exit with status 2, all others with 0.
# If MODEL.json.golden exists, `--format json` output must match it too.
# Invoked by CTest:  cmake -DFIRN=<firn> -DMODEL=<path> -P tests/golden.cmake
string(REGEX REPLACE "\\.firn$" "" stem "${MODEL}")
get_filename_component(name "${MODEL}" NAME)
set(expected_status 0)
if(name MATCHES "^error_")
  set(expected_status 2)
endif()

function(run_firn out_var status_var)
  execute_process(COMMAND ${FIRN} run ${MODEL} ${ARGN}
                  OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
  set(${out_var} "${out}${err}" PARENT_SCOPE)
  set(${status_var} "${status}" PARENT_SCOPE)
endfunction()

function(check_against golden_file)
  run_firn(first status ${ARGN})
  if(NOT status EQUAL expected_status)
    message(FATAL_ERROR "${MODEL}: exit status ${status}, expected ${expected_status}\n${first}")
  endif()
  run_firn(second status2 ${ARGN})
  if(NOT first STREQUAL second)
    message(FATAL_ERROR "${MODEL}: two runs printed different output")
  endif()
  if(NOT EXISTS "${golden_file}")
    message(FATAL_ERROR "${MODEL}: ${golden_file} is missing; run tests/refresh_golden")
  endif()
  file(READ "${golden_file}" golden)
  if(NOT first STREQUAL golden)
    file(WRITE "${golden_file}.actual" "${first}")
    message(FATAL_ERROR "${MODEL}: output differs from ${golden_file}; "
                        "compare with ${golden_file}.actual (diff -u)")
  endif()
endfunction()

check_against("${stem}.golden")
if(EXISTS "${stem}.json.golden")
  check_against("${stem}.json.golden" --format json)
endif()
