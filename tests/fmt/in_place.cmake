# `firn fmt FILE` rewrites a copy of tests/fmt/unformatted.firn in place (never the
# tracked file), says so on standard error, and then leaves the formatted file alone.
# Invoked by CTest:  cmake -DFIRN=<firn> -DWORK=<scratch folder> -P tests/fmt/in_place.cmake
file(REMOVE_RECURSE "${WORK}")
file(MAKE_DIRECTORY "${WORK}")
file(COPY_FILE tests/fmt/unformatted.firn "${WORK}/model.firn")
file(READ tests/fmt/unformatted.expected expected)

execute_process(COMMAND ${FIRN} fmt "${WORK}/model.firn"
                OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
file(READ "${WORK}/model.firn" actual)
if(NOT status EQUAL 0 OR NOT out STREQUAL "" OR NOT err STREQUAL "formatted ${WORK}/model.firn\n")
  message(FATAL_ERROR "first run: status ${status}\n${out}${err}")
endif()
if(NOT actual STREQUAL expected)
  message(FATAL_ERROR "the rewritten file differs from tests/fmt/unformatted.expected:\n${actual}")
endif()

execute_process(COMMAND ${FIRN} fmt "${WORK}/model.firn"
                OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
if(NOT status EQUAL 0 OR NOT out STREQUAL "" OR NOT err STREQUAL "")
  message(FATAL_ERROR "second run on a formatted file: status ${status}\n${out}${err}")
endif()
file(REMOVE_RECURSE "${WORK}")
