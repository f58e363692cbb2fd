#!/bin/sh
# Option drift: every option `firn CMD --help` lists must appear in the man page and in both
# completion files, so a new option cannot ship undocumented.
# Usage: options.sh FIRN MAN_PAGE BASH_COMPLETION ZSH_COMPLETION
set -u
firn=$1 man=$2 bash_file=$3 zsh_file=$4
failed=0
# The man page writes a hyphen as \-; read it as the user sees it.
man_text=$(sed 's/\\-/-/g' "$man")

has() {  # has TEXT OPTION: OPTION stands as a word of its own in TEXT
    printf '%s\n' "$1" | grep -Eq -- "(^|[^-a-z])$2([^-a-z]|\$)"
}

check_command() {  # check_command WORD...: the options of `firn WORD... --help`
    help=$("$firn" "$@" --help) || { echo "firn $* --help failed"; failed=1; return; }
    opts=$(printf '%s\n' "$help" | sed -n 's/^ *\(-[-a-zA-Z,]*\).*/\1/p' | tr ',' '\n')
    [ -n "$opts" ] || { echo "firn $* --help lists no options"; failed=1; return; }
    for opt in $opts; do
        for place in man bash zsh; do
            case $place in
            man) text=$man_text ;;
            bash) text=$(cat "$bash_file") ;;
            zsh) text=$(cat "$zsh_file") ;;
            esac
            has "$text" "$opt" || { echo "firn $*: $opt missing from the $place file"; failed=1; }
        done
    done
}

check_command
for cmd in run fmt check draw lsp baseline "baseline check" "baseline update" "baseline show" \
    "baseline diff"; do
    # shellcheck disable=SC2086  # the baseline commands are two words
    check_command $cmd
    for word in $cmd; do
        has "$man_text" "$word" || { echo "command $word missing from the man page"; failed=1; }
    done
done
[ $failed -eq 0 ] && echo "every option of every command is in the man page and completions"
exit $failed
