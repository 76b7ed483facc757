"""Stores that were edited by hand, damaged, opened by many processes at once,
or kept in a folder without write permission (issue 14, stores)."""

import hashlib
import multiprocessing
import os
import shutil
import sqlite3
import stat
import tempfile

import pytest

from covertree.sweep import store as store_module
from covertree.sweep.store import ResultStore, StoreError
from covertree.sweep.tasks import SweepSpec, compute_task, plan_sweep
from tests.sweep.helpers import invoke

SWEEP = ["sweep", "-g", "2", "-t", "1", "-d", "2", "-f", "csv", "-q"]


def digest(path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


def one_line(result, *words) -> str:
    assert result.exit_code == 2, result.output
    assert "Traceback" not in result.output
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    assert all(word in lines[0] for word in words), lines[0]
    assert len(lines[0]) < 400
    return lines[0]


@pytest.fixture
def store(tmp_path):
    path = tmp_path / "store.sqlite"
    assert invoke(*SWEEP, "--store", str(path)).exit_code == 0
    return path


def edit(path, column: str, value) -> None:
    with sqlite3.connect(path) as conn:
        conn.execute(f"UPDATE results SET {column} = ? WHERE position = 0", (value,))
    conn.close()


VALUES = [  # edits a sweep reads back (the columns of the result, not of its key)
    ("landing", "{bad"), ("landing", "[1, 2]"), ("landing", '{"delta_0": 0.5}'), ("landing", '{"other": 7}'),
    ("landing", '{"delta_9": "1/2"}'),
    ("landing", "[" * 100000), ("total_weight", "1/0"), ("total_weight", "12345"), ("hurwitz_number", "1/0"),
    ("hurwitz_number", "0.25"), ("hurwitz_number", "x" * 24000), ("n_covers", "many"), ("orbit_size", 2.5),
]
KEYS = [("degree", "two"), ("profiles", "2,,1"), ("stratum", 7), ("genus", 10 ** 15)]


@pytest.mark.parametrize("column, value", VALUES + KEYS)
def test_edited_rows_refused_by_export(store, column, value):
    edit(store, column, value)
    before = digest(store)
    one_line(invoke("export", "-f", "csv", "-q", "--store", str(store)), "damaged row", str(store))
    assert digest(store) == before


@pytest.mark.parametrize("column, value", VALUES)
def test_edited_rows_refused_by_a_sweep_reading_them(store, column, value):
    edit(store, column, value)
    before = digest(store)
    one_line(invoke(*SWEEP, "--store", str(store)), "damaged row", str(store))
    assert digest(store) == before


def damage_index(path) -> None:
    """Point the results' primary-key index at another index's page (rows
    still read back, PRAGMA integrity_check fails)."""
    with sqlite3.connect(path) as conn:
        conn.execute("PRAGMA writable_schema = ON")
        pages = dict(conn.execute("SELECT name, rootpage FROM sqlite_master"))
        conn.execute("UPDATE sqlite_master SET rootpage = ? WHERE name = 'sqlite_autoindex_results_1'",
                      (pages["sqlite_autoindex_meta_1"],))
    conn.close()


@pytest.mark.parametrize("command", ["export", "sweep"])
def test_store_failing_the_integrity_check_refused(store, command):
    damage_index(store)
    before = digest(store)
    args = ["export", "-f", "csv", "-q"] if command == "export" else SWEEP
    one_line(invoke(*args, "--store", str(store)), "integrity check")
    assert digest(store) == before


def test_empty_store_name_refused_by_the_library():
    with pytest.raises(StoreError, match="empty store name"):
        ResultStore("")


def test_empty_store_name_refused_on_every_command():
    one_line(invoke(*SWEEP, "--store", ""), "--store")
    one_line(invoke("export", "--store", ""), "--store")


def test_busy_steps_are_retried_and_other_errors_refuse(monkeypatch):
    attempts = []

    def locked_twice():
        attempts.append(1)
        if len(attempts) < 3:
            raise sqlite3.OperationalError("database is locked")
        return "done"

    assert store_module._while_busy(locked_twice, "s.sqlite") == "done" and len(attempts) == 3

    def broken():
        raise sqlite3.OperationalError("disk I/O error")

    with pytest.raises(StoreError, match="disk I/O error"):
        store_module._while_busy(broken, "s.sqlite")
    def always_locked():
        raise sqlite3.OperationalError("database is locked")

    monkeypatch.setattr(store_module, "BUSY_TIMEOUT", 0.05)
    with pytest.raises(StoreError, match="locked"):
        store_module._while_busy(always_locked, "s.sqlite")


PLAN = plan_sweep(SweepSpec((2,), (1,), (2,)))


def first_open(path, barrier, answers) -> None:
    barrier.wait()
    try:
        with ResultStore(path) as opened:
            opened.lookup(PLAN.tasks)
            opened.save(PLAN.tasks[0], compute_task(PLAN.tasks[0]))
        answers.put("ok")
    except Exception as error:  # reported to the test, which fails on it
        answers.put(repr(error))


# Before creation was retried, 16 processes opening one new store together
# failed with "database is locked" about once in 640 opens.
PROCESSES, ROUNDS = 12, 10


def test_many_simultaneous_first_opens_of_a_new_store():
    context = multiprocessing.get_context("fork")
    failures = []
    for _ in range(ROUNDS):
        folder = tempfile.mkdtemp()
        path = os.path.join(folder, "new.sqlite")
        barrier, answers = context.Barrier(PROCESSES), context.Queue()
        children = [context.Process(target=first_open, args=(path, barrier, answers)) for _ in range(PROCESSES)]
        for child in children:
            child.start()
        failures += [a for a in (answers.get(timeout=120) for _ in children) if a != "ok"]
        for child in children:
            child.join(30)
        with ResultStore(path, create=False) as opened:
            assert opened.count() == 1
        shutil.rmtree(folder)
    assert failures == []


def sweep_together(path, barrier, answers) -> None:
    barrier.wait()
    result = invoke(*SWEEP, "--store", path)
    answers.put((result.exit_code, result.stderr))


def test_sweeps_starting_together_on_a_new_store():
    import covertree.cli.sweep  # noqa: F401  (loaded once, before the children fork)

    context = multiprocessing.get_context("fork")
    outcomes = []
    for _ in range(4):
        folder = tempfile.mkdtemp()
        path = os.path.join(folder, "new.sqlite")
        barrier, answers = context.Barrier(8), context.Queue()
        children = [context.Process(target=sweep_together, args=(path, barrier, answers)) for _ in range(8)]
        for child in children:
            child.start()
        outcomes += [answers.get(timeout=120) for _ in children]
        for child in children:
            child.join(30)
        shutil.rmtree(folder)
    assert outcomes == [(0, "")] * 32


def read_only_export(folder: str, store: str, answers) -> None:
    """Export ``store`` as a user who cannot write ``folder`` (the nobody
    user when run as root), answering (exit code, stdout, stderr)."""
    if os.geteuid() == 0:
        os.setgid(65534)
        os.setuid(65534)
    result = invoke("export", "--store", store, "-f", "csv", "-q")
    answers.put((result.exit_code, result.stdout, result.stderr))


def test_store_in_a_read_only_folder_can_be_exported():
    import covertree.cli.sweep  # noqa: F401  (loaded before privileges are dropped)

    folder = tempfile.mkdtemp()
    path = os.path.join(folder, "store.sqlite")
    swept = invoke(*SWEEP, "--store", path)
    assert swept.exit_code == 0
    os.chmod(path, 0o644)
    os.chmod(folder, 0o555)
    try:
        context = multiprocessing.get_context("fork")
        answers = context.Queue()
        child = context.Process(target=read_only_export, args=(folder, path, answers))
        child.start()
        code, stdout, stderr = answers.get(timeout=60)
        child.join(30)
        assert (code, stderr) == (0, "") and stdout == swept.stdout
        assert sorted(os.listdir(folder)) == ["store.sqlite"]
    finally:
        os.chmod(folder, 0o755)
        shutil.rmtree(folder)


def make_store_path(folder, kind: str) -> str:
    path = os.path.join(folder, kind)
    if kind == "fifo":
        os.mkfifo(path)
    elif kind == "device":
        if os.geteuid() != 0:
            pytest.skip("mknod of a character device needs root")
        os.mknod(path, 0o666 | stat.S_IFCHR, os.makedev(1, 3))  # a null device in the test's own folder
    elif kind == "dangling":
        os.symlink(os.path.join(folder, "elsewhere.sqlite"), path)
    elif kind == "missing_folder":
        path = os.path.join(folder, "no", "s.sqlite")
    return path


@pytest.mark.parametrize("kind, words", [
    ("fifo", "not a regular file"), ("device", "not a regular file"),
    ("dangling", "link to the missing"), ("missing_folder", "does not exist"),
])
def test_stores_that_are_not_files_refused_and_nothing_created(tmp_path, kind, words):
    path = make_store_path(str(tmp_path), kind)
    before = sorted(os.listdir(tmp_path))
    one_line(invoke(*SWEEP, "--store", path), words)
    assert sorted(os.listdir(tmp_path)) == before


def test_export_of_an_empty_file_refused(tmp_path):
    path = tmp_path / "empty.sqlite"
    path.write_bytes(b"")
    one_line(invoke("export", "--store", str(path)), "is empty")
    assert path.read_bytes() == b""
