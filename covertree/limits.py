"""Limits on the size of a run: bounded integers and estimates of the work.

Cheap arguments can ask for astronomically long or large runs (a degree of
``10^8``, a genus needing ``2 * 10^9`` branch points, all strata of
``Mbar_{6,4}``).  Every command whose cost can explode estimates the work
*before* starting, in **steps** (one step is roughly a microsecond of the
inner loops and at most :data:`BYTES_PER_STEP` bytes of memory), and refuses
with :class:`~covertree.errors.TooLargeError` when the estimate exceeds its
work limit (default :data:`DEFAULT_MAX_WORK`, about a minute or two and a
memory of 1 GB; the commands' ``--max-work`` raises it).  The message names
the size that makes the run infeasible and the largest feasible value of the
parameter.

The estimates are deliberately coarse (within a factor of a few on the runs
measured in ``benchmarks/bench_limits.py``); they are upper-bound flavoured,
never exact mathematics, and are kept on a logarithmic scale (floats) so that
a value such as ``10^30`` costs nothing to assess.

This module sits below every layer: it imports nothing but the errors.

Examples
--------
>>> parse_natural("0042", "a genus")
42
>>> parse_natural("9" * 30, "a genus")
Traceback (most recent call last):
...
covertree.errors.InputError: a genus '999999999999999999999999999999' has 30 digits; at most 18 allowed
>>> largest_feasible(lambda x: x * x, 1, 10**6, 10**4)
100
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable
from functools import lru_cache

from covertree.errors import InputError, TooLargeError

__all__ = [
    "BYTES_PER_STEP", "DEFAULT_MAX_WORK", "MAX_DEGREE", "MAX_DIGITS", "check_work", "largest_feasible", "log_partitions",
    "parse_natural", "steps_text",
]

#: default work limit in steps (about a minute or two; 1 GB at BYTES_PER_STEP)
DEFAULT_MAX_WORK = 10**8
#: memory a step may stand for: the work limit times this is the memory limit
BYTES_PER_STEP = 10
#: longest integer read from user text (digits after leading zeros)
MAX_DIGITS = 18
#: sizes beyond this are infeasible for every estimate (kept out of floats)
HUGE = 10**15
#: largest degree (and number of parts of a profile) covertree represents;
#: the work estimates refuse far smaller ones for every engine
MAX_DEGREE = 10**6

_DIGITS = re.compile(r"[0-9]+", re.ASCII)


def parse_natural(text: str, what: str, max_digits: int = MAX_DIGITS) -> int:
    """The integer written by ``text`` (ASCII digits only, at most
    ``max_digits`` significant digits), or :class:`InputError` naming it.

    Python refuses to convert strings of more than 4300 digits and accepts
    other scripts' digits (``int('٣')``); both are refused here with one line.

    >>> parse_natural("\\u00b2", "a part")
    Traceback (most recent call last):
    ...
    covertree.errors.InputError: a part '²' is not a number: write ASCII digits 0-9
    """
    text = str(text).strip()
    if not _DIGITS.fullmatch(text):
        raise InputError(f"{what} {_short(text)} is not a number: write ASCII digits 0-9")
    significant = len(text.lstrip("0"))
    if significant > max_digits:
        raise InputError(f"{what} {_short(text)} has {significant} digits; at most {max_digits} allowed")
    return int(text)


def _short(text: str, width: int = 30) -> str:
    # the value quoted, cut to a short window
    if len(text) <= width:
        return repr(text)
    return f"{text[:width]!r}... ({len(text)} characters)"


def steps_text(steps: float) -> str:
    """An estimate of steps for a message: exact below a million, else a power of ten.

    >>> steps_text(1234), steps_text(3.2e21), steps_text(math.inf)
    ('1234', 'about 10^21.5', 'more than 10^300')
    """
    if steps < 10**6:
        return str(int(steps))
    if steps == math.inf or steps > 1e300:
        return "more than 10^300"
    return f"about 10^{math.log10(steps):.1f}"


def largest_feasible(cost: Callable[[int], float], low: int, high: int, limit: float) -> int | None:
    """The largest ``x`` in ``low..high`` with ``cost(x) <= limit`` for a
    non-decreasing ``cost`` (bisection), or ``None`` when even ``low`` is too costly.

    >>> largest_feasible(lambda x: 2 ** x, 0, 100, 1000), largest_feasible(lambda x: 10, 0, 5, 1)
    (9, None)
    """
    if cost(low) > limit:
        return None
    while low < high:
        middle = (low + high + 1) // 2
        if cost(middle) <= limit:
            low = middle
        else:
            high = middle - 1
    return low


def check_work(steps: float, limit: float | None, subject: str, feasible: str) -> None:
    """Refuse a run estimated at ``steps`` beyond ``limit`` (``None``: no limit).

    Parameters
    ----------
    steps : float
        The estimate.
    limit : float or None
        The work limit (``--max-work``).
    subject : str
        What makes the run large (``"degree 100000 with 2 branch points"``).
    feasible : str
        The largest feasible values (``"the largest feasible degree is 460"``).

    Raises
    ------
    TooLargeError
        With one line naming the estimate, the limit and ``feasible``.

    Examples
    --------
    >>> check_work(10**9, 10**8, "degree 900", "the largest feasible degree is 400")
    Traceback (most recent call last):
    ...
    covertree.errors.TooLargeError: degree 900 would take about 10^9.0 steps, beyond the work limit 10^8 (--max-work); the largest feasible degree is 400
    """
    if limit is None or steps <= limit:
        return
    raise TooLargeError(f"{subject} would take {steps_text(steps)} steps, beyond the work limit "
                        f"{limit_text(limit)} (--max-work); {feasible}")


def limit_text(limit: float) -> str:
    """``10^8`` for a power of ten, else the number.

    >>> limit_text(10**8), limit_text(5000)
    ('10^8', '5000')
    """
    exponent = round(math.log10(limit)) if limit > 0 else 0
    if limit >= 10 and 10**exponent == limit:
        return f"10^{exponent}"
    return str(int(limit))


@lru_cache(maxsize=1)
def _partition_table(n: int) -> tuple[int, ...]:
    # p(0..n) by Euler's pentagonal number recurrence
    p = [1] + [0] * n
    for m in range(1, n + 1):
        total, k = 0, 1
        while True:
            pent = k * (3 * k - 1) // 2
            if pent > m:
                break
            sign = 1 if k % 2 else -1
            total += sign * p[m - pent]
            if pent + k <= m:
                total += sign * p[m - pent - k]
            k += 1
        p[m] = total
    return tuple(p)


#: partitions counted exactly up to this size, estimated above
_EXACT_PARTITIONS = 600


def log_partitions(n: int) -> float:
    """Natural logarithm of the number ``p(n)`` of partitions of ``n``: exact
    up to 600, above by the Hardy-Ramanujan asymptotic
    ``p(n) ~ exp(pi sqrt(2n/3)) / (4 n sqrt 3)``.

    >>> round(math.exp(log_partitions(100)))   # p(100), common knowledge
    190569292
    """
    if n <= _EXACT_PARTITIONS:
        return math.log(_partition_table(_EXACT_PARTITIONS)[max(n, 0)])
    if n > HUGE:
        return math.inf
    return math.pi * math.sqrt(2 * n / 3) - math.log(4 * n * math.sqrt(3))


def partitions_up_to(n: int) -> float:
    """``sum_{m <= n} p(m)`` (an estimate above 600), as a float.

    >>> partitions_up_to(5)   # 1 + 1 + 2 + 3 + 5 + 7
    19.0
    """
    if n <= _EXACT_PARTITIONS:
        return float(sum(_partition_table(_EXACT_PARTITIONS)[: max(n, 0) + 1]))
    if n > HUGE:
        return math.inf
    # the terms grow fast: the last few dominate
    return _exp(log_partitions(n)) * math.sqrt(n)


def _exp(x: float) -> float:
    return math.inf if x > 700 else math.exp(x)


def log_double_factorial(n: int) -> float:
    """``log(n!!)`` for odd ``n >= -1`` (``(-1)!! = 1``), through the gamma function.

    >>> round(math.exp(log_double_factorial(7)))
    105
    """
    if n <= 0:
        return 0.0
    k = (n + 1) // 2  # n!! = (2k)! / (2^k k!)
    return math.lgamma(2 * k + 1) - k * math.log(2) - math.lgamma(k + 1)


#: steps per stratum listed, per vertex (canonical form and bookkeeping)
STEPS_PER_STRATUM_VERTEX = 60


def log_trivalent_graphs(genus: int, n: int) -> float:
    """Logarithm of the orbifold count of trivalent genus-0-vertex graphs of
    type ``(genus, n)`` (the strata of top codimension): pairings of the
    ``3V - n`` free half-edges, placements of the ``n`` legs, divided by
    ``V! 6^V`` (``V = 2 genus - 2 + n`` vertices).

    >>> round(math.exp(log_trivalent_graphs(1, 4)))   # 39 such strata of Mbar_{1,4}
    40
    """
    v = 2 * genus - 2 + n
    if v <= 0:
        return 0.0
    half = 3 * v
    return (log_double_factorial(half - n - 1) + math.lgamma(half + 1) - math.lgamma(half - n + 1)
            - math.lgamma(v + 1) - v * math.log(6))


def strata_count(genus: int, n: int, codim: int) -> float:
    """Estimated number of strata of ``Mbar_{genus,n}`` of codimension at most
    ``codim`` (within a factor of about 5 where measured; ``math.inf`` when
    beyond ``10^300``).  Layer ``j`` is taken as the smaller of
    ``c_1^j / j!`` (``c_1`` the codimension-one strata, about
    ``1 + (genus + 1) 2^(n - 1)``) and the top layer times
    ``exp(1.085 t - 0.585 t^2)``, ``t = 3 genus - 3 + n - j`` (fitted on
    ``Mbar_{0,8}``) and ``exp(0.8 genus)`` (automorphisms make the orbifold
    count short of the number of graphs; fitted on ``Mbar_{3,3}`` and
    ``Mbar_{4,1}``), and at least ``c_1`` below the top (the layers grow up
    to there).

    >>> 10**8 < strata_count(6, 4, 19) < 10**11, strata_count(10**30, 4, 10**30) > 10**60
    (True, True)
    """
    if max(genus, n, 0) > HUGE:
        return math.inf
    top_codim = 3 * genus - 3 + n
    log_top = log_trivalent_graphs(genus, n)
    log_c1 = math.log1p((genus + 1) * 2.0 ** min(n - 1, 1000)) if n <= 1000 else n * math.log(2)
    last = min(codim, top_codim)
    # far from both ends every layer is c_1: count those without a loop
    ends = list(range(0, last + 1)) if last <= 2000 else [*range(0, 1000), *range(last - 999, last + 1)]
    total = max(0, last + 1 - len(ends)) * _exp(log_c1)
    for j in ends:
        t = top_codim - j
        by_choices = j * log_c1 - math.lgamma(j + 1)
        by_top = log_top + 1.085 * t - 0.585 * t * t + 0.8 * genus
        layer = min(by_choices, by_top)
        if 1 <= j < top_codim:  # the layers grow from codimension one to near the top
            layer = max(layer, log_c1)
        total += _exp(max(0.0, layer))
        if total > 1e300:
            return math.inf
    return total


def strata_work(genus: int, n: int, codim: int) -> float:
    """Estimated steps to list the strata of ``Mbar_{genus,n}`` up to ``codim``.

    >>> strata_work(0, 5, 2) < 10**5 < strata_work(6, 4, 19)
    True
    """
    count = strata_count(genus, n, codim)
    if count == math.inf:
        return count
    vertices = min(2 * genus - 2 + n, codim + 1)  # at most one more vertex per node
    return count * STEPS_PER_STRATUM_VERTEX * max(1, vertices)
