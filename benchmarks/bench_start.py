"""Benchmark: the start of ``covertree`` as a whole process (shell loops call it
thousands of times).

Each command line runs as a fresh process through the installed ``covertree``
script, as a shell loop would, with the bytecode cache on (as in a user's
installation; it lives in a temporary folder, filled by one warm-up run).  For
each line: the best wall time and the median CPU time (user + system) of
several runs, next to the same line with every command module and the terminal
library imported up front (the start before the commands were loaded on first
use and the tables drawn without the library), and the bare interpreter with
and without ``import click`` for reference.  Ratios are taken in one run.  The
goal for ``count`` and ``strata`` is 0.15 s of wall time on a quiet machine;
on a loaded one, read the CPU times.
"""

from __future__ import annotations

import os
import resource
import shutil
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

EAGER = (
    "import rich.console, rich.table, covertree.cli.count, covertree.cli.strata, "
    "covertree.cli.catalogue, covertree.cli.pullback, covertree.cli.locus, covertree.cli.draw, "
    "covertree.cli.sweep, covertree.cli.series; "
    "from covertree.cli import main; main(prog_name='covertree')"
)
LINES = [
    ["count", "-g", "2", "-t", "1", "-d", "4", "-f", "csv"],
    ["count", "-g", "2", "-t", "1", "-d", "4"],
    ["strata", "-t", "1", "-n", "2", "-f", "csv"],
    ["strata", "-t", "1", "-n", "2"],
    ["--help"],
]
REPEATS = 9


def _run(argv: list[str], env: dict[str, str]) -> tuple[float, float]:
    """Wall and CPU seconds of one process."""
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    start = time.perf_counter()
    subprocess.run(argv, check=True, capture_output=True, env=env)
    wall = time.perf_counter() - start
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    return wall, (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)


def _measure(argv: list[str], env: dict[str, str]) -> tuple[float, float]:
    _run(argv, env)  # warm-up: fills the bytecode cache
    runs = [_run(argv, env) for _ in range(REPEATS)]
    best = min(wall for wall, _ in runs)
    cpu = statistics.median(cpu for _, cpu in runs)
    return best, cpu


def _command() -> list[str]:
    script = Path(sys.executable).with_name("covertree")
    return [str(script)] if script.exists() else [sys.executable, "-m", "covertree"]


def main() -> None:
    cache = tempfile.mkdtemp(prefix="covertree-bench-pyc-")
    env = {k: v for k, v in os.environ.items() if k != "PYTHONDONTWRITEBYTECODE"}
    env["PYTHONPYCACHEPREFIX"] = cache
    try:
        for label, argv in (("python -c pass", [sys.executable, "-c", "pass"]),
                            ("python -c 'import click'", [sys.executable, "-c", "import click"])):
            best, cpu = _measure(argv, env)
            print(f"{label}: best {best:.3f} s wall, median {cpu:.3f} s CPU", flush=True)
        for line in LINES:
            best, cpu = _measure(_command() + line, env)
            eager_best, eager_cpu = _measure([sys.executable, "-c", EAGER, *line], env)
            print(f"covertree {' '.join(line)}: best {best:.3f} s wall, median {cpu:.3f} s CPU "
                  f"(everything imported: {eager_best:.3f} s wall, {eager_cpu:.3f} s CPU, "
                  f"ratio {eager_cpu / cpu:.1f} in CPU)", flush=True)
    finally:
        shutil.rmtree(cache, ignore_errors=True)


if __name__ == "__main__":
    main()
