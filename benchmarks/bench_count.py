"""Benchmarks of the character layer and of ``covertree count``.

Prints one line per measurement: the character table of S_20 (627 classes, cold
caches) and the connected count of genus-2 covers of an elliptic curve at d = 30
(two simple branch points, cold caches, in a fresh process each), checked
against Dijkgraaf's F_2 (2 [q^30] F_2, OEIS A170991); then the same count at
d = 30 by the character-table engine and by the sparse engine (content sums,
no table) in one run, and the sparse engine at d = 60 and 100 with the peak
resident memory of the child process.
"""

from __future__ import annotations

import pathlib
import subprocess
import sys
import time

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent.parent))
from tests.quasimodular import f2_coefficients  # noqa: E402

CHILD = r"""
import time
t0 = time.perf_counter()
{body}
print(f"{{time.perf_counter() - t0:.3f}}")
"""

MEMORY = r"""
import resource, time
t0 = time.perf_counter()
{body}
print(f"{{time.perf_counter() - t0:.3f}} {{resource.getrusage(resource.RUSAGE_SELF).ru_maxrss // 1024}}")
"""

TABLE_ENGINE = """
from covertree.hurwitz.numbers import _transitive, _tuples
key = tuple(sorted([(2,) + (1,) * {d}] * 2))
value = _transitive(1, {d} + 2, key), _tuples(1, {d} + 2, key)
"""

SPARSE_ENGINE = """
from covertree.hurwitz.sparse import sparse_tuple_counts
value = sparse_tuple_counts({d} + 2, 1, [(2,) + (1,) * {d}] * 2)
"""

TABLE = """
from covertree.symmetric.characters import character_table
parts, table = character_table(20)
assert len(parts) == 627
"""

COUNT = """
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.symmetric.partitions import simple
value = connected_hurwitz(30, 1, [simple(30)] * 2)
"""


def _f2_coefficient(d: int):
    """[q^d] F_2 (Dijkgraaf 1995; see tests/quasimodular.py)."""
    return f2_coefficients(d + 1)[d]


def _timed(body: str, repeats: int = 3) -> list[float]:
    out = []
    for _ in range(repeats):
        code = CHILD.format(body=body)
        text = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True).stdout
        out.append(float(text.strip()))
    return out


def main() -> None:
    times = _timed(TABLE)
    print(f"character table of S_20 (627 classes), cold: best {min(times):.3f} s, "
          f"runs {', '.join(f'{t:.3f}' for t in times)}")
    times = _timed(COUNT)
    print(f"connected count, genus-2 covers of an elliptic curve, d = 30, cold: best {min(times):.3f} s, "
          f"runs {', '.join(f'{t:.3f}' for t in times)}")

    _engines()
    from covertree.hurwitz.numbers import connected_hurwitz
    from covertree.symmetric.partitions import simple

    value = connected_hurwitz(30, 1, [simple(30)] * 2)
    assert value == 2 * _f2_coefficient(30), value
    start = time.perf_counter()
    connected_hurwitz(31, 1, [simple(31)] * 2)
    warm = time.perf_counter() - start
    print(f"  value {value} = 2 [q^30] F_2; d = 31 after d = 30 (shared caches): {warm:.3f} s")


def _memory_run(body: str) -> tuple[float, int]:
    code = MEMORY.format(body=body)
    text = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True).stdout
    seconds, megabytes = text.split()
    return float(seconds), int(megabytes)


def _engines() -> None:
    table, table_mb = _memory_run(TABLE_ENGINE.format(d=28))
    sparse, sparse_mb = _memory_run(SPARSE_ENGINE.format(d=28))
    print(f"d = 30, genus 2 over an elliptic curve: character-table engine {table:.3f} s "
          f"({table_mb} MB peak), sparse engine {sparse:.3f} s ({sparse_mb} MB peak), "
          f"ratio {table / sparse:.1f}")
    for d in (60, 100):
        seconds, megabytes = _memory_run(SPARSE_ENGINE.format(d=d - 2))
        print(f"d = {d}, sparse engine: {seconds:.3f} s, {megabytes} MB peak")


if __name__ == "__main__":
    main()
