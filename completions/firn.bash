# bash completion for firn (installed as share/bash-completion/completions/firn).
# The options are those of `firn CMD --help`; tests/install/options.sh checks they match.
_firn() {
    local cur prev words cword
    _init_completion 2>/dev/null || {
        cur=${COMP_WORDS[COMP_CWORD]}
        prev=${COMP_WORDS[COMP_CWORD-1]}
        words=("${COMP_WORDS[@]}")
        cword=$COMP_CWORD
    }
    local common="-h --help --stdlib"
    local batch="$common --shard -j --jobs"
    local opts cmd=${words[1]} sub=${words[2]}
    case $cmd in
    run) opts="$common --format --full --summary --combination --exact-numbers -o --output --warnings-as-errors" ;;
    fmt) opts="-h --help --check --stdout" ;;
    check) opts="$batch -v --verbose --warnings-as-errors" ;;
    lsp) opts="$common --stdio" ;;
    draw) opts="$common -o --output --case --combination --diagrams --no-loads --no-envelopes --html-only --force --warnings-as-errors" ;;
    baseline)
        case $sub in
        check) opts="$batch --rel --abs --top --noise" ;;
        update) opts="$batch" ;;
        show) opts="$common" ;;
        diff) opts="$common --as --rel --abs --top --noise" ;;
        *)
            [ "$cword" -eq 2 ] && COMPREPLY=($(compgen -W "check update show diff -h --help" -- "$cur"))
            return
            ;;
        esac
        ;;
    *)
        COMPREPLY=($(compgen -W "run fmt check baseline draw lsp -h --help --version" -- "$cur"))
        return
        ;;
    esac
    case $prev in
    --format) COMPREPLY=($(compgen -W "text json" -- "$cur")); return ;;
    --diagrams) COMPREPLY=($(compgen -W "moment shear axial deflection" -- "$cur")); return ;;
    --stdlib) COMPREPLY=($(compgen -d -- "$cur")); return ;;
    -o | --output)
        if [ "$cmd" = draw ]; then COMPREPLY=($(compgen -d -- "$cur")); else COMPREPLY=($(compgen -f -- "$cur")); fi
        return
        ;;
    --shard | -j | --jobs | --rel | --abs | --top | --noise | --case | --combination) return ;;
    esac
    if [[ $cur == -* ]]; then
        COMPREPLY=($(compgen -W "$opts" -- "$cur"))
    else
        COMPREPLY=($(compgen -f -X '!*.firn' -- "$cur") $(compgen -d -- "$cur"))
    fi
}
complete -F _firn firn
