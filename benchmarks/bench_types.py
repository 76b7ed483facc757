"""Benchmarks of the type engine (:mod:`covertree.tallies`).

Prints one line per measurement, each run in a fresh process (cold caches):

* genus-2 covers of an elliptic curve over every base stratum of codimension
  <= 1 at d = 12, 16, 20, 30 and 40, each stratum's total checked against
  2 [q^d] F_2 (Dijkgraaf 1995, OEIS A170991);
* the ratio list engine / type engine at d = 6 and 7 (same problem);
* genus-0 targets with simple branching, trigonal and tetragonal covers of
  genus 4 to 6 and pentagonal ones of genus 4 and 5 over every
  codimension-one stratum (orbits), with the time to select the strata shown
  apart (it is the same for both engines).  Tetragonal genus 6 has 18 simple
  points, 16 of them on one vertex of the divisors ``2|16``: the local
  multisets there are set partitions of the legs, listed up to permutations
  of the simple legs (:func:`covertree.tallies.shapes.vertex_orbits`).

``python benchmarks/bench_types.py quick`` skips the slowest measurements.
"""

from __future__ import annotations

import pathlib
import subprocess
import sys

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent.parent))
from tests.quasimodular import f2_coefficients  # noqa: E402

CHILD = r"""
import time
from fractions import Fraction
from covertree.hurwitz.problem import HurwitzProblem
from covertree.catalogue.catalogue import select_strata
problem = HurwitzProblem.build({d}, {h}, genus={g})
t0 = time.perf_counter()
strata = select_strata(problem, 1)
t1 = time.perf_counter()
if "{engine}" == "list":
    from covertree.catalogue.catalogue import build_catalogue
    result = build_catalogue(problem, 1)
    totals = [s.total_weight for s in result.strata]
    size = result.n_covers
else:
    from covertree.tallies.types import tally_catalogue
    result = tally_catalogue(problem, 1)
    totals = [s.total_weight for s in result.strata]
    size = sum(len(s.entries) for s in result.strata)
t2 = time.perf_counter()
assert all(t == result.hurwitz_number for t in totals), totals
print(t1 - t0, t2 - t1, len(strata), size, result.hurwitz_number)
"""


def _f2_coefficient(d: int):
    """[q^d] F_2 (Dijkgraaf 1995; see tests/quasimodular.py)."""
    return f2_coefficients(d + 1)[d]


def _run(d: int, h: int, g: int, engine: str = "types") -> tuple[float, float, int, int, str]:
    """``(strata seconds, engine seconds, strata, entries or covers, H)``;
    the engine time includes selecting the strata once more (cached)."""
    code = CHILD.format(d=d, h=h, g=g, engine=engine)
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True).stdout.split()
    return float(out[0]), float(out[1]), int(out[2]), int(out[3]), out[4]


def main(quick: bool = False) -> None:
    for d in (12, 16) if quick else (12, 16, 20, 30, 40):
        _, t, n, size, value = _run(d, 1, 2)
        assert value == str(2 * _f2_coefficient(d)), (value, d)
        print(f"genus 2 over an elliptic curve, d = {d}, codim <= 1 ({n} strata, {size} tally entries): "
              f"types {t:.2f} s; every total = 2 [q^{d}] F_2 = {value}", flush=True)
    for d in (6, 7):
        _, t_list, _, covers, _ = _run(d, 1, 2, "list")
        _, t_types, _, entries, _ = _run(d, 1, 2)
        print(f"genus 2 over an elliptic curve, d = {d}, codim <= 1: list {t_list:.2f} s ({covers} covers), "
              f"types {t_types:.3f} s ({entries} entries), ratio {t_list / t_types:.0f}", flush=True)
    cases = [(3, 4), (3, 5), (3, 6), (4, 4), (4, 5), (4, 6), (5, 4)] + ([] if quick else [(5, 5)])
    for d, g in cases:
        t_strata, t, n, size, value = _run(d, 0, g)
        print(f"genus {g}, degree {d} over P^1 ({2 * g + 2 * d - 2} simple points), every divisor "
              f"({n} orbits, {size} tally entries): strata {t_strata:.2f} s, types {t:.2f} s; H = {value}",
              flush=True)


if __name__ == "__main__":
    main(quick="quick" in sys.argv[1:])
