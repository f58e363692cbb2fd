#!/bin/sh
# Outputs and inputs that must never lose the user's work or hang (issue: nothing wrong
# passes silently): a full standard output, an output that is an input of the run, links,
# FIFOs, read-only files, endless standard input, deep and NUL-holding `use` paths.
# Usage: outputs.sh FIRN WORK (WORK is emptied and used as scratch space).
set -u
firn=$1
work=$2
rm -rf "$work" && mkdir -p "$work" || exit 1
failures=0

fail() {
    echo "FAIL: $1"
    failures=$((failures + 1))
}

# expect STATUS TEXT: the last command's status and a line of its standard error.
expect() {
    [ "$status" -eq "$1" ] || fail "$2: exit $status, expected $1"
    grep -qF -- "$3" "$work/err" || fail "$2: standard error lacks: $3 (has: $(cat "$work/err"))"
}

cp examples/shelter.firn "$work/m.firn"
"$firn" run "$work/m.firn" > "$work/report.txt" 2> /dev/null || fail "the demo runs"

"$firn" run "$work/m.firn" > /dev/full 2> "$work/err"
status=$?
expect 2 "a full standard output" "firn: error: cannot write standard output: No space left on device"

"$firn" run "$work/m.firn" -o "$work/m.firn" 2> "$work/err"
status=$?
expect 2 "-o onto the model" "would overwrite '$work/m.firn', an input of this run"
cmp -s examples/shelter.firn "$work/m.firn" || fail "-o onto the model changed the model"

ln -s m.firn "$work/alias.txt"
"$firn" run "$work/m.firn" -o "$work/alias.txt" 2> "$work/err"
status=$?
expect 2 "-o onto a link to the model" "an input of this run"
cmp -s examples/shelter.firn "$work/m.firn" || fail "-o onto a link to the model changed it"

ln -s out.txt "$work/link.txt"
"$firn" run "$work/m.firn" -o "$work/link.txt" 2> "$work/err" || fail "-o onto a link: $(cat "$work/err")"
[ -L "$work/link.txt" ] || fail "-o replaced the link with a file"
cmp -s "$work/report.txt" "$work/out.txt" || fail "-o through a link did not write the file it names"

mkfifo "$work/pipe"
cat "$work/pipe" > "$work/from_pipe.txt" &
reader=$!
"$firn" run "$work/m.firn" -o "$work/pipe" 2> "$work/err" || fail "-o onto a FIFO: $(cat "$work/err")"
wait "$reader"
[ -p "$work/pipe" ] || fail "-o replaced the FIFO with a file"
cmp -s "$work/report.txt" "$work/from_pipe.txt" || fail "-o onto a FIFO did not write through it"

timeout 20 "$firn" run "$work/pipe" 2> "$work/err"
status=$?
expect 2 "a FIFO as the model" "cannot read '$work/pipe': not a regular file"

printf 'model "ragged"\nnode A at x = 0 m,     y = 0 m\n' > "$work/ro.firn"
chmod 444 "$work/ro.firn"
cp "$work/ro.firn" "$work/ro.before"
"$firn" fmt "$work/ro.firn" 2> "$work/err"
status=$?
expect 2 "fmt of a read-only file" "is read-only; it was left as it is"
cmp -s "$work/ro.before" "$work/ro.firn" || fail "fmt rewrote a read-only file"

timeout 60 "$firn" fmt - < /dev/zero > /dev/null 2> "$work/err"
status=$?
expect 2 "fmt of endless standard input" "cannot read standard input: larger than 64 MiB"

# A chain of 150 files, each using the next: refused at the 100th with a located error.
i=1
while [ $i -le 150 ]; do
    printf 'use "c%d.firn"\n' $((i + 1)) > "$work/c$i.firn"
    i=$((i + 1))
done
printf 'model "deep"\n' > "$work/c151.firn"
"$firn" run "$work/c1.firn" 2> "$work/err"
status=$?
expect 2 "a deep chain of use" "c100.firn:1:5: error: files are used more than 100 deep here"

printf 'model "nul"\nuse "parts\000.firn"\n' > "$work/nul.firn"
"$firn" run "$work/nul.firn" 2> "$work/err"
status=$?
expect 2 "a NUL in a use path" "found a character that is not allowed here (byte 0x00)"

printf 'model "bell\033[31m red"\n' > "$work/escape.firn"
"$firn" run "$work/escape.firn" 2> "$work/err"
status=$?
expect 2 "a terminal escape in a title" "found a character that is not allowed here (byte 0x1B)"

# A writer killed half way leaves NAME.firn-XXXXXX beside its file; the next write of that
# file removes it once it is a minute old (and leaves a younger one, a live writer's, alone).
printf 'stale' > "$work/report.txt.firn-AbC123"
touch -d '2 hours ago' "$work/report.txt.firn-AbC123"
printf 'live' > "$work/report.txt.firn-XyZ789"
"$firn" run "$work/m.firn" -o "$work/report.txt" 2> "$work/err" || fail "-o after a killed write"
[ ! -e "$work/report.txt.firn-AbC123" ] || fail "an orphan temporary file was left"
[ -e "$work/report.txt.firn-XyZ789" ] || fail "a live writer's temporary file was removed"

[ "$failures" -eq 0 ] || exit 1
echo "all output and input cases pass"
