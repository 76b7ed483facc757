"""Sweeps with the type engine: same tallies as the list engine, no cover
counts, kept apart in a store, and published totals at degrees the list engine
cannot reach."""

from __future__ import annotations

import json

from covertree.sweep.store import ResultStore
from covertree.sweep.tasks import SweepSpec, compute_task, plan_sweep
from tests.sweep.helpers import f2_coefficient, invoke


def _rows(*extra: str) -> list[dict]:
    result = invoke("sweep", "-g", "2,3", "-t", "1", "-d", "2..4", "-k", "1", "-f", "json", "-q", *extra)
    assert result.exit_code == 0, result.stderr
    return json.loads(result.stdout)["strata"]


def test_types_engine_gives_the_list_engine_tallies():
    listed, typed = _rows(), _rows("--engine", "types")
    assert len(listed) == len(typed) > 0
    for a, b in zip(listed, typed):
        assert b["n_covers"] is None and isinstance(a["n_covers"], int)
        a.pop("n_covers"), b.pop("n_covers")
        assert a == b


def test_spec_round_trip_keeps_the_engine():
    spec = SweepSpec((2,), (1,), (3,), engine="types")
    assert SweepSpec.from_dict(spec.to_dict()) == spec
    assert spec.grouping == "orbit+types"
    # documents written before the engine existed read as the list engine
    old = spec.to_dict()
    del old["engine"]
    assert SweepSpec.from_dict(old).engine == "list"


def test_store_keeps_engines_apart_and_reads_missing_counts_back(tmp_path):
    path = str(tmp_path / "s.sqlite")
    for engine in ("list", "types"):
        plan = plan_sweep(SweepSpec((2,), (1,), (3,), engine=engine))
        with ResultStore(path) as store:
            for task in plan.tasks:
                store.save(task, compute_task(task))
    with ResultStore(path) as store:
        counts = sorted((s.stratum, s.n_covers is None) for s in store.results())
    assert len(counts) == 6 and sum(1 for _, missing in counts if missing) == 3


def test_unknown_engine_is_refused():
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "3", "--engine", "fast")
    assert result.exit_code == 2
    assert "fast" in result.stderr and len(result.stderr.strip().splitlines()) == 1


def test_published_totals_at_degree_twelve():
    # Genus-2 covers of an elliptic curve, two simple points: every stratum's total
    # is 2 [q^12] F_2 (R. Dijkgraaf, Mirror symmetry and elliptic curves, 1995;
    # OEIS A170991), far beyond what listing covers reaches in a test.
    rows = json.loads(invoke("sweep", "-g", "2", "-t", "1", "-d", "12", "-e", "types", "-f", "json",
                             "-q").stdout)["strata"]
    assert len(rows) == 3
    assert {r["total_weight"] for r in rows} == {str(2 * f2_coefficient(12))}
