"""Benchmark: enumeration of connected pieces (``covertree.monodromy.pieces``).

Prints one line per shape: the number of pieces, the sum of 1/|centraliser|
and the best of three timings.  For the genus-1 component with two simple
branch points, the weight of the pieces with both profiles exactly
``(2, 1^{d-2})`` is the count of connected genus-2 covers of an elliptic curve
(OEIS A170991: 2, 16, 60, 160, 360, 672 for d = 2..7; 1240 for d = 8 from
memory), checked here.
"""

from __future__ import annotations

import sys
import time
from fractions import Fraction

from covertree.monodromy.pieces import connected_pieces

A170991 = {2: 2, 3: 16, 4: 60, 5: 160, 6: 360, 7: 672, 8: 1240}


def _simple(d: int) -> dict[int, int]:
    return {2: 1, 1: d - 2}


def _shapes() -> list[tuple[str, int, int, list]]:
    shapes = [(f"h=1, two simple, d={d}", d, 1, [_simple(d)] * 2) for d in range(5, 9)]
    shapes += [(f"h=0, three free, d={d}", d, 0, [None] * 3) for d in (6, 7)]
    shapes += [(f"h=0, two simple + free, d={d}", d, 0, [_simple(d), _simple(d), None]) for d in (3, 7)]
    shapes += [(f"h=1, one free, d={d}", d, 1, [None]) for d in (6, 7)]
    shapes += [(f"h=2, one free, d={d}", d, 2, [None]) for d in (3, 4)]
    shapes += [("h=0, 8 simple, d=5", 5, 0, [_simple(5)] * 8)]
    return shapes


def _exact_simple_weight(pieces: list, d: int) -> Fraction:
    simple = (2,) + (1,) * (d - 2)
    return sum((Fraction(1, p.centraliser_order) for p in pieces
                if p.profile(0) == p.profile(1) == simple), Fraction(0))


def bench(name: str, d: int, h: int, allowed: list) -> bool:
    best = float("inf")
    for _ in range(3):
        start = time.perf_counter()
        pieces = connected_pieces(d, h, allowed)
        best = min(best, time.perf_counter() - start)
    weight = sum((Fraction(1, p.centraliser_order) for p in pieces), Fraction(0))
    ok, note = True, ""
    if name.startswith("h=1, two simple"):
        ok = _exact_simple_weight(pieces, d) == A170991[d]
        note = f", A170991 {'ok' if ok else 'MISMATCH'}"
    print(f"{name}: {len(pieces)} pieces, sum 1/|C| = {weight}{note}, {best:.3f} s", flush=True)
    return ok


def main() -> int:
    ok = all([bench(*shape) for shape in _shapes()])
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
