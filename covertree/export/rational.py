"""Exact rationals as text for the exporters: :mod:`covertree.rational`,
re-exported (the functions live at the bottom of the package so that the
layers before the exporters can print rationals without importing them).

>>> from fractions import Fraction
>>> rational_str(Fraction(15, 2))
'15/2'
"""

from __future__ import annotations

from covertree.rational import latex_rational, rational_str

__all__ = ["rational_str", "latex_rational"]
