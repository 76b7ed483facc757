"""The generating series of a family in the degree, and its identification.

For a :class:`~covertree.series.family.Family` and a
:class:`~covertree.series.quantities.Quantity`, the series is
``sum_{d >= 0} d^K Q_d q^d``: ``Q_0`` is the given constant (covertree has no
degree-0 problems; 0 by default), ``Q_d`` the quantity of the problem of degree
``d`` (0 where the family has none), and ``K >= 0`` applies ``(q d/dq)^K`` (for
instance ``K = 1`` turns the ``sigma_1(d)/d`` unramified covers of an elliptic
curve into ``sum sigma_1(d) q^d``).  The series is then identified as a
quasimodular form by :func:`covertree.series.quasimodular.identify`.

References
----------
R. Dijkgraaf, *Mirror symmetry and elliptic curves*, in The Moduli Space of
Curves, Progr. Math. 129 (1995): the generating series of simply branched
covers of an elliptic curve of fixed genus are quasimodular;
M. Kaneko and D. Zagier, same volume (1995).

Examples
--------
Genus-2 covers of an elliptic curve (two labelled simple branch points):

>>> from covertree.series.family import Family
>>> from covertree.series.quantities import Quantity
>>> s = degree_series(Family(2, 1), Quantity("hurwitz"), max_degree=8, weight=6)
>>> [str(t.value) for t in s.terms]
['0', '2', '16', '60', '160', '360', '672', '1240']
>>> s.identification.text, s.identification.checked
('(5 E2^3 - 3 E2 E4 - 2 E6)/25920', 6)
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from fractions import Fraction

from covertree.errors import InputError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.series.family import Family
from covertree.series.quantities import Quantity
from covertree.series.quasimodular import Identification, identify, monomials, needed_coefficients

__all__ = ["DegreeSeries", "SeriesTerm", "degree_series", "series_terms"]


@dataclass(frozen=True)
class SeriesTerm:
    """The quantity in one degree (``problem`` ``None``: no covers, value 0)."""

    degree: int
    value: Fraction
    problem: HurwitzProblem | None


@dataclass(frozen=True)
class DegreeSeries:
    """A family's series and its identification.

    Attributes
    ----------
    family : Family
    quantity : Quantity
    terms : tuple of SeriesTerm
        Degrees ``1..N``.
    constant : Fraction
        The coefficient of ``q^0``.
    q_derivative : int
        ``K``: the ``d``-th coefficient of the series is ``d^K`` times the value.
    weight : int
    mixed : bool
    identification : Identification
    """

    family: Family
    quantity: Quantity
    terms: tuple[SeriesTerm, ...]
    constant: Fraction
    q_derivative: int
    weight: int
    mixed: bool
    identification: Identification

    @property
    def max_degree(self) -> int:
        return len(self.terms)

    @property
    def coefficients(self) -> tuple[Fraction, ...]:
        """``[q^0..q^N]`` of the series (after ``(q d/dq)^K``)."""
        return (self.constant,) + tuple(t.value * t.degree**self.q_derivative for t in self.terms)


def series_terms(family: Family, quantity: Quantity | None, max_degree: int,
                 evaluate: Callable[[HurwitzProblem], Fraction] | None = None) -> tuple[SeriesTerm, ...]:
    """The quantity in degrees ``1..max_degree`` (``evaluate`` overrides
    ``quantity.evaluate``: any function of a problem returning a Fraction).

    Raises
    ------
    InputError
        If ``max_degree < 1`` or neither a quantity nor ``evaluate`` is given.
    """
    if not isinstance(max_degree, int) or max_degree < 1:
        raise InputError(f"largest degree {max_degree!r} is not allowed; it is an integer >= 1")
    if evaluate is None:
        if quantity is None:
            raise InputError("a series needs a quantity or an evaluate function")
        evaluate = quantity.evaluate
    terms = []
    for d in range(1, max_degree + 1):
        problem = family.problem(d)
        terms.append(SeriesTerm(d, Fraction(evaluate(problem)) if problem else Fraction(0), problem))
    return tuple(terms)


def degree_series(family: Family, quantity: Quantity, max_degree: int, weight: int, mixed: bool = False,
                  constant: Fraction | int = 0, q_derivative: int = 0,
                  evaluate: Callable[[HurwitzProblem], Fraction] | None = None) -> DegreeSeries:
    """Compute the series to ``q^max_degree`` and identify it.

    Parameters
    ----------
    family, quantity
        What is counted in each degree.
    max_degree : int
        ``N``: degrees ``1..N`` are computed.
    weight : int
        Even weight of the forms tried; all even weights up to it if ``mixed``.
    constant : Fraction
        Coefficient of ``q^0``.
    q_derivative : int
        ``K >= 0``: multiply the ``d``-th coefficient by ``d^K``.
    evaluate : callable, optional
        Replaces ``quantity.evaluate`` (a hook for numbers not in
        :data:`~covertree.series.quantities.KINDS`).

    Raises
    ------
    InputError
        For a bad weight, derivative or degree, or too few degrees to solve and
        check (the message says how many are needed).
    """
    if not isinstance(q_derivative, int) or q_derivative < 0:
        raise InputError(f"q-derivative {q_derivative!r} is not allowed; it is an integer >= 0")
    _check_enough(max_degree, weight, mixed)
    terms = series_terms(family, quantity, max_degree, evaluate)
    constant = Fraction(constant)
    values = (constant,) + tuple(t.value * t.degree**q_derivative for t in terms)
    found = identify(values, weight, mixed)
    return DegreeSeries(family, quantity, terms, constant, q_derivative, weight, mixed, found)


def _check_enough(max_degree: int, weight: int, mixed: bool) -> None:
    """Refuse before computing when degrees ``1..N`` cannot solve and check."""
    monomials(weight, mixed)
    need = needed_coefficients(weight, mixed)
    if isinstance(max_degree, int) and max_degree < need:
        raise InputError(
            f"degrees up to {max_degree} give {max_degree + 1} coefficients; the "
            f"{len(monomials(weight, mixed))} monomial(s) of weight {'<= ' if mixed else ''}{weight} take "
            f"{need} to solve and one more to check: use degrees up to at least {need}"
        )
