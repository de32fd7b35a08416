"""Prints one line per source file of a Stryker mutation-report.json (schema of mutation-testing-elements):
score = detected / (detected + undetected), detected = Killed + Timeout, undetected = Survived + NoCoverage;
CompileError and Ignored mutants are left out, as Stryker does. Usage: mutation_score.py REPORT [SECONDS]."""
import json
import sys
from collections import Counter

report = json.load(open(sys.argv[1], encoding="utf-8"))
seconds = f", {int(sys.argv[2]) // 60} min {int(sys.argv[2]) % 60:02d} s" if len(sys.argv) > 2 else ""
for path, data in sorted(report["files"].items()):
    n = Counter(m["status"] for m in data["mutants"])
    detected = n["Killed"] + n["Timeout"]
    undetected = n["Survived"] + n["NoCoverage"]
    total = detected + undetected
    if total == 0:
        continue  # a file outside --mutate: all its mutants ignored
    score = 100.0 * detected / total if total else float("nan")
    short = path[path.find("src/"):] if "src/" in path else path
    print(f"{short}: {score:.1f} % ({n['Killed']} killed, {n['Timeout']} timeout, {n['Survived']} survived, "
          f"{n['NoCoverage']} no coverage, {n['CompileError']} compile error, {n['Ignored']} ignored{seconds})")
