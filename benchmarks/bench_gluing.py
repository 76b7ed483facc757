"""Benchmark: the list engine at the frontier, each cover found once.

Problem: genus-2 covers of an elliptic curve (two simple branch points), every
base stratum of codimension <= 2 (the 5 strata of Mbar_{1,2}).

1. The engine (:func:`covertree.gluing.covers.glued_covers`) at D = 6..9 (and
   10 with ``--ten``): covers, CPU seconds, CPU time per cover and its ratio to
   D = 6, and per stratum the covers, the canonical codes computed per cover,
   the repeats among them (0 when each cover is generated once) and the
   matchings dropped by the orbit test as not the least word of their orbit (:class:`covertree.gluing.covers.GluingStats`).
2. The same counts for the search as it was before (the reference in
   ``tests/gluing/reference_gluing.py``) at D = 6 and 7, on the same strata.
3. The whole command ``covertree catalogue -g 2 -t 1 -d D -k 2 -f jsonl`` at
   D = 6..9 in a child process: lines, wall and CPU seconds, peak RSS
   (VmHWM of the child's own memory; ru_maxrss would carry over the parent's
   high-water mark at the fork).

CPU seconds (``time.process_time``) are given besides wall time because the
machine is shared.
"""

from __future__ import annotations

import os
import pathlib
import resource
import subprocess
import sys
import time

ROOT = pathlib.Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from covertree.catalogue.catalogue import select_strata  # noqa: E402
from covertree.gluing.covers import GluingStats, glued_covers  # noqa: E402
from covertree.hurwitz.problem import HurwitzProblem  # noqa: E402
from tests.gluing.reference_gluing import reference_glued_covers  # noqa: E402


def _strata(degree: int) -> tuple[list, list]:
    problem = HurwitzProblem.build(degree, 1, genus=2)
    return [s.graph for s in select_strata(problem, 2)], [tuple(p) for p in problem.profiles]


def _reference_codes(base, degree: int, profiles: list) -> tuple[int, int]:
    """(covers, canonical codes) of the reference search, codes counted by
    wrapping the canonical code it calls."""
    import tests.gluing.reference_gluing as ref

    calls = [0]
    original = ref.canonical_code

    def counted(*args):
        calls[0] += 1
        return original(*args)

    ref.canonical_code = counted
    try:
        n = sum(1 for _ in reference_glued_covers(base, degree, profiles))
    finally:
        ref.canonical_code = original
    return n, calls[0]


def bench_engine(degrees) -> None:
    per_cover = {}
    for d in degrees:
        strata, profiles = _strata(d)
        start, total, rows = time.process_time(), 0, []
        for base in strata:
            stats = GluingStats()
            n = sum(1 for _ in glued_covers(base, d, profiles, stats=stats))
            total += n
            rows.append(f"{base.notation}: {n} covers, {stats.codes / n:.2f} codes/cover ({stats.repeats} repeats, "
                        f"{stats.rejected} words not least dropped before any code, "
                        f"{stats.untested} choices left untested)")
        seconds = time.process_time() - start
        per_cover[d] = seconds / total
        ratio = per_cover[d] / per_cover[degrees[0]]
        print(f"engine D={d}: {total} covers in {seconds:.2f} s CPU, {1000 * per_cover[d]:.2f} ms/cover "
              f"(x{ratio:.2f} of D={degrees[0]}); " + "; ".join(rows), flush=True)


def bench_reference(degrees) -> None:
    for d in degrees:
        strata, profiles = _strata(d)
        start, rows = time.process_time(), []
        for base in strata:
            n, codes = _reference_codes(base, d, profiles)
            rows.append(f"{base.notation}: {codes / n:.2f} codes/cover")
        print(f"reference (before) D={d}: {time.process_time() - start:.2f} s CPU; " + "; ".join(rows), flush=True)


_CHILD = """
import resource, sys
from covertree.cli import main
try:
    main(sys.argv[1:])
except SystemExit as exit:
    code = exit.code
else:
    code = 0
usage = resource.getrusage(resource.RUSAGE_SELF)
peak = usage.ru_maxrss
try:
    with open("/proc/self/status") as status:
        peak = next(int(line.split()[1]) for line in status if line.startswith("VmHWM"))
except (OSError, StopIteration):
    pass
sys.stderr.write("MAXRSS %d CPU %.3f\\n" % (peak, usage.ru_utime + usage.ru_stime))
sys.exit(code)
"""


def bench_stream(degrees) -> None:
    for d in degrees:
        args = ["catalogue", "-g", "2", "-t", "1", "-d", str(d), "-k", "2", "-f", "jsonl", "-m", str(10**9)]
        start = time.perf_counter()
        proc = subprocess.run([sys.executable, "-c", _CHILD, *args], capture_output=True, text=True,
                              cwd=ROOT, env={**os.environ, "PYTHONPATH": str(ROOT)})
        seconds = time.perf_counter() - start
        found = [line.split() for line in proc.stderr.splitlines() if line.startswith("MAXRSS")]
        lines = proc.stdout.count("\n")
        rss = f"{int(found[0][1]) / 1024:.1f} MiB" if found else "unknown"
        cpu = f"{float(found[0][3]):.2f} s CPU" if found else "CPU unknown"
        print(f"covertree catalogue -d {d} -k 2 -f jsonl: exit {proc.returncode}, {lines} lines, "
              f"{seconds:.2f} s wall, {cpu}, peak RSS {rss}", flush=True)


def main() -> int:
    degrees = [6, 7, 8, 9, 10] if "--ten" in sys.argv else [6, 7, 8, 9]
    bench_stream([6, 7, 8, 9])
    bench_engine(degrees)
    bench_reference([6, 7])
    return 0


if __name__ == "__main__":
    sys.exit(main())
