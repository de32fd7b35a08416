#!/usr/bin/env bash
# Packs the CLI as a .NET tool (src/WaveCheck.Cli/pack-tool.sh: the pointer package, the ahead-of-time build for
# linux-x64 and the framework-dependent one), installs it into a temporary tool path from those packages alone (no
# other package source), checks that on linux-x64 the installed command is the ahead-of-time build, and runs it from
# an empty folder: --version, the demo (which must find the captures bundled in the tool), and synth + analyse on a
# file of its own. Then installs the framework-dependent package by name (wavecheck.any) and runs it. What the
# README's "Install" section promises, checked. Run by tests/run-all.sh (and so by CI); leaves nothing behind.
set -euo pipefail
cd "$(dirname "$0")/.."

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

bash src/WaveCheck.Cli/pack-tool.sh "$tmp/feed"
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
if [ "$(uname -s)-$(uname -m)" = Linux-x86_64 ]; then
  # The command links to the package the .NET CLI chose: the linux-x64 one, a native executable (no wavecheck.dll).
  case "$(readlink -f "$wavecheck")" in
    */wavecheck.linux-x64/*) ;;
    *) fail "on linux-x64 the installed wavecheck is $(readlink -f "$wavecheck"), not the ahead-of-time package" ;;
  esac
  [ ! -e "$(dirname "$(readlink -f "$wavecheck")")/wavecheck.dll" ] || fail "the linux-x64 package holds wavecheck.dll: not compiled ahead of time"
fi
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

# The framework-dependent package, installed by name (other platforms, a CPU without AVX2).
cd "$tmp"
dotnet tool install wavecheck.any --tool-path "$tmp/tools-any" --configfile "$tmp/nuget.config" > /dev/null
[ -x "$tmp/tools-any/wavecheck" ] || fail "no 'wavecheck' command in the tool path of wavecheck.any"
any_version=$("$tmp/tools-any/wavecheck" --version)
[ "$any_version" = "$version" ] || fail "wavecheck.any --version says $any_version, the linux-x64 build $version"
echo "tool-install: wavecheck $version installed as a .NET tool, demo and analyse ran; wavecheck.any ran too"
