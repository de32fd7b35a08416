#!/usr/bin/env bash
# Runs every test of WaveCheck. Some tests check against outside references that are not .NET packages:
# headless Chromium (the HTML report and its PDF), clang (the tool package compiled ahead of time), poppler-utils (pdfinfo, pdftotext read the PDF back), DejaVu fonts (plots), Debian's numpy and scipy (spectra, filter responses).
# They are installed from Debian's packages when missing (needs root or sudo).
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
command -v chromium >/dev/null 2>&1 || need+=(chromium)
command -v pdftotext >/dev/null 2>&1 || need+=(poppler-utils)
command -v clang >/dev/null 2>&1 || need+=(clang)
[ -e /usr/share/fonts/truetype/dejavu/DejaVuSans.ttf ] || need+=(fonts-dejavu-core)
/usr/bin/python3 -c 'import numpy, scipy' >/dev/null 2>&1 || need+=(python3-numpy python3-scipy)
if [ ${#need[@]} -gt 0 ]; then
  echo "installing test prerequisites: ${need[*]}" >&2
  sudo=""
  [ "$(id -u)" -eq 0 ] || sudo="sudo"
  export DEBIAN_FRONTEND=noninteractive
  $sudo apt-get update -qq
  $sudo apt-get install -y -qq --no-install-recommends "${need[@]}"
fi

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
# Line and branch coverage (coverlet.collector, Cobertura), summarised per folder of WaveCheck.Core at the end.
coverage=TestResults/coverage
rm -rf "$coverage"
# The packages restored are exactly those in the committed packages.lock.json files (RestorePackagesWithLockFile).
dotnet restore WaveCheck.sln --locked-mode
status=0
dotnet test WaveCheck.sln -c Release --collect:"XPlat Code Coverage" --settings tests/coverage.runsettings \
  --results-directory "$coverage" || status=$?
/usr/bin/python3 tests/coverage_summary.py "$coverage" || true
# The CLI packed as a .NET tool, installed into a temporary tool path, and run (README "Install").
bash tests/tool-install.sh || status=$?
exit "$status"
