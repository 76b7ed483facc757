"""Benchmarks of the resource guards (``covertree.limits``).

Each hostile command runs in a fresh process; the line printed gives the
wall time of the whole command inside the process, its peak resident memory
(``resource.getrusage``), the exit status and the message.  The refusals
must come within a second with a small memory.  Then the calibration of the
work estimates: estimated steps against measured seconds on feasible runs
(the estimates aim at about a microsecond a step).
"""

from __future__ import annotations

import subprocess
import sys

CHILD = r"""
import atexit, resource, sys, time
start = time.perf_counter()
def report():
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss // 1024
    print(f"@@ {time.perf_counter() - start:.2f} {peak}", file=sys.stderr)
atexit.register(report)
from covertree.cli import main
main(sys.argv[1:], prog_name="covertree")
"""


def _chain(vertices: int) -> str:
    return ", ".join(["g1"] + ["g0"] * (vertices - 2) + ["g1"]) + " | " + ", ".join(
        f"{i}-{i + 1}" for i in range(vertices - 1))


def _star(leaves: int) -> str:
    return "g0, " + ", ".join(["g1"] * leaves) + " | " + ", ".join(f"0-{i}" for i in range(1, leaves + 1))


HOSTILE = [
    ["count", "-t", "1", "-g", "2", "-d", "500"],
    ["count", "-t", "1", "-g", "2", "-d", "100000"],
    ["count", "-t", "1", "-d", "2", "-g", "1000000000"],
    ["count", "-t", "1", "-d", "100000000", "-p", "1^100000000"],
    ["count", "-t", "0", "-d", "3", "-p", "1" * 5000],
    ["sweep", "-t", "1", "-d", "2", "-g", "0..1000000000"],
    ["sweep", "-t", "1", "-g", "2", "-d", "1..100000"],
    ["catalogue", "-t", "0", "-d", "2", "-g", "1", "-s", "g0{1,2,3,4} | 0-0^100000000"],
    ["catalogue", "-t", "0", "-d", "12", "-g", "0"],
    ["catalogue", "-t", "1", "-d", "12", "-g", "2", "--time-limit", "2"],
    ["strata", "-t", "999999999999999999999999999999", "-n", "4"],
    ["strata", "-t", "6", "-n", "4"],
    ["draw", _chain(300), "-o", "/tmp/covertree-bench-chain.svg"],
    ["draw", _chain(250), "-o", "/tmp/covertree-bench-chain.svg"],
    ["catalogue", "-t", "0", "-d", "2", "-g", "1", "-s", _star(1000)],
    ["catalogue", "-t", "0", "-d", "2", "-g", "1", "-s", _star(160)],
]

FEASIBLE = [
    (["count", "-t", "1", "-g", "2", "-d", "60", "-f", "json"], ("count", 60, 1, 2)),
    (["count", "-t", "1", "-g", "2", "-d", "150", "-f", "json"], ("count", 150, 1, 2)),
    (["count", "-t", "0", "-d", "36", "-p", "36", "-p", "36", "-p", "36", "-p", "36", "-f", "json"],
     ("count-profiles", 36, 0, [(36,)] * 4)),
    (["strata", "-t", "0", "-n", "7", "-f", "csv"], ("strata", 0, 7)),
    (["strata", "-t", "1", "-n", "5", "-f", "csv"], ("strata", 1, 5)),
]


def _run(args: list[str]) -> tuple[float, int, int, str]:
    done = subprocess.run([sys.executable, "-c", CHILD, *args], capture_output=True, text=True)
    lines = done.stderr.strip().splitlines()
    seconds, megabytes = (float(x) for x in lines[-1].split()[1:])
    message = next((line for line in lines if not line.startswith("@@")), "")
    return seconds, int(megabytes), done.returncode, message


def _estimate(kind: tuple) -> float:
    from covertree.hurwitz.cost import count_work
    from covertree.limits import strata_work

    if kind[0] == "count":
        return count_work(kind[1], kind[2], [], kind[3])
    if kind[0] == "count-profiles":
        return count_work(kind[1], kind[2], kind[3], 0)
    return strata_work(kind[1], kind[2], 3 * kind[1] - 3 + kind[2])


def main() -> None:
    worst_time, worst_memory = 0.0, 0
    for args in HOSTILE:
        seconds, megabytes, status, message = _run(args)
        shown = " ".join(a if len(a) < 40 else a[:30] + f"...({len(a)} chars)" for a in args)
        print(f"{seconds:6.2f} s {megabytes:5d} MB exit {status}  {shown}\n      {message[:220]}")
        if "--time-limit" not in args:
            worst_time, worst_memory = max(worst_time, seconds), max(worst_memory, megabytes)
    print(f"refusals: slowest {worst_time:.2f} s, largest peak {worst_memory} MB")
    for args, kind in FEASIBLE:
        seconds, megabytes, status, _ = _run(args)
        steps = _estimate(kind)
        print(f"feasible {' '.join(args[:7])}: {seconds:.2f} s, {megabytes} MB, exit {status}; "
              f"estimate {steps:.3g} steps ({steps / max(seconds, 1e-3) / 1e6:.2f} M steps per second)")


if __name__ == "__main__":
    main()
