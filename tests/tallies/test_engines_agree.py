"""The type engine against the list engine: every total, every stable source,
every node-profile breakdown and every (profiles, source, stable source) class
agree exactly, on problems the list engine finishes in seconds."""

from collections import Counter

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from covertree.catalogue.catalogue import build_catalogue
from covertree.catalogue.pullback import build_pullback
from covertree.export.catalogue import catalogue_to_dict
from covertree.export.tallies import tallies_to_dict
from covertree.errors import ProblemError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.symmetric.partitions import partitions_of
from covertree.tallies.pullback import pullback_from_types
from covertree.tallies.types import tally_catalogue


def assert_agree(problem: HurwitzProblem, codim: int) -> None:
    listed = build_catalogue(problem, codim)
    tallied = tally_catalogue(problem, codim)
    assert listed.hurwitz_number == tallied.hurwitz_number
    assert [s.base for s in listed.strata] == [t.base for t in tallied.strata]
    for s, t in zip(listed.strata, tallied.strata):
        where = s.base.graph.notation
        assert t.total_weight == s.total_weight == s.hurwitz_number, where
        assert t.by_source() == s.by_source(), where
        profiles = Counter()
        classes = Counter()
        for c in s.covers:
            profiles[c.edge_profiles] += c.weight
            classes[(c.edge_profiles, c.source, c.stable_source)] += c.weight
        assert t.by_profiles() == sorted(profiles.items()), where
        assert {(p, a, b): w for p, a, b, w in t.by_class()} == dict(classes), where


CASES = [
    (HurwitzProblem.build(2, 1, genus=2), 2),
    (HurwitzProblem.build(3, 1, genus=2), 2),
    (HurwitzProblem.build(4, 1, genus=2), 1),
    (HurwitzProblem.build(3, 1, genus=3), 1),
    (HurwitzProblem.build(3, 1, None, ["3"]), 2),
    (HurwitzProblem.build(4, 1, None, ["3,1"]), 1),
    (HurwitzProblem.build(2, 0, genus=2), 2),
    (HurwitzProblem.build(3, 0, genus=1), 2),
    (HurwitzProblem.build(3, 0, None, ["3", "3", "3"]), 2),
    (HurwitzProblem.build(4, 0, None, ["2,2", "2,2", "2,2", "3,1"]), 2),
    (HurwitzProblem.build(4, 0, None, ["4", "2,2", "2,1,1", "2,1,1", "2,1,1"]), 1),
    (HurwitzProblem.build(2, 2, None, ["1,1"]), 1),
    (HurwitzProblem.build(2, 2, None, ["2", "2"]), 1),
    (HurwitzProblem.build(2, 2, None, ["1,1"]), 2),
    (HurwitzProblem.build(3, 0, genus=2), 2),
    (HurwitzProblem.build(5, 1, genus=2), 1),
    (HurwitzProblem.build(4, 0, genus=1), 1),
]


@pytest.mark.parametrize("problem, codim", CASES, ids=lambda x: str(x) if isinstance(x, int) else None)
def test_engines_agree(problem, codim):
    assert_agree(problem, codim)


@st.composite
def small_problems(draw):
    h = draw(st.sampled_from([0, 0, 1, 1, 2]))
    d = draw(st.integers(2, {0: 4, 1: 3, 2: 2}[h]))
    most = {0: 5, 1: 2, 2: 1}[h]
    parts = [tuple(p) for p in partitions_of(d) if len(p) < d or h > 0]
    n = draw(st.integers(max(1, 3 - 2 * h), most))
    profiles = [draw(st.sampled_from(parts)) for _ in range(n - 1)]
    # the last profile keeps the total ramification even (Riemann-Hurwitz)
    parity = sum(d - len(p) for p in profiles) % 2
    even = [p for p in parts if (d - len(p)) % 2 == parity]
    profiles.append(draw(st.sampled_from(even or parts)))
    codim = draw(st.integers(0, 2 if d <= 3 and n <= 4 else 1))
    return h, d, profiles, codim


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.filter_too_much])
@given(small_problems())
def test_engines_agree_random(drawn):
    h, d, profiles, codim = drawn
    try:
        problem = HurwitzProblem.build(d, h, profiles=profiles)
    except ProblemError:
        problem = None
    assume(problem is not None)
    assert_agree(problem, codim)


@pytest.mark.parametrize("problem", [
    HurwitzProblem.build(2, 0, genus=2),
    HurwitzProblem.build(2, 0, genus=3),
    HurwitzProblem.build(3, 0, genus=2),
    HurwitzProblem.build(2, 1, genus=2),
    HurwitzProblem.build(3, 1, genus=2),
    HurwitzProblem.build(4, 1, genus=2),
    HurwitzProblem.build(3, 1, genus=3),
    HurwitzProblem.build(2, 2, None, ["1,1"]),
    HurwitzProblem.build(4, 0, None, ["2,2", "2,2", "2,2", "2,2", "3,1"]),
    HurwitzProblem.build(3, 0, None, ["3", "3", "3", "3"]),
])
def test_pullback_coefficients_agree(problem):
    listed = build_pullback(problem)
    typed = pullback_from_types(problem)
    assert typed.divisors == listed.divisors
    assert [r.base for r in typed.rows] == [r.base for r in listed.rows]
    assert listed.rows
    for a, b in zip(listed.rows, typed.rows):
        assert a.coefficients == b.coefficients, a.base.graph.notation
        assert a.branch_total == b.branch_total == a.hurwitz_number


def test_json_has_the_catalogue_shape_without_covers():
    problem = HurwitzProblem.build(3, 1, genus=2)
    listed = catalogue_to_dict(build_catalogue(problem, 1))
    typed = tallies_to_dict(tally_catalogue(problem, 1))
    assert typed["problem"] == listed["problem"]
    assert typed["hurwitz_number"] == listed["hurwitz_number"]
    for a, b in zip(listed["strata"], typed["strata"]):
        assert "covers" not in b and "n_covers" not in b
        for key in ("base", "codim", "orbit_size", "total_weight", "by_source", "hurwitz_number", "identity"):
            assert a[key] == b[key], key


def test_cli_engine_types():
    import json

    from click.testing import CliRunner

    from covertree.cli import main

    runner = CliRunner()
    args = ["catalogue", "-t", "1", "-d", "3", "-g", "2", "-f", "json"]
    listed = json.loads(runner.invoke(main, args).output)
    result = runner.invoke(main, args + ["--engine", "types"])
    assert result.exit_code == 0, result.output
    typed = json.loads(result.output)
    assert [(s["total_weight"], s["by_source"]) for s in typed["strata"]] == \
        [(s["total_weight"], s["by_source"]) for s in listed["strata"]]
    assert all("covers" not in s for s in typed["strata"])
    table = runner.invoke(main, ["catalogue", "-t", "1", "-d", "3", "-g", "2", "--engine", "types"])
    assert table.exit_code == 0 and "holds" in table.output and "FAILS" not in table.output
    bad = runner.invoke(main, ["catalogue", "-t", "1", "-d", "3", "-g", "2", "--engine", "types", "-f", "csv"])
    assert bad.exit_code == 2
    pb = ["pullback", "-t", "1", "-d", "4", "-g", "2", "-f", "csv"]
    assert runner.invoke(main, pb + ["--engine", "types"]).output == runner.invoke(main, pb).output
