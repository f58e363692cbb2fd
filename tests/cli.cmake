# Runs one command-line case: tests/cli/NAME.args holds the arguments (one per
# line, paths relative to the repository); NAME.stdout, NAME.stderr and
# NAME.status hold what firn must print and its exit status. An optional NAME.env
# holds environment settings (NAME=VALUE, one per line) for the run, and an
# optional NAME.stdin is given to firn as its standard input.
# Invoked by CTest:  cmake -DFIRN=<firn> -DCASE=tests/cli/NAME -P tests/cli.cmake
file(STRINGS "${CASE}.args" args)
set(env "")
if(EXISTS "${CASE}.env")
  file(STRINGS "${CASE}.env" settings)
  set(env ${CMAKE_COMMAND} -E env ${settings})
endif()
set(input "")
if(EXISTS "${CASE}.stdin")
  set(input INPUT_FILE "${CASE}.stdin")
endif()
execute_process(COMMAND ${env} ${FIRN} ${args} ${input}
                OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
file(READ "${CASE}.status" expected_status)
string(STRIP "${expected_status}" expected_status)
if(NOT status STREQUAL expected_status)
  message(FATAL_ERROR "${CASE}: exit status ${status}, expected ${expected_status}\n${out}${err}")
endif()
foreach(stream stdout stderr)
  if(stream STREQUAL "stdout")
    set(actual "${out}")
  else()
    set(actual "${err}")
  endif()
  file(READ "${CASE}.${stream}" expected)
  if(NOT actual STREQUAL expected)
    file(WRITE "${CASE}.${stream}.actual" "${actual}")
    message(FATAL_ERROR "${CASE}: ${stream} differs; compare with ${CASE}.${stream}.actual")
  endif()
endforeach()
