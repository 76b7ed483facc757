"""Sweep totals against published Hurwitz numbers."""

import json

from tests.sweep.helpers import f2_coefficient, invoke


def test_genus_two_covers_of_an_elliptic_curve_match_dijkgraaf():
    # Genus-2 covers of an elliptic curve with two simple branch points, weight 1/|Aut|:
    # 2 [q^d] F_2 (R. Dijkgraaf, Mirror symmetry and elliptic curves, 1995), which is
    # OEIS A170991: 2, 16, 60, 160, 360 for d = 2..6 (terms from memory).
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "2..6", "-k", "1", "-j", "2", "-f", "json", "-q")
    assert result.exit_code == 0, result.stderr
    doc = json.loads(result.stdout)
    totals: dict[int, set[str]] = {}
    for row in doc["strata"]:
        totals.setdefault(row["degree"], set()).add(row["total_weight"])
        assert row["identity"] and row["total_weight"] == row["hurwitz_number"]
    assert totals == {d: {str(2 * f2_coefficient(d))} for d in range(2, 7)}
    assert totals == {d: {str(n)} for d, n in zip(range(2, 7), [2, 16, 60, 160, 360])}
    # three strata of Mbar_{1,2} up to codimension one per degree (smooth, irreducible
    # node, rational tail with both points): counted by hand
    assert doc["summary"]["strata"] == 15 and doc["summary"]["problems"] == 5


def test_genus_three_totals_match_oeis_a170992():
    # Genus-3 covers of an elliptic curve, four simple branch points: OEIS A170992
    # 2, 160 for d = 2, 3 (terms read from the OEIS entry; Roth-Yui 2010).
    result = invoke("sweep", "-g", "3", "-t", "1", "-d", "2..3", "-f", "json", "-q")
    doc = json.loads(result.stdout)
    published = {2: "2", 3: "160"}
    assert {(r["degree"], r["total_weight"]) for r in doc["strata"]} == set(published.items())
