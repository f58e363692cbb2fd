# `firn baseline update` and `check` on a copy of a model in the build folder (no
# test may rewrite a tracked file): a missing baseline, writing it, leaving an
# unchanged one alone, a span change that moves values, and a file that is not a
# baseline, which update must not overwrite.
# Invoked by CTest:  cmake -DFIRN=<firn> -DWORK=<folder> -P tests/baseline/update.cmake
file(REMOVE_RECURSE "${WORK}")
file(MAKE_DIRECTORY "${WORK}")
file(COPY_FILE tests/baseline/same/two_span.firn "${WORK}/two_span.firn")
set(model "${WORK}/two_span.firn")
set(baseline "${WORK}/two_span.baseline")

# Runs firn with the arguments after STATUS and checks the exit status; leaves
# the output in `out` and `err`.
function(firn_expect expected_status)
  execute_process(COMMAND ${FIRN} ${ARGN} OUTPUT_VARIABLE o ERROR_VARIABLE e RESULT_VARIABLE s)
  if(NOT s STREQUAL expected_status)
    message(FATAL_ERROR "firn ${ARGN}: exit status ${s}, expected ${expected_status}\n${o}${e}")
  endif()
  set(out "${o}" PARENT_SCOPE)
  set(err "${e}" PARENT_SCOPE)
endfunction()

function(expect_match text pattern what)
  if(NOT text MATCHES "${pattern}")
    message(FATAL_ERROR "${what}: expected to match '${pattern}', got:\n${text}")
  endif()
endfunction()

# No baseline yet: an error that says how to create one.
firn_expect(2 baseline check ${model})
expect_match("${err}" "no baseline for .*create it with `firn baseline update .*two_span.firn`"
             "missing baseline")

# update writes it and says so; the file is what `show` prints.
firn_expect(0 baseline update ${model})
expect_match("${err}" "^updated .*two_span.baseline\n$" "first update")
file(READ "${baseline}" written)
firn_expect(0 baseline show ${model})
if(NOT out STREQUAL written)
  message(FATAL_ERROR "the baseline file differs from `firn baseline show`")
endif()

# An unchanged baseline is neither rewritten nor reported; check passes.
firn_expect(0 baseline update ${model})
if(NOT err STREQUAL "")
  message(FATAL_ERROR "update of an unchanged baseline said: ${err}")
endif()
firn_expect(0 baseline check ${model})
expect_match("${out}" "unchanged \\(25 values\\)\n1 model: 1 unchanged, 0 moved\n$" "check")

# The second span from 20 ft to 24 ft: the support moment goes from -wL^2/8 = -50
# kip*ft [C: S20] to -w (L1^3 + L2^3) / (8 (L1 + L2)) = -62 kip*ft (three-moment
# equation, [D]) in both members, +24 %; check fails with status 1.
file(READ "${model}" text)
string(REPLACE "C = 40 ft" "C = 44 ft" text "${text}")
file(WRITE "${model}" "${text}")
firn_expect(1 baseline check ${model})
expect_match("${out}" "member roof.A.B +moment_min +case D +-50.0000 -> -62.0000 kip\\*ft +\\+24.00 %"
             "moved span")
expect_match("${out}" "member roof.B.C +moment_min +case D +-50.0000 -> -62.0000 kip\\*ft +\\+24.00 %"
             "moved span")
expect_match("${out}" "1 model: 0 unchanged, 1 moved\n$" "moved summary")
file(READ "${baseline}" after)
if(NOT after STREQUAL written)
  message(FATAL_ERROR "check rewrote the baseline")
endif()

# Accepting the change is an explicit update; then check passes again.
firn_expect(0 baseline update ${model})
expect_match("${err}" "^updated " "second update")
firn_expect(0 baseline check ${model})

# A file named like a baseline that is not one is never overwritten.
file(COPY_FILE tests/baseline/same/two_span.firn "${WORK}/notes.firn")
file(WRITE "${WORK}/notes.baseline" "Notes kept by hand.\n")
firn_expect(2 baseline update ${WORK}/notes.firn)
expect_match("${err}" "not a firn baseline; not overwritten" "refusal")
file(READ "${WORK}/notes.baseline" notes)
if(NOT notes STREQUAL "Notes kept by hand.\n")
  message(FATAL_ERROR "update overwrote a file that is not a baseline")
endif()
