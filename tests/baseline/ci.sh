#!/bin/sh
# The sample CI script (editor-support/ci/check-models.sh) on a copy of a small
# repository of models (tests/baseline/ci): all passing, then a span changed, a
# file left unformatted, a baseline missing, and one slice of two.
# Invoked by CTest:  sh tests/baseline/ci.sh FIRN WORK  (from the source folder)
set -u
FIRN=$1
WORK=$2
SCRIPT=$(pwd)/editor-support/ci/check-models.sh
export FIRN

fail() {
    echo "FAILED: $1" >&2
    echo "--- output:" >&2
    cat "$WORK/out" >&2
    exit 1
}

# Runs the script on the copy; $1 is the exit status it must give.
run() {
    expected=$1
    shift
    (cd "$WORK/repo" && env "$@" sh "$SCRIPT" frames) > "$WORK/out" 2>&1
    got=$?
    [ "$got" -eq "$expected" ] || fail "exit status $got, expected $expected ($*)"
}

expect() {
    grep -Eq "$1" "$WORK/out" || fail "no line matching: $1"
}

rm -rf "$WORK"
mkdir -p "$WORK/repo"
cp -R tests/baseline/ci/frames "$WORK/repo/frames"

run 0 FIRN_JOBS=2
expect '^== firn fmt --check$'
expect '^frames/two_span.firn: unchanged \(25 values\)$'
expect '^2 models: 2 unchanged, 0 moved$'
grep -q 'loads.firn: unchanged' "$WORK/out" && fail "loads.firn is not a model"

# The second span from 20 ft to 24 ft: the support moment goes from -wL^2/8 = -50
# kip*ft [C: S20] to -w (L1^3 + L2^3) / (8 (L1 + L2)) = -62 kip*ft (three-moment
# equation, [D]); the baseline check fails with status 1.
model="$WORK/repo/frames/two_span.firn"
sed 's/C = 40 ft/C = 44 ft/' "$model" > "$model.new" && mv "$model.new" "$model"
run 1
expect '^  member roof\.A\.B +moment_min +case D +-50\.0000 -> -62\.0000 kip\*ft +\+24\.00 % +19\.35 % of largest moment$'
expect '^2 models: 1 unchanged, 1 moved$'
expect '^check-models: FAILED \(status 1\)$'

# A file not in the canonical layout fails the format step (the others still run).
printf 'let   roof_dead = 1 kip/ft\n' > "$WORK/repo/frames/loads.firn"
run 1
expect 'loads.firn'
expect '^== firn baseline check$'

# A missing baseline is status 2, with the command that creates it.
rm "$WORK/repo/frames/cantilever.baseline"
run 2
expect 'create it with `firn baseline update frames/cantilever.firn`'

# One slice of two (the models sorted: cantilever, then two_span): one model each,
# and the format step in slice 1 only.
run 1 FIRN_SHARD=2/2
expect '^frames/two_span.firn: 14 moved'
expect '^1 model: 0 unchanged, 1 moved$'
grep -q '^== firn fmt --check$' "$WORK/out" && fail "the format step ran in slice 2"
run 2 FIRN_SHARD=1/2
expect '^== firn fmt --check$'
expect '^1 model: 0 unchanged, 0 moved, 1 not compared$'
echo "ok"
