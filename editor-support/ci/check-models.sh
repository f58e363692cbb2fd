#!/bin/sh
# check-models.sh: a sample CI step for a repository of firn models, in plain
# POSIX sh for any CI service (or none). From the repository's top:
#
#   editor-support/ci/check-models.sh [FOLDER]      # FOLDER defaults to .
#
# It runs, on every *.firn file under FOLDER:
#   1. firn fmt --check             every file is in the canonical layout;
#   2. firn check                   every model's expectations hold;
#   3. firn baseline check          every model's results match its committed
#                                   MODEL.baseline within tolerance.
# A model is a .firn file with a `model "..."` line; files that only hold shared
# values and sections (used with `use "file"`) are format-checked only. Every
# step runs even when an earlier one failed, so one run shows every problem.
#
# Environment:
#   FIRN            the firn executable (default: firn on the PATH)
#   FIRN_SHARD      K/N: check only the K-th of N slices of the models, for N
#                   parallel CI jobs (the format check runs in slice 1 only)
#   FIRN_JOBS       models analysed at once (default: one per core)
#   FIRN_BASELINE_OPTIONS   more options for `firn baseline check` (--rel 0.001)
#
# Exit status: 0 all passed; 1 a file is not formatted, an expectation failed
# or a result moved; 2 a model has errors or a baseline is missing or bad.
set -u

firn=${FIRN:-firn}
folder=${1:-.}
shard=${FIRN_SHARD:-}
status=0

# Remembers the highest exit status of the steps.
note() {
    if [ "$1" -gt "$status" ]; then
        status=$1
    fi
}

list=$(mktemp) || exit 2
trap 'rm -f "$list"' EXIT
find "$folder" -type f -name '*.firn' | LC_ALL=C sort > "$list"
if [ ! -s "$list" ]; then
    echo "check-models: no .firn files under $folder"
    exit 0
fi

# Files go into the positional parameters, one line of the list each, so that
# names may hold spaces.
case "$shard" in
"" | 1/*)
    echo "== firn fmt --check"
    set --
    while IFS= read -r file; do
        set -- "$@" "$file"
    done < "$list"
    "$firn" fmt --check "$@"
    note $?
    ;;
esac

set --
while IFS= read -r file; do
    if grep -Eq '^[[:space:]]*model[[:space:]]+"' "$file"; then
        set -- "$@" "$file"
    fi
done < "$list"
if [ "$#" -eq 0 ]; then
    echo "check-models: no models under $folder"
    exit "$status"
fi

batch=""
[ -n "$shard" ] && batch="--shard $shard"
[ -n "${FIRN_JOBS:-}" ] && batch="$batch --jobs $FIRN_JOBS"

echo "== firn check"
# shellcheck disable=SC2086  # $batch is a list of words
"$firn" check $batch "$@"
note $?

echo "== firn baseline check"
# shellcheck disable=SC2086
"$firn" baseline check $batch ${FIRN_BASELINE_OPTIONS:-} "$@"
note $?

if [ "$status" -ne 0 ]; then
    echo "check-models: FAILED (status $status)"
    case "$status" in
    1) echo "  (after an intended change: firn fmt FILE, or firn baseline update MODEL, and commit)" ;;
    esac
fi
exit "$status"
