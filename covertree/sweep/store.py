"""The results store: finished sweep tasks in an SQLite file.

Every finished task is committed in its own transaction, so a sweep that is
interrupted (Ctrl-C, a killed process, a lost machine) keeps everything it
finished, and a rerun computes only the rest.  The file is in WAL mode with a
busy timeout, so several processes (shards of one sweep, or other sweeps) can
write to it at once.  Synchronous mode is ``NORMAL``: a killed process never
loses a committed task; a power cut may lose the last few, never corrupts.

Schema (``SCHEMA_VERSION``)::

    meta(key TEXT PRIMARY KEY, value TEXT)        -- schema, model_version, written_by
    results(genus, target_genus, degree, profiles TEXT, grouping TEXT, stratum TEXT,
            model_version, position, codim, orbit_size, n_covers,
            hurwitz_number TEXT, total_weight TEXT, landing TEXT,
            PRIMARY KEY (genus, target_genus, degree, profiles, grouping, stratum, model_version))

``profiles`` is ``"2,1;2,1"``; ``stratum`` the canonical notation of the base
stratum; ``grouping`` ``"orbit"`` or ``"labeled"``; weights are exact
rationals as text ``"p/q"`` and ``landing`` a JSON object of such texts.  A
store written with another schema or model version, one that fails SQLite's
``PRAGMA integrity_check`` and one with a row that does not read back (edited
by hand: ``'{bad'`` as landing, ``'1/0'`` as a weight) are refused untouched.
Processes opening a new store at the same moment (the shards of an array
job) wait for each other: creation is retried while SQLite reports the file
busy, up to ``BUSY_TIMEOUT`` seconds.  A store in a folder without write
permission can still be read (an export): it is then opened immutable.

Examples
--------
>>> import os, tempfile
>>> from covertree.sweep.tasks import SweepSpec, plan_sweep, compute_task
>>> plan = plan_sweep(SweepSpec((2,), (1,), (2,)))
>>> path = os.path.join(tempfile.mkdtemp(), "results.sqlite")
>>> with ResultStore(path) as store:
...     store.save(plan.tasks[0], compute_task(plan.tasks[0]))
...     sorted(store.lookup(plan.tasks))
[0]
>>> with ResultStore(path, create=False) as store:
...     [(s.stratum, s.n_covers, str(s.total_weight)) for s in store.results()]
[('g1{1,2}', 4, '2')]
"""

from __future__ import annotations

import json
import re
import reprlib
import os
import pathlib
import sqlite3
import time
from collections.abc import Callable, Sequence
from fractions import Fraction

from covertree import MODEL_VERSION, __version__
from covertree.errors import CovertreeError, InputError
from covertree.rational import rational_str
from covertree.hurwitz.problem import HurwitzProblem
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.sweep.tasks import StratumSummary, Task, divisor_names, problem_order
from covertree.symmetric.partitions import Partition

__all__ = ["ResultStore", "StoreError", "SCHEMA_VERSION"]

#: Version of the table layout below; a store with another one is refused.
SCHEMA_VERSION = 1

#: Seconds a writer waits for another process's transaction to finish.
BUSY_TIMEOUT = 60.0

#: Stored in ``n_covers`` for results of the type engine (no cover count).
_NO_COUNT = -1

_KEY = ("genus", "target_genus", "degree", "profiles", "grouping", "stratum", "model_version")
_DATA = ("position", "codim", "orbit_size", "n_covers", "hurwitz_number", "total_weight", "landing")

_SCHEMA = (
    "CREATE TABLE IF NOT EXISTS meta (key TEXT PRIMARY KEY, value TEXT NOT NULL)",
    f"""CREATE TABLE IF NOT EXISTS results (
    genus INTEGER NOT NULL, target_genus INTEGER NOT NULL, degree INTEGER NOT NULL,
    profiles TEXT NOT NULL, grouping TEXT NOT NULL, stratum TEXT NOT NULL,
    model_version INTEGER NOT NULL, position INTEGER NOT NULL, codim INTEGER NOT NULL,
    orbit_size INTEGER NOT NULL, n_covers INTEGER NOT NULL, hurwitz_number TEXT NOT NULL,
    total_weight TEXT NOT NULL, landing TEXT NOT NULL,
    PRIMARY KEY ({", ".join(_KEY)})
)""",
)


class StoreError(InputError):
    """The store file cannot be used (not a covertree store, or written by an
    incompatible version)."""


def profiles_text(problem: HurwitzProblem) -> str:
    """``"2,1;2,1"``: the profiles as stored.

    >>> profiles_text(HurwitzProblem.build(3, 1, genus=2))
    '2,1;2,1'
    """
    return ";".join(str(mu) for mu in problem.profiles)


def _task_key(task: Task) -> tuple:
    p = task.problem
    return (p.genus, p.target_genus, p.degree, profiles_text(p), task.grouping,
            task.base.graph.notation, MODEL_VERSION)


class ResultStore:
    """An open results store (use as a context manager).

    Parameters
    ----------
    path : str
        The SQLite file.
    create : bool
        Create the file when missing (a sweep); otherwise a missing file is an
        error (an export).

    Raises
    ------
    StoreError
        If the file is not a covertree store or was written with another
        schema or model version; the file is then left untouched.
    """

    def __init__(self, path: str, create: bool = True) -> None:
        self.path = path
        problem = _path_problem(path, create)
        if problem:
            raise StoreError(problem)
        self._conn = _connect(path, create)
        try:
            if _while_busy(lambda: _check(self._conn, path), path):
                if not create:
                    raise StoreError(f"store {path!r} is empty: not a covertree store")
                _while_busy(lambda: _initialise(self._conn, path), path)
            self._conn.execute("PRAGMA synchronous = NORMAL")
        except BaseException:
            self._conn.close()
            raise

    def __enter__(self) -> "ResultStore":
        return self

    def __exit__(self, *exc) -> bool:
        self.close()
        return False

    def close(self) -> None:
        """Close the connection (committed tasks are already on disk)."""
        self._conn.close()

    def lookup(self, tasks: Sequence[Task]) -> dict[int, StratumSummary]:
        """The stored results among ``tasks``, by task index (no write).

        A task matches a stored row with the same problem, stratum notation,
        grouping (orbits or labelled strata) and model version.
        """
        found = {}
        query = f"SELECT * FROM results WHERE {' AND '.join(k + ' = ?' for k in _KEY)}"
        for task in tasks:
            row = self._conn.execute(query, _task_key(task)).fetchone()
            if row is not None:
                found[task.index] = _summary(row, self.path)
        return found

    def save(self, task: Task, summary: StratumSummary) -> None:
        """Commit one finished task in its own transaction."""
        landing = json.dumps({name: rational_str(w) for name, w in summary.landing})
        values = (*_task_key(task), task.position, summary.codim, summary.orbit_size,
                  _NO_COUNT if summary.n_covers is None else summary.n_covers,
                  rational_str(summary.hurwitz_number),
                  rational_str(summary.total_weight), landing)
        marks = ", ".join("?" * len(values))
        with _transaction(self._conn):
            self._conn.execute(f"INSERT OR REPLACE INTO results ({', '.join(_KEY + _DATA)}) "
                               f"VALUES ({marks})", values)

    def count(self) -> int:
        """Number of stored tasks."""
        return self._conn.execute("SELECT COUNT(*) FROM results").fetchone()[0]

    def results(self) -> list[StratumSummary]:
        """Every stored result: problems in sweep order, then grouping and the
        position of the stratum."""
        rows = self._conn.execute("SELECT * FROM results WHERE model_version = ?", (MODEL_VERSION,))
        keyed = [(row["grouping"], row["position"], _summary(row, self.path)) for row in rows]
        keyed.sort(key=lambda r: (problem_order(r[2].problem), r[0], r[1]))
        return [summary for _, _, summary in keyed]


class _transaction:
    """``BEGIN IMMEDIATE`` ... ``COMMIT`` (rolled back on any exception)."""

    def __init__(self, conn: sqlite3.Connection) -> None:
        self.conn = conn

    def __enter__(self) -> None:
        self.conn.execute("BEGIN IMMEDIATE")

    def __exit__(self, kind, value, traceback) -> bool:
        self.conn.execute("COMMIT" if kind is None else "ROLLBACK")
        return False


def _path_problem(path: str, create: bool) -> str | None:
    """Why ``path`` cannot be a store (one phrase), or ``None``."""
    if path == "":
        return "empty store name; give the path of an SQLite file"
    if os.path.exists(path):
        return None if os.path.isfile(path) else f"store {path!r} is not a regular file; give an SQLite file"
    if not create:
        return f"store {path!r} does not exist"
    if os.path.islink(path):
        return f"store {path!r} is a link to the missing {os.readlink(path)!r}; remove the link or give another name"
    folder = os.path.dirname(os.path.abspath(path))
    return None if os.path.isdir(folder) else f"store {path!r}: folder {folder!r} does not exist"


def _connect(path: str, create: bool) -> sqlite3.Connection:
    try:
        if create:
            conn = sqlite3.connect(path, timeout=BUSY_TIMEOUT, isolation_level=None)
        else:
            uri = pathlib.Path(path).absolute().as_uri() + _read_only_mode(path)
            conn = sqlite3.connect(uri, uri=True, timeout=BUSY_TIMEOUT, isolation_level=None)
    except sqlite3.Error as error:
        raise StoreError(f"cannot open store {path!r}: {error}") from None
    conn.row_factory = sqlite3.Row
    return conn


def _read_only_mode(path: str) -> str:
    """URI parameters for reading ``path``: ``immutable`` when its folder is
    not writable (SQLite could not create the shared-memory file a WAL store
    needs; nobody can be writing it through a journal there either)."""
    folder = os.path.dirname(os.path.abspath(path))
    return "?mode=ro" if os.access(folder, os.W_OK | os.X_OK) else "?mode=ro&immutable=1"


def _busy(error: sqlite3.Error) -> bool:
    text = str(error)
    return isinstance(error, sqlite3.OperationalError) and ("locked" in text or "busy" in text)


def _while_busy(step: Callable[[], object], path: str):
    """Run ``step``, again after a short pause while SQLite says the file is
    busy (another process is creating or converting it), for at most
    ``BUSY_TIMEOUT`` seconds; any other SQLite error refuses the store."""
    deadline, pause = time.monotonic() + BUSY_TIMEOUT, 0.005
    while True:
        try:
            return step()
        except sqlite3.Error as error:
            if not _busy(error) or time.monotonic() > deadline:
                raise StoreError(f"cannot use store {path!r}: {error}") from None
        time.sleep(pause)
        pause = min(2 * pause, 0.25)


def _check(conn: sqlite3.Connection, path: str) -> bool:
    """Validate an existing store without writing; ``True`` if it is empty (new)."""
    try:
        tables = {r[0] for r in conn.execute("SELECT name FROM sqlite_master WHERE type = 'table'")}
    except sqlite3.DatabaseError as error:
        if _busy(error):
            raise
        raise StoreError(f"{path!r} is not a covertree store ({error})") from None
    if not tables:
        return True
    if not {"meta", "results"} <= tables:
        raise StoreError(f"{path!r} is an SQLite file but not a covertree store (no meta/results tables)")
    _check_versions(conn, path)
    _check_integrity(conn, path)
    return False


def _check_integrity(conn: sqlite3.Connection, path: str) -> None:
    """Refuse a store failing SQLite's ``PRAGMA integrity_check``."""
    try:
        verdict = conn.execute("PRAGMA integrity_check(1)").fetchone()[0]
    except sqlite3.DatabaseError as error:
        if _busy(error):
            raise
        raise StoreError(f"store {path!r} is damaged ({error}); use another --store file") from None
    if verdict != "ok":
        first = verdict.replace("\n", " ").replace("*** in database main *** ", "")
        raise StoreError(f"store {path!r} fails SQLite's integrity check ({first[:120]}); "
                         "use another --store file")


def _check_versions(conn: sqlite3.Connection, path: str) -> None:
    meta = {row[0]: row[1] for row in conn.execute("SELECT key, value FROM meta")}
    schema, model = meta.get("schema"), meta.get("model_version")
    if (schema, model) != (str(SCHEMA_VERSION), str(MODEL_VERSION)):
        raise StoreError(
            f"store {path!r} was written with store schema {schema} and model version {model} "
            f"({meta.get('written_by', 'unknown version')}); this covertree {__version__} needs "
            f"schema {SCHEMA_VERSION} and model version {MODEL_VERSION}: use another --store file"
        )


def _initialise(conn: sqlite3.Connection, path: str) -> None:
    """Create the tables in a new store (safe when two processes race)."""
    try:
        conn.execute("PRAGMA journal_mode = WAL")
        with _transaction(conn):
            for statement in _SCHEMA:
                conn.execute(statement)
            for key, value in (("schema", SCHEMA_VERSION), ("model_version", MODEL_VERSION),
                               ("written_by", f"covertree {__version__}")):
                conn.execute("INSERT OR IGNORE INTO meta (key, value) VALUES (?, ?)", (key, str(value)))
    except sqlite3.OperationalError as error:
        if _busy(error):
            raise
        raise StoreError(f"cannot write store {path!r}: {error}") from None
    _check_versions(conn, path)


_INTEGERS = ("genus", "target_genus", "degree", "position", "codim", "orbit_size", "n_covers")


def _summary(row: sqlite3.Row, path: str) -> StratumSummary:
    """The result stored in ``row``; a row that does not read back (edited by
    hand) refuses the store."""
    try:
        return _decode(row)
    except (CovertreeError, ValueError, TypeError, ZeroDivisionError, RecursionError) as error:
        raise StoreError(f"store {path!r} has a damaged row (stratum {_short(row['stratum'])}): {error}; "
                         "use another --store file or delete the row") from None


def _decode(row: sqlite3.Row) -> StratumSummary:
    bad = [k for k in _INTEGERS if type(row[k]) is not int]
    if bad:
        raise ValueError(f"{bad[0]} is {_short(row[bad[0]])}, not an integer")
    profiles = tuple(Partition.parse(t) for t in _text(row, "profiles").split(";")) if row["profiles"] else ()
    problem = HurwitzProblem(row["genus"], row["target_genus"], row["degree"], profiles)
    n_covers = None if row["n_covers"] == _NO_COUNT else row["n_covers"]
    StableCurveGraph.parse(_text(row, "stratum"))
    landing = _landing(_text(row, "landing"), [*divisor_names(problem.genus), "other"])
    summary = StratumSummary(problem, row["stratum"], row["codim"], row["orbit_size"], n_covers,
                             _rational(row["hurwitz_number"], "hurwitz_number"), landing)
    if _rational(row["total_weight"], "total_weight") != summary.total_weight:
        raise ValueError(f"total_weight {_short(row['total_weight'])} is not the sum of the landing weights")
    return summary


def _landing(text: str, names: list[str]) -> tuple:
    """The landing weights stored as ``text``, keys among ``names``."""
    try:
        landing = json.loads(text)
    except json.JSONDecodeError:
        raise ValueError(f"landing {_short(text)} is not JSON") from None
    if not isinstance(landing, dict) or not set(landing) <= set(names):
        raise ValueError(f"landing {_short(text)} is not a JSON object with keys among {', '.join(names)}")
    return tuple((name, _rational(w, "landing")) for name, w in landing.items())


def _text(row: sqlite3.Row, key: str) -> str:
    if not isinstance(row[key], str):
        raise ValueError(f"{key} is {_short(row[key])}, not text")
    return row[key]


def _rational(text, key: str) -> Fraction:
    """An exact rational written ``p/q`` (never a float)."""
    if not isinstance(text, str) or not _RATIONAL.match(text):
        raise ValueError(f"{key} {_short(text)} is not a rational p/q")
    return Fraction(text)


_RATIONAL = re.compile(r"^-?[0-9]{1,4000}(/[0-9]{1,4000})?$", re.ASCII)


def _short(value) -> str:
    """``repr`` of a stored value, at most about 40 characters.

    >>> _short("x" * 100)
    "'xxxxxxxxxxxxxxxxx...xxxxxxxxxxxxxxxxxx'"
    """
    shortened = reprlib.Repr()
    shortened.maxstring = shortened.maxother = 40
    return shortened.repr(value)
