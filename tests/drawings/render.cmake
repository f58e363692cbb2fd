# Renders every drawing of a model to PNG with rsvg-convert (Debian package
# librsvg2-bin): fails if the tool is missing, if firn draw fails, or if any
# sheet does not render.
# Invoked by CTest:  cmake -DFIRN=<firn> -DMODEL=<path> -DWORK=<folder> -P tests/drawings/render.cmake
find_program(RSVG rsvg-convert)
if(NOT RSVG)
  message(FATAL_ERROR "rsvg-convert is not installed; it checks that the drawings render. "
                      "Install it with: apt-get install librsvg2-bin")
endif()
file(REMOVE_RECURSE "${WORK}")
execute_process(COMMAND ${FIRN} draw ${MODEL} -o ${WORK}/svg
                OUTPUT_VARIABLE out ERROR_VARIABLE err RESULT_VARIABLE status)
if(NOT status EQUAL 0)
  message(FATAL_ERROR "firn draw ${MODEL} exited with ${status}\n${out}${err}")
endif()
file(GLOB_RECURSE sheets RELATIVE ${WORK}/svg ${WORK}/svg/*.svg)
list(LENGTH sheets count)
if(count EQUAL 0)
  message(FATAL_ERROR "firn draw ${MODEL} wrote no drawings")
endif()
foreach(sheet ${sheets})
  string(REPLACE "/" "_" png "${sheet}.png")
  execute_process(COMMAND ${RSVG} --format=png -o ${WORK}/${png} ${WORK}/svg/${sheet}
                  ERROR_VARIABLE err RESULT_VARIABLE status)
  if(NOT status EQUAL 0 OR NOT EXISTS ${WORK}/${png})
    message(FATAL_ERROR "rsvg-convert could not render ${sheet}: ${err}")
  endif()
  file(SIZE ${WORK}/${png} size)
  if(size LESS 1000)
    message(FATAL_ERROR "rsvg-convert rendered ${sheet} as an almost empty image (${size} bytes)")
  endif()
endforeach()
message(STATUS "rendered ${count} drawings of ${MODEL}")
