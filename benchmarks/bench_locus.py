"""Locus classes and cover-space integrals: the d-elliptic classes in genus 2
(d = 2..8), the hyperelliptic genus-3 class, and every top intersection number
of lambda, delta_0, delta_1 on Mbar_3 from the degree-1 problem."""

from __future__ import annotations

import time
from itertools import combinations_with_replacement

from covertree.hurwitz.problem import HurwitzProblem
from covertree.locus.divisor import locus_class
from covertree.locus.integrals import cover_space_integrals
from covertree.locus.monomial import Monomial


def timed(label: str, thunk) -> None:
    start = time.perf_counter()
    value = thunk()
    print(f"{label}: {time.perf_counter() - start:.2f} s  {value}", flush=True)


def main() -> None:
    for d in range(2, 9):
        timed(f"d-elliptic genus 2, d={d}",
              lambda: {k: str(v) for k, v in locus_class(HurwitzProblem.build(d, 1, genus=2)).labelled.items()})
    timed("hyperelliptic genus 3 (b = 8)",
          lambda: {k: str(v) for k, v in locus_class(HurwitzProblem.build(2, 0, genus=3)).unordered.items()})
    monomials = [(Monomial.from_powers([(c, 1) for c in combo]), Monomial(()))
                 for combo in combinations_with_replacement(["lambda", "delta_0", "delta_1"], 6)]
    timed(f"Mbar_3: all {len(monomials)} top monomials in lambda, delta_0, delta_1",
          lambda: len(cover_space_integrals(HurwitzProblem.build(1, 3, genus=3), monomials)))


if __name__ == "__main__":
    main()
