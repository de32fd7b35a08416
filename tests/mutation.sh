#!/usr/bin/env bash
# Mutation testing with Stryker.NET (the version pinned in .config/dotnet-tools.json), one source file per run so
# each file gets its own score and no run grows without bound. Not part of CI: a file takes 5 to 15 minutes on
# this 2-core machine. Usage:
#   bash tests/mutation.sh [src/WaveCheck.Core/Signal/SubMainsDc.cs ...]
# With no file it runs the list below (the measurement core and the verdict; docs/testing.md has their scores).
# Reports: artifacts/mutation/<file>/reports/mutation-report.{html,json}; the score of each file is printed at the end.
# Stryker swaps mutated builds into the test project's bin/ while it runs: do not run dotnet test in the same
# tree meanwhile (run it from a separate clone).
set -euo pipefail
cd "$(dirname "$0")/.."
root=$PWD

default_files=(
  src/WaveCheck.Core/Signal/SubMainsDc.cs
  src/WaveCheck.Core/Signal/ToneFinder.cs
  src/WaveCheck.Core/Signal/MetricAccumulator.cs
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

summary=()
for f in "${files[@]}"; do
  name=$(basename "$f" .cs)
  out="$root/artifacts/mutation/$name"
  rm -rf "$out"
  echo "== $f" >&2
  start=$SECONDS
  # The cleartext, html and json reporters only: the progress reporter needs a terminal width and fails without one.
  (cd tests/WaveCheck.Core.Tests && dotnet stryker --config-file stryker-config.json --skip-version-check \
      --mutate "**/${f#src/WaveCheck.Core/}" --output "$out")
  report="$out/reports/mutation-report.json"
  [ -f "$report" ] || { echo "mutation.sh: $f: Stryker wrote no report ($report)" >&2; exit 1; }
  line=$(python3 tests/mutation_score.py "$report" "$((SECONDS - start))")
  echo "$line"
  summary+=("$line")
done

echo
echo "mutation score per file (killed + timeout) / (killed + timeout + survived + no coverage):"
printf '%s\n' "${summary[@]}"
