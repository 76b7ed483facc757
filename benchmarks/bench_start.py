"""Benchmark: the start of ``covertree`` as a whole process (shell loops call it
thousands of times).

For each command line, the best wall time of several fresh processes, next to
the same command line with every command module imported up front (the start
before the commands were loaded on first use), and the bare interpreter with
``import click`` for reference.  The ratio is taken in one run.
"""

from __future__ import annotations

import subprocess
import sys
import time

LAZY = "from covertree.cli import main; main(prog_name='covertree')"
EAGER = (
    "import covertree.cli.count, covertree.cli.strata, covertree.cli.catalogue, "
    "covertree.cli.pullback, covertree.cli.locus, covertree.cli.draw, covertree.cli.sweep, "
    "covertree.cli.series; " + LAZY
)
LINES = [
    ["count", "-g", "2", "-t", "1", "-d", "4", "-f", "csv"],
    ["count", "-g", "2", "-t", "1", "-d", "4"],
    ["strata", "-t", "1", "-n", "2", "-f", "csv"],
    ["strata", "-t", "1", "-n", "2"],
]
REPEATS = 7


def _best(argv: list[str]) -> float:
    times = []
    for _ in range(REPEATS):
        start = time.perf_counter()
        subprocess.run(argv, check=True, capture_output=True)
        times.append(time.perf_counter() - start)
    return min(times)


def main() -> None:
    bare = _best([sys.executable, "-c", "import click"])
    print(f"python -c 'import click': best {bare:.3f} s")
    for line in LINES:
        lazy = _best([sys.executable, "-c", LAZY, *line])
        eager = _best([sys.executable, "-c", EAGER, *line])
        print(f"covertree {' '.join(line)}: best {lazy:.3f} s "
              f"(all commands imported: {eager:.3f} s, ratio {eager / lazy:.1f})", flush=True)


if __name__ == "__main__":
    main()
