"""Benchmark: the catalogue of admissible covers.

1. Genus-2 covers of an elliptic curve (two simple branch points), every base
   stratum of codimension <= 2 (the 5 strata of Mbar_{1,2}), D = 2..7: seconds
   and number of covers; each stratum's total is checked against 2 [q^D] F_2
   (R. Dijkgraaf, Mirror symmetry and elliptic curves, 1995; OEIS A170991).
2. The engine against the brute-force oracle (tests/oracle/brute_covers.py) at
   D = 4 and 5 on the same (labelled) strata: seconds of each and the speed-up.
The peak memory of the ``-f jsonl`` stream is measured in bench_gluing.py
(the child's own peak, at D = 6..9).
"""

from __future__ import annotations

import pathlib
import sys
import time
from fractions import Fraction

ROOT = pathlib.Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from covertree.catalogue.catalogue import build_catalogue  # noqa: E402
from covertree.gluing.covers import glued_covers  # noqa: E402
from covertree.hurwitz.problem import HurwitzProblem  # noqa: E402
from covertree.strata.base import base_strata  # noqa: E402
from tests.oracle.brute_covers import brute_force_covers  # noqa: E402
from tests.quasimodular import f2_coefficients  # noqa: E402


def dijkgraaf_count(degree: int) -> Fraction:
    """2 [q^D] F_2 (Dijkgraaf 1995; see tests/quasimodular.py)."""
    return 2 * f2_coefficients(degree + 1)[degree]


def bench_catalogue(degrees) -> None:
    for d in degrees:
        problem = HurwitzProblem.build(d, 1, genus=2)
        start = time.perf_counter()
        cat = build_catalogue(problem, max_codim=2, max_covers=10**9)
        seconds = time.perf_counter() - start
        expected = dijkgraaf_count(d)
        ok = all(s.total_weight == expected for s in cat.strata)
        print(f"catalogue genus 2 over genus 1, D={d}, codim<=2: {cat.n_covers} covers over "
              f"{len(cat.strata)} strata in {seconds:.2f} s; totals {'=' if ok else '!='} "
              f"2[q^{d}]F_2 = {expected}", flush=True)


def _best_of(runs: int, work) -> tuple[float, int]:
    """Least wall time of ``runs`` calls of ``work`` and its (equal) result."""
    times, result = [], None
    for _ in range(runs):
        start = time.perf_counter()
        result = work()
        times.append(time.perf_counter() - start)
    return min(times), result


def bench_oracle(degrees) -> None:
    for d in degrees:
        profiles = [(2,) + (1,) * (d - 2)] * 2
        strata = [s.graph for s in base_strata(1, profiles, 2, labeled=True)]
        engine, n_engine = _best_of(5, lambda: sum(1 for g in strata for _ in glued_covers(g, d, profiles)))
        oracle, n_oracle = _best_of(5, lambda: sum(
            len(brute_force_covers(d, g.vertex_genera, g.nodes, g.vertex_legs, profiles)) for g in strata))
        print(f"engine vs brute-force oracle, D={d}, codim<=2 ({len(strata)} strata), best of 5: engine "
              f"{engine:.3f} s, oracle {oracle:.2f} s, speed-up x{oracle / engine:.1f}; covers "
              f"{n_engine} vs {n_oracle}{'' if n_engine == n_oracle else ' MISMATCH'}", flush=True)


def main() -> int:
    bench_catalogue(range(2, 8))
    bench_oracle([4, 5])
    return 0


if __name__ == "__main__":
    sys.exit(main())
