"""Benchmark: enumeration of all stable graphs of a type (``covertree strata``).

Prints one line per type: the number of strata, the expected published count
and the seconds taken (a fresh process, so the per-layer memo starts empty).
Expected counts: Mbar_{0,n} strata are OEIS A000311(n-1); Mbar_g strata are
the cells of the tropical moduli space (M. Chan, Combinatorics of the
tropical Torelli map, Algebra & Number Theory 6 (2012)).
"""

from __future__ import annotations

import sys
import time

from covertree.graphs import canonical_form, stable_graphs

CASES = [
    # (genus, points, published count)
    (0, 7, 2752),  # OEIS A000311
    (0, 8, 39208),  # OEIS A000311
    (4, 0, 379),  # Chan 2012
    (5, 0, 4555),  # Chan 2012
]


def bench_type(genus: int, points: int, expected: int) -> bool:
    start = time.perf_counter()
    graphs = stable_graphs(genus, points)
    seconds = time.perf_counter() - start
    ok = len(graphs) == expected
    print(
        f"strata of Mbar_{{{genus},{points}}}: {len(graphs)} (published {expected}"
        f"{'' if ok else ', MISMATCH'}) in {seconds:.2f} s",
        flush=True,
    )
    return ok


def bench_canonical_large() -> None:
    """Canonical form of a 30-vertex genus-0 graph with a large automorphism group."""
    edges = [(0, 1 + 5 * c) for c in range(5)]
    edges += [(1 + 5 * c + i, 1 + 5 * c + (i + 1) % 5) for c in range(5) for i in range(5)]
    edges += [(26 + i, 0) for i in range(4)]
    graph = ([0] * 30, edges, [[]] * 30)
    repeats = 20
    start = time.perf_counter()
    for _ in range(repeats):
        canonical_form(*graph)
    seconds = (time.perf_counter() - start) / repeats
    print(f"canonical form, 30 alike genus-0 vertices (|Aut_V| = 5!*2^5*4!): {seconds * 1e3:.1f} ms")


def main() -> int:
    ok = all([bench_type(*case) for case in CASES])
    bench_canonical_large()
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
