# SPDX-License-Identifier: MIT
# Bash completion for rackreach: subcommands, their options, the options' choices, project and CSV files, and the
# shipped population tables. Installed as share/bash-completion/completions/rackreach. Written by hand from the
# CLI's definition (app/cli/*_cmd.cpp); tests/install/check_cli_docs.py checks it offers every subcommand, option
# and choice that `rackreach --help` lists.

_rackreach_files() {  # $1: a glob the files must match (directories are always offered)
  local IFS=$'\n'
  compopt -o filenames 2>/dev/null
  COMPREPLY=($(compgen -d -- "$cur") $(compgen -f -X "!$1" -- "$cur"))
}

_rackreach_population_names() {  # shipped tables beside the rackreach on PATH, and table files
  local exe dir f names=()
  exe=$(command -v rackreach 2>/dev/null)
  if [[ -n ${RACKREACH_DATA_DIR-} ]]; then
    dir=$RACKREACH_DATA_DIR
  elif [[ -n $exe ]]; then
    dir=$(dirname -- "$(readlink -f -- "$exe")")/../share/rackreach/population
  fi
  if [[ -n $dir && -d $dir ]]; then
    for f in "$dir"/*.json; do
      [[ -e $f ]] && f=${f##*/} && names+=("${f%.json}")
    done
  fi
  local IFS=$'\n'
  COMPREPLY=($(compgen -W "${names[*]}" -- "$cur") $(compgen -f -X '!*.json' -- "$cur") $(compgen -d -- "$cur"))
}

_rackreach() {
  local cur=${COMP_WORDS[COMP_CWORD]} prev=""
  ((COMP_CWORD > 0)) && prev=${COMP_WORDS[COMP_CWORD - 1]}
  # --format=json: bash splits at '=', so the option is the word before it.
  if [[ $prev == "=" ]] && ((COMP_CWORD > 1)); then
    prev=${COMP_WORDS[COMP_CWORD - 2]}
  elif [[ $cur == "=" ]] && ((COMP_CWORD > 0)); then
    prev=${COMP_WORDS[COMP_CWORD - 1]}
    cur=""
  fi
  COMPREPLY=()

  # The subcommand (and population's own subcommand) is the first word that names one.
  local cmd="" sub="" i w
  for ((i = 1; i < COMP_CWORD; i++)); do
    w=${COMP_WORDS[i]}
    if [[ -z $cmd ]]; then
      case $w in
        assess | check | template | limits | import | export-csv | reslot | report | population) cmd=$w ;;
      esac
    elif [[ $cmd == population && -z $sub ]]; then
      case $w in list | show) sub=$w ;; esac
    fi
  done

  # The value of an option.
  case $prev in
    --format)
      case $cmd in
        assess) COMPREPLY=($(compgen -W "table json csv html" -- "$cur")) ;;
        limits | reslot) COMPREPLY=($(compgen -W "table json" -- "$cur")) ;;
      esac
      return ;;
    --rounding) COMPREPLY=($(compgen -W "full worksheet" -- "$cur")); return ;;
    --duration-rule) COMPREPLY=($(compgen -W "2021 1994" -- "$cur")); return ;;
    --units) COMPREPLY=($(compgen -W "metric us" -- "$cur")); return ;;
    --parts | --slots | --costs-out) _rackreach_files '*.csv'; return ;;
    --out)
      case $cmd in
        assess) _rackreach_files '*'; return ;;
        report) _rackreach_files '*'; return ;;
        *) _rackreach_files '*.json'; return ;;
      esac ;;
    --mix) COMPREPLY=($(compgen -W "women= men=" -- "$cur")); compopt -o nospace 2>/dev/null; return ;;
    --fail-above | --max-moves | --cost-per-move | --percentiles | --date | --site | --assessor | --revision) return ;;  # a number: nothing to offer
  esac

  local opts
  case $cmd in
    "") opts="--help -h --version"
        [[ $cur != -* ]] && opts="assess check template limits import export-csv reslot report population" ;;
    assess) opts="--help -h --format --rounding --duration-rule --fail-above --out" ;;
    check) opts="--help -h" ;;
    template) opts="--help -h --units" ;;
    limits) opts="--help -h --format --out" ;;
    import) opts="--help -h --parts --slots --out --units --ignore-unknown-columns" ;;
    export-csv) opts="--help -h --parts --slots" ;;
    reslot) opts="--help -h --out --max-moves --cost-per-move --group-families --format --costs-out" ;;
    report) opts="--help -h --out --date --site --assessor --revision --rounding --duration-rule" ;;
    population)
      case $sub in
        "") opts="--help -h"; [[ $cur != -* ]] && opts="list show" ;;
        list) opts="--help -h" ;;
        show) opts="--help -h --mix --percentiles"
              [[ $cur != -* ]] && { _rackreach_population_names; return; } ;;
      esac ;;
  esac
  if [[ -n $cmd && $cmd != population && $cmd != template && $cur != -* ]]; then
    _rackreach_files '*.json'  # the project file
    return
  fi
  COMPREPLY=($(compgen -W "$opts" -- "$cur"))
}

complete -F _rackreach rackreach
