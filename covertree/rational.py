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

__all__ = ["integer_str", "rational_str", "latex_rational"]

#: Integers of at most this many bits (under 3,900 digits) go through ``str``,
#: below Python's default limit of 4,300 digits for integer-to-text conversion.
_DIRECT_BITS = 13_000


def integer_str(n: int) -> str:
    """The decimal digits of ``n``, of any size.

    Python refuses to convert integers of more than 4,300 digits with ``str``
    (a guard against slow conversions of untrusted input); Hurwitz numbers of
    targets of large genus pass that easily, so larger integers are split in
    halves by a power of ten and converted piece by piece, without touching
    the interpreter-wide limit.

    >>> integer_str(-120)
    '-120'
    >>> text = integer_str(7 ** 20000)
    >>> len(text), text[:6], text[-4:], int(text[-12:]) == 7 ** 20000 % 10 ** 12
    (16902, '913692', '0001', True)
    """
    if n < 0:
        return "-" + integer_str(-n)
    if n.bit_length() <= _DIRECT_BITS:
        return str(n)
    digits = n.bit_length() * 3 // 20  # about half the digits (log10 2 > 0.3)
    high, low = divmod(n, 10 ** digits)
    return integer_str(high) + integer_str(low).rjust(digits, "0")


def rational_str(value: Fraction | int) -> str:
    """``"p/q"`` in lowest terms, or ``"n"`` when the value is an integer.

    >>> rational_str(Fraction(0))
    '0'
    """
    value = Fraction(value)
    if value.denominator == 1:
        return integer_str(value.numerator)
    return f"{integer_str(value.numerator)}/{integer_str(value.denominator)}"


def latex_rational(value: Fraction | int) -> str:
    r"""``\frac{p}{q}`` (the sign in front: ``-\frac{p}{q}``), or ``n`` when integral.

    >>> print(latex_rational(Fraction(5, 2)))
    \frac{5}{2}
    """
    value = Fraction(value)
    if value.denominator == 1:
        return integer_str(value.numerator)
    sign = "-" if value < 0 else ""
    return rf"{sign}\frac{{{integer_str(abs(value.numerator))}}}{{{integer_str(value.denominator)}}}"
