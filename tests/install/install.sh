#!/bin/sh
# `cmake --install` into a folder of the build tree, then check what it installed.
# Usage: install.sh CMAKE BUILD_DIR (run from the repository root)
set -eu
cmake=$1 build=$2
prefix=$build/install-test
rm -rf "$prefix"
"$cmake" --install "$build" --prefix "$prefix" >/dev/null
fail() { echo "install: $*"; exit 1; }
for f in bin/firn share/man/man1/firn.1 share/bash-completion/completions/firn \
    share/zsh/site-functions/_firn share/firn/editor-support/README.md \
    share/firn/editor-support/vim/syntax/firn.vim share/firn/editor-support/git/firn-diff; do
    [ -f "$prefix/$f" ] || fail "$f not installed"
done
[ -x "$prefix/share/firn/editor-support/git/firn-diff" ] || fail "firn-diff is not executable"
"$prefix/bin/firn" run examples/shelter.firn >/dev/null || fail "the installed firn does not run"
# draw -o - prints the report.html that a folder would receive, and writes no folder.
"$prefix/bin/firn" draw examples/shelter.firn -o - >"$prefix/stdout.html" || fail "draw -o - failed"
"$prefix/bin/firn" draw examples/shelter.firn -o "$prefix/drawings" --html-only >/dev/null
cmp -s "$prefix/stdout.html" "$prefix/drawings/report.html" || fail "draw -o - differs from report.html"
[ ! -e ./- ] || fail "draw -o - wrote a folder named -"
page=$prefix/share/man/man1/firn.1
if command -v man >/dev/null 2>&1; then
    out=$(MANWIDTH=80 man -l "$page" 2>&1) || fail "man -l cannot render the page: $out"
    for heading in NAME SYNOPSIS CAUTION COMMANDS "EXIT STATUS" FILES ENVIRONMENT; do
        printf '%s\n' "$out" | grep -q "^$heading" || fail "rendered page lacks $heading"
    done
else
    grep -q '^\.TH FIRN 1' "$page" || fail "no .TH line"
    for heading in NAME SYNOPSIS CAUTION COMMANDS '"EXIT STATUS"' FILES ENVIRONMENT; do
        grep -q "^\.SH $heading" "$page" || fail "no section $heading"
    done
fi
grep -q 'licensed engineer' "$page" || fail "the man page lacks the caution"
bash -n "$prefix/share/bash-completion/completions/firn" || fail "bash rejects the completion"
echo "installed and checked in $prefix"
