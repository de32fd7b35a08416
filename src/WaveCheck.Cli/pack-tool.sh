#!/usr/bin/env bash
# Packs `wavecheck` as a .NET tool into OUT (default artifacts/tool), one package per platform (.NET SDK 10):
#   wavecheck.0.1.0.nupkg            the package `dotnet tool install wavecheck` asks for: it names the two below and
#                                    the .NET CLI picks the one for the machine;
#   wavecheck.linux-x64.0.1.0.nupkg  compiled ahead of time (Native AOT, AVX2 baseline): starts in milliseconds and is
#                                    the fast build of bench/README.md; packing it needs clang (Debian: apt-get
#                                    install clang);
#   wavecheck.any.0.1.0.nupkg        framework-dependent (needs the .NET 10 runtime): every other platform, and a
#                                    Linux machine without AVX2 or without the AOT package (`dotnet tool install
#                                    wavecheck.any` installs it by name).
# Without clang the linux-x64 package is left out with a message: `dotnet tool install wavecheck` then fails on
# linux-x64 (the package it names is missing) and `dotnet tool install wavecheck.any` is the one to use.
# A runtime-specific pack restores every project for that runtime and rewrites the committed packages.lock.json files:
# they are kept aside and put back, so packing leaves the working tree as it was.
# usage: bash src/WaveCheck.Cli/pack-tool.sh [OUT]
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
out="$(mkdir -p "${1:-$root/artifacts/tool}" && cd "${1:-$root/artifacts/tool}" && pwd)"
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

locks=$(mktemp -d)
for f in "$root"/src/*/packages.lock.json; do cp "$f" "$locks/$(basename "$(dirname "$f")").json"; done
put_back() { for f in "$root"/src/*/packages.lock.json; do cp "$locks/$(basename "$(dirname "$f")").json" "$f"; done; rm -rf "$locks"; }
trap put_back EXIT

rm -f "$out"/wavecheck.*nupkg
# A tool package takes the whole publish folder: one left by an earlier publish could carry files this one does not
# make (e.g. the native symbols, ~24 MB, before they were left out).
rm -rf "$here"/bin/Release/net10.0/*/publish
dotnet pack "$here" -c Release -o "$out" -v q -nologo
dotnet pack "$here" -c Release -r any -o "$out" -v q -nologo
if command -v clang > /dev/null; then
  dotnet pack "$here" -c Release -r linux-x64 -o "$out" -v q -nologo
else
  echo "pack-tool.sh: no clang on the PATH, so no linux-x64 package (compiled ahead of time); install clang (Debian: apt-get install clang) and pack again, or install the framework-dependent tool: dotnet tool install wavecheck.any" >&2
fi
ls -1 "$out"/wavecheck.*nupkg
