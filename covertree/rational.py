r"""Exact rationals as text: ``p/q`` (``n`` when integral) and LaTeX ``\frac``.

Every exporter of covertree prints weights and Hurwitz numbers through these
two functions, so that JSON, CSV and LaTeX agree.  The module sits at the
bottom of the package (it imports nothing of covertree), so that layers before
the exporters (the sweep store, the networkx interface) can use it too;
:mod:`covertree.export.rational` re-exports it for the exporters.

Examples
--------
>>> from fractions import Fraction
>>> rational_str(Fraction(15, 2)), rational_str(Fraction(4, 2)), rational_str(Fraction(-1, 3))
('15/2', '2', '-1/3')
>>> print(latex_rational(Fraction(-1, 3)), latex_rational(Fraction(6, 3)))
-\frac{1}{3} 2
"""

from __future__ import annotations

from fractions import Fraction

__all__ = ["rational_str", "latex_rational"]


def rational_str(value: Fraction | int) -> str:
    """``"p/q"`` in lowest terms, or ``"n"`` when the value is an integer.

    >>> rational_str(Fraction(0))
    '0'
    """
    value = Fraction(value)
    if value.denominator == 1:
        return str(value.numerator)
    return f"{value.numerator}/{value.denominator}"


def latex_rational(value: Fraction | int) -> str:
    r"""``\frac{p}{q}`` (the sign in front: ``-\frac{p}{q}``), or ``n`` when integral.

    >>> print(latex_rational(Fraction(5, 2)))
    \frac{5}{2}
    """
    value = Fraction(value)
    if value.denominator == 1:
        return str(value.numerator)
    sign = "-" if value < 0 else ""
    return rf"{sign}\frac{{{abs(value.numerator)}}}{{{value.denominator}}}"
