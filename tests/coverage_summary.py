"""Prints line and branch coverage from coverlet's Cobertura files (one per test project), per folder of
WaveCheck.Core as the Core tests cover it, then per assembly as the whole suite covers it.

Usage: python3 tests/coverage_summary.py RESULTS_DIR   (searched for coverage.cobertura.xml)
Lines are counted once per (file, line) (coverlet may list a line under more than one generated class), a line is
covered when any listing of it has hits; branches are the "(covered/total)" of each line's condition-coverage,
the best listing per line. The Core tests' file is the one whose only package is WaveCheck.Core (each test
project instruments the assemblies it references, and only the Core tests reference Core alone)."""
import glob
import os
import re
import sys
import xml.etree.ElementTree as ET
from collections import defaultdict

FOLDERS = ["Capture", "Signal", "Assessment", "Results", "Survey", "Synthesis"]


def read(path):
    """{package: {(file, line): [hits, covered_branches, branches]}} of one Cobertura file."""
    root = ET.parse(path).getroot()
    sources = [s.text or "" for s in root.iter("source")]
    packages = {}
    for package in root.iter("package"):
        lines = {}
        for cls in package.iter("class"):
            name = cls.get("filename", "")
            full = name
            for s in sources:
                if s and os.path.exists(os.path.join(s, name)):
                    full = os.path.join(s, name)
                    break
            full = full.replace("\\", "/")
            for line in cls.iter("line"):
                key = (full, int(line.get("number")))
                hits = int(line.get("hits", "0"))
                covered, total = 0, 0
                m = re.search(r"\((\d+)/(\d+)\)", line.get("condition-coverage", ""))
                if m:
                    covered, total = int(m.group(1)), int(m.group(2))
                old = lines.get(key)
                if old is None:
                    lines[key] = [hits, covered, total]
                else:
                    old[0] = max(old[0], hits)
                    if total > old[2] or (total == old[2] and covered > old[1]):
                        old[1], old[2] = covered, total
        packages[package.get("name")] = lines
    return packages


def figures(lines):
    n = len(lines)
    hit = sum(1 for v in lines.values() if v[0] > 0)
    bt = sum(v[2] for v in lines.values())
    bc = sum(v[1] for v in lines.values())
    return hit, n, bc, bt


def pct(a, b):
    return f"{100.0 * a / b:5.1f} %" if b else "    -  "


def row(label, lines):
    hit, n, bc, bt = figures(lines)
    return f"  {label:<24} lines {pct(hit, n)} ({hit}/{n})   branches {pct(bc, bt)} ({bc}/{bt})"


def main():
    files = sorted(glob.glob(os.path.join(sys.argv[1], "**", "coverage.cobertura.xml"), recursive=True))
    if not files:
        print("coverage: no coverage.cobertura.xml found under " + sys.argv[1])
        return 1
    runs = [read(f) for f in files]

    core_runs = [r for r in runs if set(r) == {"WaveCheck.Core"}]
    if core_runs:
        core = core_runs[0]["WaveCheck.Core"]
        print("Coverage of WaveCheck.Core by the Core tests (coverlet), per folder:")
        for folder in FOLDERS:
            part = {k: v for k, v in core.items() if f"/WaveCheck.Core/{folder}/" in k[0]}
            print(row(folder, part))
        rest = {k: v for k, v in core.items() if not any(f"/WaveCheck.Core/{f}/" in k[0] for f in FOLDERS)}
        if rest:
            print(row("(top level)", rest))
        print(row("WaveCheck.Core", core))

    print("Coverage per assembly by the whole suite (a line counts when any test project runs it):")
    merged = defaultdict(dict)
    for r in runs:
        for package, lines in r.items():
            into = merged[package]
            for key, v in lines.items():
                old = into.get(key)
                if old is None:
                    into[key] = list(v)
                else:
                    old[0] = max(old[0], v[0])
                    if v[2] > old[2] or (v[2] == old[2] and v[1] > old[1]):
                        old[1], old[2] = v[1], v[2]
    for package in sorted(merged):
        print(row(package, merged[package]))
    return 0


if __name__ == "__main__":
    sys.exit(main())
