"""Interrupted sweeps (Ctrl-C, a killed process) resume from the store: the
final output equals an uninterrupted run, the store stays sound, and finished
tasks are not recomputed."""

import signal
import sqlite3
import time

import pytest

from tests.sweep.helpers import invoke, spawn

# 15 tasks: genus 3 over an elliptic curve, degrees 2..4 (5 strata each).  The
# degree-4 tasks are the slow ones (about half a second each): a serial run does
# them last, so it is interrupted after 11 tasks; a pool hands out the largest
# tasks first, so it is interrupted after 2, while degree-4 tasks remain.
ARGS = ["sweep", "-g", "3", "-t", "1", "-d", "2..4", "-f", "json"]
TASKS = 15
AFTER_SERIAL = 11
AFTER_POOL = 2


@pytest.fixture(scope="module")
def reference() -> str:
    result = invoke(*ARGS, "-q")
    assert result.exit_code == 0
    return result.stdout


def stored(path) -> int:
    if not path.exists():
        return 0
    conn = sqlite3.connect(f"file:{path}?mode=ro", uri=True, timeout=5)
    try:
        return conn.execute("SELECT COUNT(*) FROM results").fetchone()[0]
    except sqlite3.Error:
        return 0
    finally:
        conn.close()


def interrupt(path, sig, after, *extra) -> tuple[int, int, str]:
    """Start a sweep writing to ``path``, send ``sig`` once ``after`` tasks are
    committed; return how many tasks the store then holds, the exit status
    and stderr."""
    # a child of a background shell would inherit SIGINT ignored: restore it
    restore = (lambda: signal.signal(signal.SIGINT, signal.SIG_DFL)) if sig == signal.SIGINT else None
    child = spawn(*ARGS, "--store", str(path), *extra, preexec_fn=restore)
    deadline = time.monotonic() + 120
    while stored(path) < after:
        assert child.poll() is None, child.communicate()
        assert time.monotonic() < deadline
        time.sleep(0.01)
    child.send_signal(sig)
    started = time.monotonic()
    stderr = child.communicate(timeout=60)[1]
    assert child.returncode != 0
    assert time.monotonic() - started < 10  # stopped at once, not after the remaining tasks
    return stored(path), child.returncode, stderr


def check_resumed(path, kept: int, reference: str, after: int) -> None:
    assert after <= kept < TASKS
    with sqlite3.connect(path) as conn:
        assert conn.execute("PRAGMA integrity_check").fetchone()[0] == "ok"
    conn.close()
    rerun = invoke(*ARGS, "--store", str(path), "-j", "2")
    assert rerun.exit_code == 0, rerun.stderr
    assert rerun.stdout == reference
    assert f"{TASKS} tasks: {TASKS - kept} computed, {kept} found in the store" in rerun.stderr


def test_ctrl_c_on_a_process_pool(tmp_path, reference):
    path = tmp_path / "results.sqlite"
    output = tmp_path / "out.json"
    kept, status, stderr = interrupt(path, signal.SIGINT, AFTER_POOL, "-j", "2", "-o", str(output))
    assert status == 130 and stderr.count("\n") == 1 and "safely in the store" in stderr
    assert not output.exists()  # no partial output file
    assert [p.name for p in tmp_path.iterdir() if ".covertree-" in p.name] == []
    check_resumed(path, kept, reference, AFTER_POOL)


def test_killed_serial_run(tmp_path, reference):
    path = tmp_path / "results.sqlite"
    kept = interrupt(path, signal.SIGKILL, AFTER_SERIAL)[0]
    check_resumed(path, kept, reference, AFTER_SERIAL)


def test_terminated_process_pool_says_what_is_kept(tmp_path, reference):
    path = tmp_path / "results.sqlite"
    kept, status, stderr = interrupt(path, signal.SIGTERM, AFTER_POOL, "-j", "2")
    assert status == 143 and stderr.count("\n") == 1 and f"of {TASKS} tasks are safely in the store" in stderr
    check_resumed(path, kept, reference, AFTER_POOL)
