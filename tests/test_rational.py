"""Rationals as text: exact for integers of any size.

Python's ``str`` refuses integers of more than 4,300 digits (its default
limit); Hurwitz numbers of targets of large genus have more, and every
exporter prints them through :mod:`covertree.rational`.
"""

from __future__ import annotations

import json
import sys
from contextlib import contextmanager
from fractions import Fraction

from click.testing import CliRunner
from hypothesis import given, settings, strategies as st

from covertree.cli import main
from covertree.rational import integer_str, latex_rational, rational_str


@contextmanager
def unlimited_str():
    """Lift the interpreter's digit limit for the reference conversion only."""
    previous = sys.get_int_max_str_digits()
    sys.set_int_max_str_digits(0)
    try:
        yield
    finally:
        sys.set_int_max_str_digits(previous)


@settings(max_examples=200, deadline=None)
@given(st.integers(0, 70_000).flatmap(lambda bits: st.integers(-(2 ** bits), 2 ** bits)))
def test_integer_text_is_str_without_its_limit(n):
    text = integer_str(n)
    with unlimited_str():
        assert text == str(n)


def test_huge_rationals_as_text_and_latex():
    value = Fraction(3 ** 12_000 + 1, 2 ** 15_000)
    with unlimited_str():
        p, q = str(value.numerator), str(value.denominator)
    assert rational_str(value) == f"{p}/{q}"
    assert rational_str(-value) == f"-{p}/{q}"
    assert latex_rational(-value) == rf"-\frac{{{p}}}{{{q}}}"
    assert rational_str(Fraction(10 ** 5000)) == "1" + "0" * 5000


def test_count_prints_a_hurwitz_number_of_thousands_of_digits():
    # unramified degree-3 covers of a genus-3000 curve: about 4,700 digits
    for fmt in ("json", "csv", "latex", "table"):
        result = CliRunner().invoke(main, ["count", "-t", "3000", "-d", "3", "-f", fmt])
        assert result.exit_code == 0, (fmt, result.output[-300:])
    document = json.loads(CliRunner().invoke(main, ["count", "-t", "3000", "-d", "3", "-f", "json"]).output)
    from covertree.hurwitz.numbers import hurwitz_numbers
    from covertree.hurwitz.problem import HurwitzProblem

    connected, disconnected = hurwitz_numbers(HurwitzProblem.build(3, 3000))
    assert len(integer_str(disconnected.numerator)) > 4300
    text = json.dumps(document)
    assert rational_str(connected) in text and rational_str(disconnected) in text
