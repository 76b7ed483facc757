"""Run every ``benchmarks/bench_*.py`` script in turn (``make bench``).

Each script prints its own figures (one line per measurement) and exits 0.
"""

from __future__ import annotations

import pathlib
import subprocess
import sys


def main() -> int:
    here = pathlib.Path(__file__).resolve().parent
    status = 0
    for script in sorted(here.glob("bench_*.py")):
        print(f"== {script.name}", flush=True)
        status |= subprocess.call([sys.executable, str(script)])
    return status


if __name__ == "__main__":
    sys.exit(main())
