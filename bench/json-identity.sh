#!/usr/bin/env bash
# Writes the analysis JSON of every demo capture in samples/ (`wavecheck analyze FILE --json`) into OUT_DIR, and a
# second run with alarm events, a stated sensor and the per-window CSV, so a restructuring can be checked for
# byte-identical output: run it on the build before and after, then `cmp` the two folders' files (toolVersion is
# the build's version, the same on both sides of a refactor).
# Further captures given after OUT_DIR (WAV without a scale of its own) are analysed the same way with --scale 1A.
# NO_BUILD=1 skips the build.
# usage: bash bench/json-identity.sh OUT_DIR [EXTRA.wav ...]
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/.." && pwd)"
out="${1:?usage: json-identity.sh OUT_DIR [EXTRA.wav ...]}"
shift
mkdir -p "$out"
if [[ "${NO_BUILD:-0}" != 1 ]]; then
  dotnet build "$root/src/WaveCheck.Cli" -c Release -v q -nologo > /dev/null
fi

cli="$root/src/WaveCheck.Cli/bin/Release/net10.0/wavecheck.dll"

# run CAPTURE NAME [OPTIONS...]: one `wavecheck analyze` writing $out/NAME.json.
run() {
  local capture="$1" name="$2" rc=0
  shift 2
  # Exit codes 0 and 1 are both results (1: a verdict that fails); anything else is an error.
  dotnet "$cli" analyze "$capture" "$@" --json "$out/$name.json" > "$out/$name.out" 2> "$out/$name.err" || rc=$?
  if [[ $rc -gt 1 ]]; then
    echo "wavecheck analyze $capture failed (exit $rc):" >&2
    cat "$out/$name.err" >&2
    exit 1
  fi
  echo "$name: $(wc -c < "$out/$name.json") bytes, exit $rc"
}
for capture in "$root"/samples/*.wav "$root"/samples/*.csv; do
  name="$(basename "${capture%.*}")"
  # A capture's own channel settings, as samples/site.json gives them (C3 records its supply voltage on ch2).
  extra=()
  case "$name" in
    c3-ev-bay1) extra=(--voltage ch2 --voltage-scale 500V) ;;
  esac
  run "$capture" "$name" "${extra[@]}"
  run "$capture" "$name-alarm" "${extra[@]}" --sensor dc --alarm 5mA --windows-csv "$out/$name-alarm.csv"
done

for capture in "$@"; do
  name="$(basename "${capture%.*}")"
  run "$capture" "$name" --scale 1A
  run "$capture" "$name-alarm" --scale 1A --sensor dc --alarm 150mA --windows-csv "$out/$name-alarm.csv"
done
