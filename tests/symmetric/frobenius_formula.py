"""Characters of ``S_n`` by Frobenius' character formula, written out afresh
for the tests (no part of covertree is used).

``chi_lambda(mu)`` is the coefficient of ``x^(lambda + delta)`` in
``a_delta(x) p_mu(x)``, with ``l`` the number of parts of ``lambda``,
``delta = (l - 1, ..., 1, 0)``, ``a_delta`` the Vandermonde determinant
``sum_sigma sgn(sigma) x^sigma(delta)`` and ``p_mu`` the product of the power
sums ``x_1^m + ... + x_l^m`` over the parts ``m`` of ``mu`` (W. Fulton and
J. Harris, *Representation Theory: A First Course*, 1991, section 4.1, the
Frobenius formula; G. Frobenius 1900).  The coefficient of ``x^alpha`` in
``p_mu`` is the number of ways to send each part of ``mu`` to a variable so
that the parts sent to variable ``j`` sum to ``alpha_j``.
"""

from __future__ import annotations

from itertools import permutations


def _sign(sigma: tuple[int, ...]) -> int:
    inversions = sum(1 for i in range(len(sigma)) for j in range(i) if sigma[j] > sigma[i])
    return -1 if inversions % 2 else 1


def _ways(parts: tuple[int, ...], room: list[int]) -> int:
    """Ways to send each part to a variable filling ``room`` exactly."""
    if not parts:
        return int(not any(room))
    first, rest, total = parts[0], parts[1:], 0
    for j, free in enumerate(room):
        if free >= first:
            room[j] -= first
            total += _ways(rest, room)
            room[j] += first
    return total


def frobenius_character(lam: tuple[int, ...], mu: tuple[int, ...]) -> int:
    """``chi_lambda(mu)`` by Frobenius' formula (``|lambda| = |mu|``)."""
    l = len(lam)
    delta = [l - 1 - i for i in range(l)]
    total = 0
    for sigma in permutations(range(l)):
        alpha = [lam[i] + delta[i] - delta[sigma[i]] for i in range(l)]
        if min(alpha, default=0) >= 0:
            total += _sign(sigma) * _ways(tuple(mu), alpha)
    return total
