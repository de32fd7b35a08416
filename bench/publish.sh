#!/usr/bin/env bash
# Publishes the shipped `wavecheck`, self-contained (no .NET needed on the target):
#   linux-x64: Native AOT (compiled ahead of time and trimmed: starts in a few milliseconds, no JIT); needs clang
#              (Debian: apt-get install clang). Output: the `wavecheck` executable, the two native libraries of the
#              plots (libSkiaSharp.so, libHarfBuzzSharp.so, which cannot be linked into it) and the demo's samples/.
#   win-x64:   single-file, self-contained, ReadyToRun (Native AOT cannot be cross-compiled from Linux: the native
#              linker step needs the target's toolchain; ReadyToRun's crossgen can). Output: wavecheck.exe (with the
#              native libraries of the plots bundled into it) and samples/.
# Why AOT and not ReadyToRun on Linux, and what every library needed to work trimmed: bench/README.md.
# Output: artifacts/publish/<rid>/ (not committed). RIDS overrides the list (e.g. RIDS=linux-x64).
# usage: bash bench/publish.sh
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/.." && pwd)"
# A runtime-specific restore rewrites the committed packages.lock.json files with that runtime's section only: they
# are kept aside and put back, so publishing leaves the working tree as it was.
locks=$(mktemp -d)
for f in "$root"/src/*/packages.lock.json; do cp "$f" "$locks/$(basename "$(dirname "$f")").json"; done
put_back() { for f in "$root"/src/*/packages.lock.json; do cp "$locks/$(basename "$(dirname "$f")").json" "$f"; done; rm -rf "$locks"; }
trap put_back EXIT
for rid in ${RIDS:-linux-x64 win-x64}; do
  out="$root/artifacts/publish/$rid"
  rm -rf "$out"
  case "$rid" in
    linux-*)
      if ! command -v clang > /dev/null; then
        echo "publish.sh: Native AOT needs clang on the PATH (Debian: apt-get install clang)" >&2
        exit 2
      fi
      dotnet publish "$root/src/WaveCheck.Cli" -c Release -r "$rid" -p:PublishAot=true -o "$out" -v q -nologo
      ;;
    win-*)
      dotnet publish "$root/src/WaveCheck.Cli" -c Release -r "$rid" -p:PublishAot=false --self-contained true -p:PublishSingleFile=true \
        -p:PublishReadyToRun=true -p:IncludeNativeLibrariesForSelfExtract=true -o "$out" -v q -nologo
      ;;
  esac
  rm -f "$out"/*.pdb "$out"/*.dbg "$out"/*.xml
  echo "$rid: $out ($(du -sh "$out" | cut -f1))"
done
