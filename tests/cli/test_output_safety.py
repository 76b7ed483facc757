"""Output-file safety of ``-o``: non-regular targets are written through and
never replaced, links are followed, modes kept, bad destinations refused
before any computing (issue 14, files)."""

import os
import stat
import threading

import pytest
from click.testing import CliRunner

from covertree.cli import main

COUNT = ["count", "-g", "0", "-t", "0", "-d", "3", "-p", "3", "-f", "json"]


def run(*args):
    return CliRunner().invoke(main, [*COUNT, *args])


def test_mode_of_a_private_file_is_kept(tmp_path):
    target = tmp_path / "out.json"
    target.write_text("old")
    os.chmod(target, 0o600)
    result = run("-o", str(target))
    assert result.exit_code == 0, result.output
    assert stat.S_IMODE(os.stat(target).st_mode) == 0o600
    assert '"connected"' in target.read_text()


def test_symlink_is_followed_not_replaced(tmp_path):
    real = tmp_path / "real.json"
    real.write_text("old")
    link = tmp_path / "link.json"
    link.symlink_to(real)
    assert run("-o", str(link)).exit_code == 0
    assert link.is_symlink()
    assert '"connected"' in real.read_text()


def test_fifo_is_written_through_not_replaced(tmp_path):
    fifo = tmp_path / "pipe"
    os.mkfifo(fifo)
    received = []
    reader = threading.Thread(target=lambda: received.append(open(fifo).read()))
    reader.start()
    result = run("-o", str(fifo))
    reader.join(10)
    assert result.exit_code == 0, result.output
    assert stat.S_ISFIFO(os.lstat(fifo).st_mode)
    assert '"connected"' in received[0]


@pytest.mark.skipif(os.geteuid() != 0, reason="mknod of a character device needs root")
def test_device_node_in_a_temporary_folder_is_not_replaced(tmp_path):
    node = tmp_path / "null"
    os.mknod(node, 0o666 | stat.S_IFCHR, os.makedev(1, 3))
    assert run("-o", str(node)).exit_code == 0
    assert stat.S_ISCHR(os.lstat(node).st_mode)


@pytest.mark.parametrize("make", ["empty", "missing", "file_as_folder", "folder"])
def test_bad_destinations_refused_in_one_line(tmp_path, make):
    plain = tmp_path / "plain"
    plain.write_text("x")
    output = {"empty": "", "missing": str(tmp_path / "no" / "out"),
              "file_as_folder": str(plain / "out"), "folder": str(tmp_path)}[make]
    result = run("-o", output)
    assert result.exit_code == 2
    assert len(result.stderr.strip().splitlines()) == 1
    assert "Traceback" not in result.output
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plain"]


def test_a_link_to_this_process_pipe_is_written_through(tmp_path):
    # like -o /dev/stdout: the link resolves to a magic /proc entry that no
    # path lookup of its text finds, so only following it reaches the pipe
    read_end, write_end = os.pipe()
    link = tmp_path / "out"
    link.symlink_to(f"/proc/{os.getpid()}/fd/{write_end}")
    try:
        result = run("-o", str(link))
        os.close(write_end)
        received = os.read(read_end, 1 << 20).decode()
    finally:
        os.close(read_end)
    assert result.exit_code == 0, result.output
    assert '"connected"' in received and link.is_symlink()
    assert sorted(p.name for p in tmp_path.iterdir()) == ["out"]


def test_a_file_used_as_a_folder_is_named_as_such(tmp_path):
    plain = tmp_path / "plain"
    plain.write_text("x")
    result = run("-o", str(plain / "out.json"))
    assert result.exit_code == 2 and "is a file, not a folder" in result.stderr
