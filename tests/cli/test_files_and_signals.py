"""Output files against the store, drawings, temporary files and signals
(issue 14, files; concurrency and signals)."""

import multiprocessing
import os
import shutil
import signal
import stat
import subprocess
import sys
import tempfile
import threading
import time

import pytest
from click.testing import CliRunner

from covertree.cli import main
from covertree.export.files import is_leftover, partial_prefix, remove_leftovers

SWEEP = ["sweep", "-g", "2", "-t", "1", "-d", "2", "-f", "json", "-q"]
COUNT = ["count", "-g", "0", "-t", "0", "-d", "3", "-p", "3", "-f", "json"]


def invoke(*args):
    return CliRunner().invoke(main, list(args))


def refused(result) -> str:
    assert result.exit_code == 2, result.output
    assert "Traceback" not in result.output
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1
    return lines[0]


@pytest.fixture
def store(tmp_path):
    path = tmp_path / "results.sqlite"
    assert invoke(*SWEEP, "--store", str(path)).exit_code == 0
    return path


@pytest.mark.parametrize("how", ["same", "symlink", "hardlink", "dotted"])
@pytest.mark.parametrize("command", ["sweep", "export"])
def test_output_onto_the_store_refused(tmp_path, store, how, command):
    before = store.read_bytes()
    output = {"same": store, "dotted": tmp_path / "." / store.name,
              "symlink": tmp_path / "link", "hardlink": tmp_path / "hard"}[how]
    if how == "symlink":
        output.symlink_to(store)
    if how == "hardlink":
        os.link(store, output)
    args = SWEEP if command == "sweep" else ["export", "-f", "json", "-q"]
    line = refused(invoke(*args, "--store", str(store), "-o", str(output)))
    assert "--store" in line
    assert store.read_bytes() == before


def test_empty_store_name_refused():
    assert "--store" in refused(invoke(*SWEEP, "--store", ""))


def test_output_through_a_dangling_link_refused(tmp_path):
    link = tmp_path / "out.json"
    link.symlink_to(tmp_path / "elsewhere" / "x.json")
    line = refused(invoke(*COUNT, "-o", str(link)))
    assert "missing" in line
    assert sorted(p.name for p in tmp_path.iterdir()) == ["out.json"]


def test_draw_refuses_a_dangling_link_and_writes_nothing(tmp_path):
    link = tmp_path / "g.svg"
    outside = tmp_path / "outside.svg"
    link.symlink_to(outside)
    refused(invoke("draw", "g1", "-o", str(link)))
    assert not outside.exists()


def test_draw_replaces_atomically_keeping_the_mode(tmp_path):
    pytest.importorskip("matplotlib")
    target = tmp_path / "g.svg"
    target.write_text("old")
    os.chmod(target, 0o600)
    assert invoke("draw", "g0, g1 | 0-1", "-o", str(target)).exit_code == 0
    assert b"<svg" in target.read_bytes()[:2000]
    assert stat.S_IMODE(os.stat(target).st_mode) == 0o600
    assert sorted(p.name for p in tmp_path.iterdir()) == ["g.svg"]


def test_draw_follows_a_link_to_an_existing_file(tmp_path):
    pytest.importorskip("matplotlib")
    real = tmp_path / "real.svg"
    real.write_text("old")
    link = tmp_path / "link.svg"
    link.symlink_to(real)
    assert invoke("draw", "g2", "-o", str(link)).exit_code == 0
    assert link.is_symlink() and b"<svg" in real.read_bytes()[:2000]


def test_leftovers_of_a_killed_writer_are_removed_by_the_next_run(tmp_path):
    ours = partial_prefix("out.json")
    dead = tmp_path / (ours.replace(f"-{os.getpid()}-", "-999999999-") + "abcd_123")
    alive = tmp_path / (ours.replace(f"-{os.getpid()}-", f"-{os.getppid()}-") + "abcd_123")
    elsewhere = tmp_path / ".out.json.covertree-partial-otherhost-999999999-abcd_123"
    other = tmp_path / ".notes.tmp"
    for path in (dead, alive, elsewhere, other):
        path.write_text("partial")
    assert is_leftover(dead.name)
    assert not any(is_leftover(p.name) for p in (alive, elsewhere, other))
    assert invoke(*COUNT, "-o", str(tmp_path / "out.json")).exit_code == 0
    kept = [alive.name, elsewhere.name, other.name, "out.json"]
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted(kept)
    assert remove_leftovers(str(tmp_path)) == []


# A catalogue written as JSON lines as it is found, long enough to be interrupted
# (no cover limit: with the default one a fast engine could stop first).
SLOW = ["catalogue", "-g", "2", "-t", "0", "-d", "4", "-k", "2", "-f", "jsonl", "-m", str(10**9)]


def temporaries(folder):
    return [p for p in folder.iterdir() if ".covertree-partial-" in p.name]


def signal_when(ready, sig, done: threading.Event) -> threading.Thread:
    """Send ``sig`` to this process (its main thread runs the command) once
    ``ready()`` holds, and again every 2 s while it still holds and ``done`` is
    not set: Python swallows an exception raised in a weak-reference or
    collector callback, so a signal landing in one is lost and the command would
    run to its end (seen under load)."""
    def watch():
        deadline = time.monotonic() + 60
        while not ready() and time.monotonic() < deadline:
            time.sleep(0.01)
        while True:
            os.kill(os.getpid(), sig)
            if done.wait(2.0) or not ready():
                return

    thread = threading.Thread(target=watch, daemon=True)
    thread.start()
    return thread


@pytest.mark.parametrize("sig", [signal.SIGTERM, signal.SIGHUP, signal.SIGINT])
def test_signal_during_output_removes_the_temporary_file(tmp_path, sig):
    output = tmp_path / "covers.jsonl"
    done = threading.Event()
    watcher = signal_when(lambda: temporaries(tmp_path), sig, done)
    result = invoke(*SLOW, "-o", str(output))
    done.set()
    watcher.join()
    assert result.exit_code == 128 + sig, result.output
    assert result.stderr.count("\n") == 1 and f"interrupted by {signal.Signals(sig).name}" in result.stderr
    assert temporaries(tmp_path) == [] and not output.exists()


def test_sweep_checks_the_destination_before_computing(tmp_path):
    store = tmp_path / "s.sqlite"
    line = refused(invoke(*SWEEP, "--store", str(store), "-o", str(tmp_path / "no" / "out.json")))
    assert "does not exist" in line and not store.exists()  # refused before the store was even made


def as_nobody(task, *args):
    """Run ``task(*args)`` in a child process without the right to write
    anywhere but where everyone may (the nobody user when run as root);
    returns what it answered."""
    import covertree.cli.count  # noqa: F401  (loaded before privileges are dropped)

    def child(answers):
        if os.geteuid() == 0:
            os.setgid(65534)
            os.setuid(65534)
        answers.put(task(*args))

    context = multiprocessing.get_context("fork")
    answers = context.Queue()
    process = context.Process(target=child, args=(answers,))
    process.start()
    answer = answers.get(timeout=60)
    process.join(30)
    return answer


def count_into(path):
    result = invoke(*COUNT, "-o", path)
    return result.exit_code, result.stderr


def test_output_into_a_read_only_folder_refused_in_one_line():
    folder = tempfile.mkdtemp()
    os.chmod(folder, 0o555)
    try:
        status, stderr = as_nobody(count_into, os.path.join(folder, "out.json"))
        assert (status, stderr.count("\n")) == (2, 1) and "not writable" in stderr
        assert os.listdir(folder) == []
    finally:
        os.chmod(folder, 0o755)
        shutil.rmtree(folder)


def test_leftover_of_a_killed_writer_is_recognised_and_cleaned(tmp_path):
    output = tmp_path / "covers.jsonl"
    child = subprocess.Popen([sys.executable, "-c", "from covertree.cli import main; main()", *SLOW,
                              "-o", str(output)], stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    deadline = time.monotonic() + 60
    while not temporaries(tmp_path) and time.monotonic() < deadline:
        time.sleep(0.02)
    child.kill()
    child.wait(30)
    left = temporaries(tmp_path)
    assert len(left) == 1 and is_leftover(left[0].name) and not output.exists()
    assert left[0].name.startswith(".covers.jsonl.covertree-partial-")
    assert invoke(*COUNT, "-o", str(tmp_path / "other.json")).exit_code == 0
    assert temporaries(tmp_path) == []


def test_termination_is_delivered_again_when_the_first_is_swallowed():
    # as when SIGTERM lands in a weak-reference or collector callback
    from covertree.cli.interrupts import Terminated, signals_interrupt

    before = signal.getsignal(signal.SIGTERM)
    swallowed, start = 0, time.monotonic()
    with pytest.raises(Terminated):
        with signals_interrupt():
            try:
                os.kill(os.getpid(), signal.SIGTERM)
                while time.monotonic() - start < 30:
                    pass
            except Terminated:
                swallowed += 1
            while time.monotonic() - start < 30:
                pass
    assert swallowed == 1 and time.monotonic() - start < 10
    assert signal.getsignal(signal.SIGTERM) is before
