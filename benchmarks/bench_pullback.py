"""Benchmark: ``covertree pullback`` (coefficients of the boundary divisors of
Mbar_G over every base divisor, with the branch-total check).

Prints one line per problem: the number of base divisors and covers, the
Hurwitz number, whether every check holds, and the seconds taken.
"""

from __future__ import annotations

import sys
import time

from covertree.catalogue.pullback import build_pullback
from covertree.hurwitz.problem import HurwitzProblem

CASES = [
    # (degree, target genus, source genus)
    (3, 0, 3),  # genus-3 trigonal covers of the line: 10 simple branch points
    (3, 1, 3),  # genus-3 covers of an elliptic curve in degree 3: 4 branch points
]


def main() -> int:
    status = 0
    for degree, target, genus in CASES:
        start = time.perf_counter()
        pb = build_pullback(HurwitzProblem.build(degree, target, genus=genus))
        seconds = time.perf_counter() - start
        covers = sum(r.n_covers for r in pb.rows)
        ok = not pb.failures
        status |= not ok
        print(f"pullback d={degree} h={target} g={genus}: {len(pb.rows)} base divisors, {covers} covers, "
              f"H = {pb.hurwitz_number}, checks {'hold' if ok else 'FAIL'}, {seconds:.2f} s", flush=True)
    return status


if __name__ == "__main__":
    sys.exit(main())
