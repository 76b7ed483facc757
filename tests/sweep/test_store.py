"""The SQLite results store: round trip, refusal of foreign or incompatible
files (left untouched), concurrent writers."""

import hashlib
import sqlite3

import pytest

from covertree import MODEL_VERSION
from covertree.sweep.runner import SerialBackend, run_tasks
from covertree.sweep.store import ResultStore, StoreError
from covertree.sweep.tasks import SweepSpec, plan_sweep
from tests.sweep.helpers import invoke, spawn


def digest(path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


@pytest.fixture(scope="module")
def plan():
    return plan_sweep(SweepSpec((2,), (1,), (2, 3, 4)))


def test_round_trip_and_rerun_skips_stored_tasks(tmp_path, plan):
    path = str(tmp_path / "r.sqlite")
    with ResultStore(path) as store:
        first = run_tasks(plan.tasks[:4], SerialBackend(), store)
    with ResultStore(path) as store:
        again = run_tasks(plan.tasks, SerialBackend(), store)
        assert (again.computed, again.stored) == (len(plan.tasks) - 4, 4)
        assert store.results() == list(again.results)
    assert again.results[:4] == first.results
    assert again.results == run_tasks(plan.tasks, SerialBackend()).results
    with sqlite3.connect(path) as conn:
        assert conn.execute("PRAGMA journal_mode").fetchone()[0] == "wal"
        weights = conn.execute("SELECT total_weight, typeof(total_weight) FROM results").fetchall()
    # exact rationals stored as text, never as floats
    assert {t for _, t in weights} == {"text"}


def test_labelled_and_orbit_runs_are_kept_apart(tmp_path):
    path = str(tmp_path / "r.sqlite")
    orbit = plan_sweep(SweepSpec((3,), (1,), (2,)))
    labeled = plan_sweep(SweepSpec((3,), (1,), (2,), labeled=True))
    with ResultStore(path) as store:
        run_tasks(orbit.tasks, SerialBackend(), store)
        outcome = run_tasks(labeled.tasks, SerialBackend(), store)
        assert outcome.stored == 0 and {r.orbit_size for r in outcome.results} == {1}
        assert store.count() == len(orbit.tasks) + len(labeled.tasks)


def _tamper(path, key, value):
    with sqlite3.connect(path) as conn:
        conn.execute("UPDATE meta SET value = ? WHERE key = ?", (value, key))
    conn.close()


@pytest.mark.parametrize("key", ["model_version", "schema"])
def test_incompatible_store_is_refused_untouched(tmp_path, plan, key):
    path = tmp_path / "old.sqlite"
    with ResultStore(str(path)) as store:
        run_tasks(plan.tasks[:2], SerialBackend(), store)
    _tamper(path, key, str(MODEL_VERSION + 99))
    before = digest(path)
    with pytest.raises(StoreError, match=f"{MODEL_VERSION + 99}"):
        ResultStore(str(path))
    for command in (["sweep", "-g", "2", "-t", "1", "-d", "2", "--store", str(path)],
                    ["export", "--store", str(path)]):
        result = invoke(*command)
        assert result.exit_code == 2
        lines = result.stderr.strip().splitlines()
        assert len(lines) == 1 and "another --store file" in lines[0] and result.stdout == ""
    assert digest(path) == before


def test_foreign_files_are_refused_untouched(tmp_path):
    text = tmp_path / "notes.sqlite"
    text.write_text("not a database at all, just some notes\n" * 50)
    other = tmp_path / "other.sqlite"
    with sqlite3.connect(other) as conn:
        conn.execute("CREATE TABLE t (x)")
    conn.close()
    for path in (text, other):
        before = digest(path)
        result = invoke("sweep", "-g", "2", "-t", "1", "-d", "2", "--store", str(path), "-q")
        assert result.exit_code == 2 and "not a covertree store" in result.stderr
        assert len(result.stderr.strip().splitlines()) == 1
        assert digest(path) == before


def test_export_of_a_missing_store_creates_nothing(tmp_path):
    path = tmp_path / "missing.sqlite"
    result = invoke("export", "--store", str(path))
    assert result.exit_code == 2 and "does not exist" in result.stderr
    assert not path.exists()


def test_two_processes_writing_one_store(tmp_path):
    # many small tasks (labelled strata up to codimension 2) so that the two
    # writers commit often and contend for the lock
    path = tmp_path / "shared.sqlite"
    args = ["sweep", "-g", "2..3", "-t", "1", "-d", "2..3", "-k", "2", "-l", "-f", "csv", "-q"]
    children = [spawn(*args, "--shard", f"{i}/2", "--store", str(path)) for i in (1, 2)]
    outputs = [child.communicate(timeout=120) for child in children]
    assert [child.returncode for child in children] == [0, 0], outputs
    with sqlite3.connect(path) as conn:
        assert conn.execute("PRAGMA integrity_check").fetchone()[0] == "ok"
    conn.close()
    whole = invoke(*args)
    assert whole.exit_code == 0
    exported = invoke("export", "--store", str(path), "-f", "csv", "-q")
    assert exported.stdout == whole.stdout
    rerun = invoke(*args[:-1], "--store", str(path))
    assert rerun.stdout == whole.stdout
    total = len(whole.stdout.splitlines()) - 1
    assert f"{total} tasks: 0 computed, {total} found in the store" in rerun.stderr
