#!/usr/bin/env bash
# Mutation testing with Stryker.NET (the version pinned in .config/dotnet-tools.json), one source file per run so
# each file gets its own score and no run grows without bound. Not part of CI: a file takes 5 to 15 minutes on
# this 2-core machine. Usage:
#   bash tests/mutation.sh [src/WaveCheck.Core/Signal/Windows/SubMainsDc.cs ...]
# MUTATION_TOGETHER=1 runs all the files given in one Stryker run (one compile for all of them; tests: the union of
# their own);
# MUTATION_CONCURRENCY sets Stryker's test runners (1 by default: leaves a core free on this 2-core machine).
# MUTATION_EXTRA_TIMEOUT_MS adds to the time a mutant's tests may take before it counts as a timeout (Stryker's
# additional-timeout, 5000 by default): raise it when runs share the cores, or a slowed run reads as a timeout.
# With no file it runs the list below (the measurement core and the verdict; docs/testing.md has their scores).
# Reports: artifacts/mutation/<file>/reports/mutation-report.{html,json}; the score of each file is printed at the end.
# Tests run against each file: a Signal file's own test class (tests mirror the source tree: Signal/ToneFinder.cs is
# guarded by Signal/ToneFinderTests), the Assessment tests on constructed figures for a verdict file (those tests are
# organised by rule, not by file). MUTATION_TESTS overrides it with a dotnet test filter, or "all" for the whole Core suite.
# Why a filter: Stryker.NET 5.1 places the mutants of every file of the project (over 9000 here) and drops those
# outside --mutate only after compiling, so every test runs on fully instrumented code; the whole suite's coverage
# pass alone then takes over 10 minutes on this machine.
# Stryker swaps mutated builds into the test project's bin/ while it runs: do not run dotnet test in the same
# tree meanwhile (run it from a separate clone).
set -euo pipefail
cd "$(dirname "$0")/.."
root=$PWD

default_files=(
  src/WaveCheck.Core/Signal/Windows/SubMainsDc.cs
  src/WaveCheck.Core/Signal/Groups/ToneFinder.cs
  src/WaveCheck.Core/Signal/Accumulation/MetricAccumulator.cs
  src/WaveCheck.Core/Assessment/ClassDetector.cs
  src/WaveCheck.Core/Assessment/MeasurementAccuracy.cs
  src/WaveCheck.Core/Assessment/DeviceTypeAssessor.cs
  src/WaveCheck.Core/Assessment/Margins.cs
)
files=("$@")
[ ${#files[@]} -gt 0 ] || files=("${default_files[@]}")

for f in "${files[@]}"; do
  case "$f" in
    src/WaveCheck.Core/*.cs) ;;
    *) echo "mutation.sh: $f: only files under src/WaveCheck.Core/ are set up (tests/WaveCheck.Core.Tests/stryker-config.json)" >&2; exit 2 ;;
  esac
  [ -f "$f" ] || { echo "mutation.sh: $f: no such file" >&2; exit 2; }
done

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
dotnet tool restore >/dev/null

filter_of() {
  local f=$1 name rel folder
  name=$(basename "$f" .cs)
  rel=${f#src/WaveCheck.Core/}
  folder=${rel%%/*}
  if [ -n "${MUTATION_TESTS:-}" ]; then
    echo "$MUTATION_TESTS"
  elif [ "$folder" = Assessment ]; then
    # The verdict's tests on constructed figures; the two classes that synthesise and analyse waveforms
    # (RequiredTypeTests, VerdictPropertyTests) would run the whole analysis instrumented, minutes per mutant.
    echo "FullyQualifiedName~WaveCheck.Core.Tests.Assessment.&FullyQualifiedName!~RequiredTypeTests&FullyQualifiedName!~VerdictPropertyTests"
  elif [ -n "$(find "tests/WaveCheck.Core.Tests/$folder" -name "${name}*Tests.cs" -print -quit)" ]; then
    # The file's own test classes (X.cs: XTests and X...Tests, wherever they sit under the mirrored folder;
    # Signal's subfolders share one namespace).
    echo "FullyQualifiedName~WaveCheck.Core.Tests.$folder.${name}"
  else
    echo "FullyQualifiedName~WaveCheck.Core.Tests.$folder."
  fi
}

# Files are grouped into runs: one run per file, or, with MUTATION_TOGETHER=1, one run for all the files given, so
# the whole project is compiled once (about 5 minutes of a run here). The tests of a joint run are the union of the
# files' own filters, and with per-test coverage each mutant meets only the tests that reach it: a file's score in a
# joint run can only be higher when another file's tests also reach it (a lower bound either way).
declare -A group_files=()
order=()
for f in "${files[@]}"; do
  key=$f
  [ "${MUTATION_TOGETHER:-0}" = 1 ] && key=together
  if [ -z "${group_files[$key]+x}" ]; then order+=("$key"); group_files[$key]=""; fi
  group_files[$key]+="$f "
done

summary=()
for key in "${order[@]}"; do
  read -r -a members <<<"${group_files[$key]}"
  first=${members[0]}
  name=$(basename "$first" .cs)
  [ ${#members[@]} -gt 1 ] && name="$name+$(( ${#members[@]} - 1 ))"
  out="$root/artifacts/mutation/$name"
  rm -rf "$out"
  echo "== ${members[*]}" >&2
  start=$SECONDS
  filter=""
  every=0
  declare -A seen=()
  for f in "${members[@]}"; do
    one=$(filter_of "$f")
    [ -n "${seen[$one]+x}" ] && continue
    seen[$one]=1
    [ "$one" = all ] && every=1
    [ ${#members[@]} -gt 1 ] && one="($one)"
    filter=${filter:+$filter|}$one
  done
  unset seen
  [ $every = 1 ] && filter=all
  filter_args=()
  [ "$filter" = all ] || filter_args=(--test-case-filter "$filter")
  mutate_args=()
  for f in "${members[@]}"; do mutate_args+=(--mutate "**/${f#src/WaveCheck.Core/}"); done
  echo "tests: ${filter}" >&2
  # The cleartext, html and json reporters only: the progress reporter needs a terminal width and fails without one.
  config=stryker-config.json
  if [ -n "${MUTATION_EXTRA_TIMEOUT_MS:-}" ]; then
    # Stryker 5.1 takes the extra time from its config file only: a copy with it, beside the build output.
    config=obj/stryker-config.timeout.json
    mkdir -p tests/WaveCheck.Core.Tests/obj
    python3 -c 'import json,sys; c=json.load(open(sys.argv[1])); c["stryker-config"]["additional-timeout"]=int(sys.argv[2]); json.dump(c,open(sys.argv[3],"w"),indent=2)' \
      tests/WaveCheck.Core.Tests/stryker-config.json "$MUTATION_EXTRA_TIMEOUT_MS" "tests/WaveCheck.Core.Tests/$config"
  fi
  (cd tests/WaveCheck.Core.Tests && dotnet stryker --config-file "$config" --skip-version-check \
      "${mutate_args[@]}" "${filter_args[@]}" --concurrency "${MUTATION_CONCURRENCY:-1}" --output "$out")
  report="$out/reports/mutation-report.json"
  [ -f "$report" ] || { echo "mutation.sh: ${members[*]}: Stryker wrote no report ($report)" >&2; exit 1; }
  while IFS= read -r line; do
    line="$line, tests: $filter"
    echo "$line"
    summary+=("$line")
  done < <(python3 tests/mutation_score.py "$report" "$((SECONDS - start))")
done

echo
echo "mutation score per file (killed + timeout) / (killed + timeout + survived + no coverage):"
printf '%s\n' "${summary[@]}"
