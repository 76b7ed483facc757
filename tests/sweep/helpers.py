"""Shared helpers of the sweep tests: Dijkgraaf's F_2 and running the CLI."""

from __future__ import annotations

import subprocess
import sys
from fractions import Fraction

from click.testing import CliRunner

from covertree.cli import main
from tests.quasimodular import f2_coefficients

#: Run ``covertree`` in a fresh interpreter (for interruption and concurrency tests).
COVERTREE = [sys.executable, "-c", "from covertree.cli import main; main()"]


def invoke(*args: str):
    """``covertree ARGS`` through click's CliRunner (stderr kept apart)."""
    return CliRunner().invoke(main, list(args))


def spawn(*args: str, **kwargs) -> subprocess.Popen:
    """``covertree ARGS`` in a child process, output captured."""
    return subprocess.Popen([*COVERTREE, *args], stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                            text=True, **kwargs)


def f2_coefficient(d: int) -> Fraction:
    """``[q^d] F_2`` (R. Dijkgraaf, *Mirror symmetry and elliptic curves*, 1995;
    see :mod:`tests.quasimodular`)."""
    return f2_coefficients(d + 1)[d]
