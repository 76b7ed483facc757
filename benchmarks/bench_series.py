"""Benchmark: generating series identified as quasimodular forms
(``covertree.series``) and the networkx cross-check (``covertree.interop``).

Prints one line per run: the form found (or that none fits), the numbers of
coefficients solving and checking, and the best of three timings.  Published
forms: Dijkgraaf (1995) genus 2, Kaneko-Zagier (1995) genus 3 (OEIS A170992);
``(1 - E2)/24`` for ``q d/dq`` of the unramified covers (common knowledge).
"""

from __future__ import annotations

import time

from covertree.graphs import stable_graphs
from covertree.interop.nxgraphs import networkx_automorphisms
from covertree.series.family import Family, ProfileShape
from covertree.series.generating import degree_series
from covertree.series.quantities import Quantity


def _best(fn, repeats: int = 3):
    best, out = float("inf"), None
    for _ in range(repeats):
        start = time.perf_counter()
        out = fn()
        best = min(best, time.perf_counter() - start)
    return best, out


RUNS = [
    ("genus 2, H, d <= 20, weight 6", Family(2, 1), Quantity("hurwitz"), 20, 6, False, 0),
    ("genus 3, H, d <= 20, weight 12", Family(3, 1), Quantity("hurwitz"), 20, 12, False, 0),
    ("genus 4, H, d <= 24, weight 18", Family(4, 1), Quantity("hurwitz"), 24, 18, False, 0),
    ("unramified, q d/dq, d <= 30, weight <= 2", Family(1, 1, (ProfileShape.parse("1^*"),)), Quantity("hurwitz"),
     30, 2, True, 1),
    ("genus 2, c(D_sep, delta_1) types, d <= 10", Family(2, 1),
     Quantity("pullback", stratum="g0{1,2}, g1 | 0-1", coefficient="delta_1"), 10, 4, True, 0),
    ("genus 2, total over irreducible base, types, d <= 10", Family(2, 1),
     Quantity("total", stratum="g0{1,2} | 0-0"), 10, 6, False, 0),
]


def main() -> None:
    for label, family, quantity, n, weight, mixed, k in RUNS:
        seconds, s = _best(lambda: degree_series(family, quantity, n, weight, mixed, q_derivative=k), 1 if n > 20 else 3)
        found = s.identification
        verdict = found.text if found.found else "no form fits"
        print(f"{label}: {verdict}; solved {found.solved_with}, checked {found.checked}; {seconds:.2f} s", flush=True)
    for genus, n in [(0, 7), (4, 0), (2, 2)]:
        graphs = stable_graphs(genus, n)
        seconds, agree = _best(lambda: all(networkx_automorphisms(g) == g.automorphisms for g in graphs), 1)
        print(f"networkx |Aut| of {len(graphs)} strata of Mbar_{{{genus},{n}}}: agree={agree}; {seconds:.2f} s",
              flush=True)


if __name__ == "__main__":
    main()
