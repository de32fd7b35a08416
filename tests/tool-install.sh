#!/usr/bin/env bash
# Packs the CLI as a .NET tool, installs it into a temporary tool path from that package alone (no other package
# source), and runs it from an empty folder: --version, the demo (which must find the captures bundled in the tool),
# and synth + analyse on a file of its own. What the README's "Install" section promises, checked. Run by
# tests/run-all.sh (and so by CI); leaves nothing behind.
set -euo pipefail
cd "$(dirname "$0")/.."

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

dotnet pack src/WaveCheck.Cli -c Release -o "$tmp/feed" -v q -nologo
cat > "$tmp/nuget.config" <<CONFIG
<?xml version="1.0" encoding="utf-8"?>
<configuration>
  <packageSources>
    <clear />
    <add key="wavecheck-local" value="$tmp/feed" />
  </packageSources>
</configuration>
CONFIG
dotnet tool install wavecheck --tool-path "$tmp/tools" --configfile "$tmp/nuget.config"

fail() { echo "tool-install: $*" >&2; exit 1; }
mkdir "$tmp/work"
cd "$tmp/work"
wavecheck="$tmp/tools/wavecheck"
[ -x "$wavecheck" ] || fail "no 'wavecheck' command in the tool path"
version=$("$wavecheck" --version)
case "$version" in
  0.*|1.*|2.*) ;;
  *) fail "unexpected --version output: $version" ;;
esac

"$wavecheck" demo -o demo -q > demo.txt
for f in demo/index.html demo/survey.csv demo/survey.json; do
  [ -s "$f" ] || fail "the demo did not write $f"
done
# Six bundled captures, one row each (samples/site.json), below the header.
rows=$(($(wc -l < demo/survey.csv) - 1))
[ "$rows" -eq 8 ] || fail "the demo's survey.csv has $rows rows, expected 8 (samples/site.json: C1 to C7, C2 twice)"

"$wavecheck" synth halfwave:peak=30mA,angle=90 -o dimmer.wav > /dev/null
set +e
"$wavecheck" analyse dimmer.wav --device AC --rated 30mA --fail-on upgrade -q > analyse.txt
status=$?
set -e
# Pulsating DC (IEC 61008-1): type AC is not adequate, so --fail-on upgrade gives exit 1.
[ "$status" -eq 1 ] || fail "analyse of a phase-cut half-wave with --device AC exited $status, expected 1"
echo "tool-install: wavecheck $version installed as a .NET tool, demo and analyse ran"
