"""The plan of a sweep and the computation of one task."""

from fractions import Fraction

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.catalogue.covers import divisor_name
from covertree.errors import InputError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.sweep.tasks import (
    SweepSpec, compute_task, parse_shard, plan_sweep, problem_order, shard_tasks,
)


def test_problems_in_lexicographic_order_and_skips_reported():
    plan = plan_sweep(SweepSpec(genera=(3, 2), target_genera=(1, 0), degrees=(3, 1, 2)))
    keys = [problem_order(p) for p in plan.problems]
    assert keys == sorted(keys)
    # Riemann-Hurwitz: degree 1 has no branching, so only genus = target genus survives
    assert {(s.genus, s.target_genus, s.degree) for s in plan.skipped} == {
        (g, h, 1) for g in (2, 3) for h in (0, 1)}
    assert len(plan.problems) + len(plan.skipped) == 2 * 2 * 3
    assert [t.index for t in plan.tasks] == list(range(len(plan.tasks)))
    tasks_keys = [problem_order(t.problem) for t in plan.tasks]
    assert tasks_keys == sorted(tasks_keys)


def test_profile_of_another_degree_is_skipped_not_an_error():
    plan = plan_sweep(SweepSpec(genera=(None,), target_genera=(0,), degrees=(3, 4), profiles=("3", "3", "3")))
    assert [p.degree for p in plan.problems] == [3]
    assert [s.degree for s in plan.skipped] == [4] and "not to the degree 4" in plan.skipped[0].reason


@pytest.mark.parametrize("count", [1, 2, 3, 7])
def test_shards_partition_the_tasks(count):
    plan = plan_sweep(SweepSpec((2, 3), (1,), (2, 3)))
    pieces = [shard_tasks(plan.tasks, i, count) for i in range(1, count + 1)]
    indices = sorted(t.index for piece in pieces for t in piece)
    assert indices == list(range(len(plan.tasks)))


@pytest.mark.parametrize("text", ["0/2", "3/2", "1/0", "a/b", "2", "-1/2", "1/2/3"])
def test_bad_shards_are_input_errors(text):
    with pytest.raises(InputError, match="shard"):
        parse_shard(text)


def test_landing_agrees_with_the_catalogue():
    # the sweep streams the covers; the catalogue lists them: the tallies must agree
    problem = HurwitzProblem.build(3, 1, genus=3)
    catalogue = build_catalogue(problem, max_codim=1)
    plan = plan_sweep(SweepSpec((3,), (1,), (3,)))
    assert [t.base for t in plan.tasks] == [s.base for s in catalogue.strata]
    for task, stratum in zip(plan.tasks, catalogue.strata):
        summary = compute_task(task)
        assert summary.n_covers == len(stratum.covers)
        assert summary.total_weight == stratum.total_weight == summary.hurwitz_number
        expected = {"delta_0": Fraction(0), "delta_1": Fraction(0), "other": Fraction(0)}
        for graph, weight in stratum.by_source():
            expected[divisor_name(graph) or "other"] += weight
        assert dict(summary.landing) == expected


def test_labelled_strata_add_up_to_the_orbits():
    orbit = plan_sweep(SweepSpec((3,), (1,), (2,)))
    labeled = plan_sweep(SweepSpec((3,), (1,), (2,), labeled=True))
    assert sum(t.base.orbit_size for t in orbit.tasks) == len(labeled.tasks)
    assert {t.grouping for t in labeled.tasks} == {"labeled"}


def test_spec_rejects_negative_codimension():
    with pytest.raises(InputError, match="codimension"):
        SweepSpec((2,), (1,), (2,), codim=-1)
