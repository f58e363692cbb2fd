# The command line of `firn draw`: bad input and bad folders give exit status 2
# and a clear message, never a crash, and a folder firn did not write is left
# alone unless --force.
# Invoked by CTest:  cmake -DFIRN=<firn> -DWORK=<folder> -P tests/drawings/cli.cmake
file(REMOVE_RECURSE "${WORK}")
file(MAKE_DIRECTORY "${WORK}")

function(expect status_wanted message_wanted)
  execute_process(COMMAND ${FIRN} draw ${ARGN} OUTPUT_VARIABLE out ERROR_VARIABLE err
                  RESULT_VARIABLE status)
  if(NOT status EQUAL status_wanted)
    message(FATAL_ERROR "firn draw ${ARGN}: exit status ${status}, expected ${status_wanted}\n"
                        "${out}${err}")
  endif()
  string(FIND "${out}${err}" "${message_wanted}" found)
  if(found EQUAL -1)
    message(FATAL_ERROR "firn draw ${ARGN}: expected '${message_wanted}' in\n${out}${err}")
  endif()
endfunction()

expect(2 "cannot" tests/drawings/no_such_model.firn -o ${WORK}/a)
expect(2 "no load case is named 'Q'" examples/shelter.firn --case Q -o ${WORK}/b)
expect(2 "no combination is named 'x*'" examples/shelter.firn --combination x* -o ${WORK}/b)
expect(2 "--diagrams" examples/shelter.firn --diagrams torsion -o ${WORK}/b)
if(EXISTS ${WORK}/b)
  message(FATAL_ERROR "a refused run created its output folder")
endif()

file(WRITE ${WORK}/mine/frame.svg "my own drawing")
expect(2 "holds files that firn draw did not write" examples/shelter.firn -o ${WORK}/mine)
file(READ ${WORK}/mine/frame.svg kept)
if(NOT kept STREQUAL "my own drawing")
  message(FATAL_ERROR "firn draw overwrote a file it did not write")
endif()
expect(0 "wrote" examples/shelter.firn --force --no-loads -o ${WORK}/mine)

file(WRITE ${WORK}/plain_file "x")
expect(2 "exists and is not a folder" examples/shelter.firn -o ${WORK}/plain_file)

expect(0 "inside the report only" examples/shelter.firn --html-only -o ${WORK}/html)
file(GLOB_RECURSE html_files RELATIVE ${WORK}/html ${WORK}/html/*)
if(NOT html_files STREQUAL "firn-drawings.txt;report.html")
  message(FATAL_ERROR "--html-only wrote ${html_files}")
endif()
