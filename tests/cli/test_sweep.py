"""The ``covertree sweep``, ``merge`` and ``export`` commands through click's CliRunner."""

import csv
import hashlib
import io
import json
import os
import pty
import socket
import sqlite3
import subprocess
import sys
from fractions import Fraction

import pytest

from covertree.sweep import cluster
from tests.sweep.helpers import COVERTREE, invoke

SWEEP = ["sweep", "-g", "2..3", "-t", "1", "-d", "2..3"]


@pytest.fixture(scope="module")
def serial_json() -> str:
    result = invoke(*SWEEP, "-f", "json", "-q")
    assert result.exit_code == 0, result.stderr
    return result.stdout


def one_line_error(result, *words) -> None:
    assert result.exit_code == 2, (result.stdout, result.stderr)
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("covertree: error:"), result.stderr
    assert "Traceback" not in result.stderr and result.stdout == ""
    for word in words:
        assert word in lines[0]


def test_json_rows_and_summary(serial_json):
    doc = json.loads(serial_json)
    assert doc["sweep"]["genus"] == [2, 3] and doc["sweep"]["degree"] == [2, 3]
    rows = doc["strata"]
    # problems in lexicographic order of (genus, target genus, degree)
    assert [(r["genus"], r["degree"]) for r in rows] == sorted((r["genus"], r["degree"]) for r in rows)
    for row in rows:
        assert row["identity"] and row["total_weight"] == row["hurwitz_number"]
        names = list(row["landing"])
        assert names == ["delta_0", "delta_1", "other"]
    assert doc["summary"] == {"problems": 4, "skipped": 0, "strata": len(rows),
                              "covers": sum(r["n_covers"] for r in rows), "failures": 0}


@pytest.mark.parametrize("fmt", ["json", "csv"])
def test_process_pool_output_is_byte_identical(fmt, serial_json):
    serial = invoke(*SWEEP, "-f", fmt, "-q").stdout
    pooled = invoke(*SWEEP, "-f", fmt, "-q", "-j", "2")
    assert pooled.exit_code == 0 and pooled.stdout == serial
    if fmt == "json":
        assert serial == serial_json


def shard_files(directory, args, count):
    directory.mkdir(exist_ok=True)
    files = []
    for i in range(1, count + 1):
        path = directory / f"shard{i}.json"
        result = invoke(*args, "-f", "json", "-q", "--shard", f"{i}/{count}", "-o", str(path))
        assert result.exit_code == 0, result.stderr
        files.append(str(path))
    return files


def test_shards_merged_equal_one_run(tmp_path, serial_json):
    files = shard_files(tmp_path, SWEEP, 3)
    first = json.loads(open(files[0]).read())
    assert first["shard"]["count"] == 3 and first["task_indices"] == list(range(0, first["shard"]["tasks"], 3))
    merged = invoke("merge", *reversed(files), "-f", "json", "-q")
    assert merged.exit_code == 0 and merged.stdout == serial_json
    as_csv = invoke("merge", *files, "-f", "csv", "-q")
    assert as_csv.stdout == invoke(*SWEEP, "-f", "csv", "-q").stdout


def test_merge_rejects_bad_shard_sets(tmp_path):
    files = shard_files(tmp_path, SWEEP, 3)
    other = shard_files(tmp_path / "other", SWEEP[:-1] + ["2"], 3)
    whole = tmp_path / "whole.json"
    whole.write_text(invoke(*SWEEP, "-f", "json", "-q").stdout)
    junk = tmp_path / "junk.json"
    junk.write_text("{not json")
    out = tmp_path / "merged.json"
    cases = [
        ([files[0], files[1], files[1], files[2]], "given twice"),
        ([files[0], files[2]], "2/3 missing"),
        ([other[0], files[1], files[2]], "different sweeps"),
        ([str(whole)], "not a shard output"),
        ([str(junk)], "not JSON"),
    ]
    for paths, words in cases:
        one_line_error(invoke("merge", *paths, "-o", str(out)), words)
        assert not out.exists()
    different_count = shard_files(tmp_path / "halves", SWEEP, 2)
    one_line_error(invoke("merge", files[0], files[1], different_count[1]), "different sweeps")


def digest(path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


@pytest.fixture
def store(tmp_path):
    path = tmp_path / "store.sqlite"
    assert invoke("sweep", "-g", "2", "-t", "1", "-d", "2", "--store", str(path), "-q").exit_code == 0
    return path


@pytest.mark.parametrize("args, words", [
    (["-d", "2..x"], ["'2..x'", "a..b"]),
    (["-d", "5..2"], ["'5..2'", "empty"]),
    (["-g", "two"], ["'two'", "integer"]),
    (["-t", "1,,2"], ["range", "list"]),
    (["-d", "0..3"], ["--degree 0", ">= 1"]),
    (["-g", "-1..2"], ["--genus -1", ">= 0"]),
    (["--shard", "0/2"], ["'0/2'", "1 <= I <= N"]),
    (["--shard", "3/2"], ["'3/2'", "1 <= I <= N"]),
    (["--shard", "1of2"], ["'1of2'", "I/N"]),
    (["-j", "0"], ["--jobs", "0"]),
    (["-j", "2", "--dask", "tcp://127.0.0.1:1"], ["--jobs", "--dask"]),
    (["-f", "xml"], ["'xml'", "table"]),
])
def test_bad_input_one_line_exit_2_store_untouched(tmp_path, store, args, words):
    base = {"-g": "2", "-t": "1", "-d": "2..3"}
    for flag in args[::2]:
        base.pop(flag, None)
    fresh = tmp_path / "fresh.sqlite"
    output = tmp_path / "out.txt"
    for path in (store, fresh):
        before = digest(store)
        result = invoke("sweep", *[x for kv in base.items() for x in kv], *args,
                        "--store", str(path), "-o", str(output))
        one_line_error(result, *words)
        assert digest(store) == before and not fresh.exists() and not output.exists()


def test_missing_dask_extra(monkeypatch, store):
    monkeypatch.setitem(sys.modules, "distributed", None)  # import distributed -> ImportError
    before = digest(store)
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "2..3", "--dask", "tcp://127.0.0.1:8786",
                    "--store", str(store))
    one_line_error(result, "covertree[dask]")
    assert digest(store) == before


def free_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


def test_unreachable_scheduler(monkeypatch, store):
    pytest.importorskip("distributed")
    monkeypatch.setattr(cluster, "CONNECT_TIMEOUT", 1.0)
    before = digest(store)
    address = f"tcp://127.0.0.1:{free_port()}"
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "2..3", "--dask", address, "--store", str(store))
    one_line_error(result, address, "cannot reach")
    assert digest(store) == before


def test_dask_local_cluster_gives_the_serial_output(serial_json):
    distributed = pytest.importorskip("distributed")
    with distributed.LocalCluster(n_workers=1, threads_per_worker=2, processes=False,
                                  dashboard_address=None) as local:
        result = invoke(*SWEEP, "-f", "json", "-q", "--dask", local.scheduler_address)
    assert result.exit_code == 0, result.stderr
    assert result.stdout == serial_json


def test_export_prints_the_store_in_every_format(tmp_path):
    path = tmp_path / "s.sqlite"
    first = invoke(*SWEEP, "--store", str(path), "-f", "json")
    assert "0 found in the store" in first.stderr
    for fmt in ("csv", "table", "latex"):
        swept = invoke(*SWEEP, "--store", str(path), "-f", fmt)
        assert swept.exit_code == 0 and "0 computed" in swept.stderr
        exported = invoke("export", "--store", str(path), "-f", fmt, "-q")
        assert exported.exit_code == 0 and exported.stdout == swept.stdout
    doc = json.loads(invoke("export", "--store", str(path), "-f", "json").stdout)
    swept = json.loads(first.stdout)
    assert "sweep" not in doc and doc["strata"] == swept["strata"] and doc["summary"] == swept["summary"]


def test_failed_identity_is_loud_and_exits_1(tmp_path, store):
    with sqlite3.connect(store) as conn:
        landing = json.loads(conn.execute("SELECT landing FROM results WHERE position = 0").fetchone()[0])
        landing["other"] = "12345"
        total = sum(Fraction(w) for w in landing.values())  # the row stays self-consistent
        conn.execute("UPDATE results SET landing = ?, total_weight = ? WHERE position = 0",
                     (json.dumps(landing), str(total)))
    conn.close()
    for args in (["export", "--store", str(store), "-f", "csv"],
                 ["sweep", "-g", "2", "-t", "1", "-d", "2", "--store", str(store), "-f", "csv", "-q"]):
        result = invoke(*args)
        assert result.exit_code == 1
        assert "BUG: the degeneration identity FAILS" in result.stderr and "g1{1,2}" in result.stderr
        rows = list(csv.DictReader(io.StringIO(result.stdout)))  # everything still written
        assert [r["identity"] for r in rows] == ["false", "true", "true"]


def test_skipped_problems_and_summary_placement():
    table = invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2")
    assert table.exit_code == 0
    assert "1 problem (1 skipped), 3 strata, 11 covers" in table.stdout
    assert "impossible in degree 1" in table.stdout
    as_csv = invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2", "-f", "csv")
    assert "1 problem (1 skipped)" in as_csv.stderr and "skipped" not in as_csv.stdout
    assert len(list(csv.reader(io.StringIO(as_csv.stdout)))) == 4
    doc = json.loads(invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2", "-f", "json", "-q").stdout)
    assert doc["skipped"][0]["degree"] == 1 and doc["summary"]["skipped"] == 1
    latex = invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2", "-f", "latex", "-q").stdout
    assert r"\begin{longtable}" in latex and "1 problem (1 skipped)" in latex
    quiet = invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2", "-f", "csv", "-q")
    assert quiet.stderr == "" and quiet.stdout == as_csv.stdout


def run_on_terminal(*args):
    """Run covertree with stderr on a pseudo-terminal; return (stdout, stderr text)."""
    master, slave = pty.openpty()
    child = subprocess.Popen([*COVERTREE, *args], stdout=subprocess.PIPE, stderr=slave)
    os.close(slave)
    chunks = []
    while True:
        try:
            chunk = os.read(master, 65536)
        except OSError:
            break
        if not chunk:
            break
        chunks.append(chunk)
    stdout = child.communicate(timeout=60)[0]
    os.close(master)
    return stdout.decode(), b"".join(chunks).decode(errors="replace")


def test_progress_only_on_a_terminal_and_never_on_stdout():
    args = ["sweep", "-g", "2", "-t", "1", "-d", "2..4", "-f", "json"]
    stdout, stderr = run_on_terminal(*args)
    assert json.loads(stdout)["summary"]["strata"] == 9
    assert "tasks/s" in stderr and "9 tasks: 9 computed" in stderr
    stdout, stderr = run_on_terminal(*args, "--quiet")
    assert json.loads(stdout)["summary"]["strata"] == 9 and stderr == ""
