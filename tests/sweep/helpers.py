"""Shared helpers of the sweep tests: Dijkgraaf's F_2 and running the CLI."""

from __future__ import annotations

import subprocess
import sys
from fractions import Fraction

from click.testing import CliRunner

from covertree.cli import main

#: Run ``covertree`` in a fresh interpreter (for interruption and concurrency tests).
COVERTREE = [sys.executable, "-c", "from covertree.cli import main; main()"]


def invoke(*args: str):
    """``covertree ARGS`` through click's CliRunner (stderr kept apart)."""
    return CliRunner().invoke(main, list(args))


def spawn(*args: str, **kwargs) -> subprocess.Popen:
    """``covertree ARGS`` in a child process, output captured."""
    return subprocess.Popen([*COVERTREE, *args], stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                            text=True, **kwargs)


def _sigma(k: int, n: int) -> int:
    return sum(e**k for e in range(1, n + 1) if n % e == 0)


def _series_product(a: list, b: list) -> list:
    return [sum(a[i] * b[m - i] for i in range(m + 1)) for m in range(len(a))]


def f2_coefficient(d: int) -> Fraction:
    """``[q^d] F_2`` with ``F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6) / 103680``
    (R. Dijkgraaf, *Mirror symmetry and elliptic curves*, 1995; Kaneko-Zagier 1995)."""
    n = d + 1
    e2 = [1] + [-24 * _sigma(1, m) for m in range(1, n)]
    e4 = [1] + [240 * _sigma(3, m) for m in range(1, n)]
    e6 = [1] + [-504 * _sigma(5, m) for m in range(1, n)]
    e2_cubed = _series_product(_series_product(e2, e2), e2)
    e2e4 = _series_product(e2, e4)
    return Fraction(10 * e2_cubed[d] - 6 * e2e4[d] - 4 * e6[d], 103680)
