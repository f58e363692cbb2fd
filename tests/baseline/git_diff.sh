#!/bin/sh
# The git diff driver (editor-support/git/firn-diff): run directly, and, when git
# is installed, as the driver of a throwaway repository whose model changes one
# span. Either way the text diff and the moved support moment must show.
# Invoked by CTest:  sh tests/baseline/git_diff.sh FIRN WORK  (from the source folder)
set -eu
FIRN=$1
WORK=$2
SOURCE=$(pwd)
export FIRN

fail() {
    echo "FAILED: $1" >&2
    echo "--- output:" >&2
    cat "$WORK/out" >&2
    exit 1
}

# The support moment of the two-span beam: -wL^2/8 = -50 kip*ft [C: S20] before,
# -w (L1^3 + L2^3) / (8 (L1 + L2)) = -62 kip*ft after (three-moment equation, [D]).
expect_results() {
    grep -q '^-grid x A = 0 ft, B = 20 ft, C = 40 ft$' "$WORK/out" || fail "$1: old line"
    grep -q '^+grid x A = 0 ft, B = 20 ft, C = 44 ft$' "$WORK/out" || fail "$1: new line"
    grep -q "^results of $2: 14 moved (25 values compared); 14 by more than 1 % of their kind's largest\$" \
        "$WORK/out" || fail "$1: heading"
    grep -Eq '^  member roof\.B\.C +moment_min +case D +-50\.0000 -> -62\.0000 kip\*ft +\+24\.00 % +19\.35 % of largest moment$' \
        "$WORK/out" || fail "$1: moved moment"
}

rm -rf "$WORK"
mkdir -p "$WORK"

# 1. The driver run as git would run it.
model=tests/baseline/moved/two_span.firn
sh editor-support/git/firn-diff "$model" tests/baseline/same/two_span.firn 0 100644 \
    "$model" 0 100644 > "$WORK/out" || fail "the driver exited with an error"
expect_results "driver" "$model"

# An added model: the text diff only, and still status 0.
sh editor-support/git/firn-diff new.firn /dev/null . . "$model" 0 100644 > "$WORK/out" \
    || fail "an added model"
grep -q '^+model "Two-span roof beam"$' "$WORK/out" || fail "added model text"

# 2. Through git, when it is installed.
if ! command -v git > /dev/null 2>&1; then
    echo "git is not installed: the driver was tested on its own"
    exit 0
fi
repo="$WORK/repo"
mkdir -p "$repo/frames"
cp tests/baseline/same/two_span.firn "$repo/frames/two_span.firn"
cd "$repo"
# Keep the user's and the system's git settings out of the test.
export HOME="$WORK" GIT_CONFIG_NOSYSTEM=1 GIT_CONFIG_GLOBAL=/dev/null
git init -q .
git config user.name "firn test"
git config user.email "test@example.invalid"
git config diff.firn.command "$SOURCE/editor-support/git/firn-diff"
echo '*.firn diff=firn' > .gitattributes
git add .gitattributes frames/two_span.firn
git commit -q -m "two spans of 20 ft"
sed 's/C = 40 ft/C = 44 ft/' frames/two_span.firn > frames/edited && mv frames/edited frames/two_span.firn
git --no-pager diff > "$WORK/out" || fail "git diff"
expect_results "git diff" frames/two_span.firn
echo "ok"
