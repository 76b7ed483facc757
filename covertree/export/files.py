"""Writing output files safely (the rules every ``-o`` follows).

* A regular file (or a new name) is replaced atomically: the text goes to a
  temporary file in the same folder, which takes the place of the target only
  when complete, with the mode of the file it replaces.
* Anything else that exists (a device node, a fifo, ``/dev/stdout``) is
  written through, never replaced.
* A symbolic link is followed to an existing target; a dangling link is
  refused (it would create a file outside the requested path).
* Temporary files are named ``.NAME.covertree-partial-HOST-PID-XXXXXXXX``
  (``HOST`` the machine, ``PID`` the writing process).  They are removed when
  the write fails or is interrupted; one left behind by a killed process (of
  this machine, its PID no longer running) is removed by the next write into
  the same folder.

Examples
--------
>>> import os, tempfile
>>> folder = tempfile.mkdtemp()
>>> path = os.path.join(folder, "out.txt")
>>> with atomic_output(path) as handle:
...     _ = handle.write("done")
>>> open(path).read(), sorted(os.listdir(folder))
('done', ['out.txt'])
"""

from __future__ import annotations

import os
import re
import stat
from collections.abc import Iterator
from contextlib import contextmanager
from typing import IO

from covertree.errors import InputError

__all__ = ["atomic_output", "destination_problem", "is_leftover", "partial_prefix", "remove_leftovers", "same_file"]

_LEFTOVER = re.compile(r"^\..+\.covertree-partial-([A-Za-z0-9_]+)-(\d+)-[a-z0-9_]+$")


def _host() -> str:
    """This machine's name as it appears in temporary file names."""
    import socket  # imported when a file is written, not at start-up

    return re.sub(r"[^A-Za-z0-9]", "_", socket.gethostname())[:40] or "host"


def partial_prefix(name: str) -> str:
    """The start of the temporary file name used while writing ``name``.

    >>> partial_prefix("out.json").startswith(".out.json.covertree-partial-")
    True
    """
    return f".{name[:100]}.covertree-partial-{_host()}-{os.getpid()}-"


def destination_problem(output: str) -> str | None:
    """Why ``output`` can never be written (one phrase), or ``None``.

    >>> destination_problem("")
    'empty file name; give a path'
    """
    if output == "":
        return "empty file name; give a path"
    if "\0" in output:
        return f"{_short(output)} contains a NUL character"
    found = _stat(output)
    if found is None and os.path.islink(output):
        return f"{_short(output)} is a link to the missing {_short(os.readlink(output))}; remove the link or give another name"
    if found is not None:
        return f"{_short(output)} is a folder; give a file" if stat.S_ISDIR(found.st_mode) else None
    return _folder_problem(os.path.dirname(os.path.realpath(output)))


def _folder_problem(directory: str) -> str | None:
    if not os.path.exists(directory):
        return f"folder {_short(directory)} does not exist"
    if not os.path.isdir(directory):
        return f"{_short(directory)} is a file, not a folder"
    if not os.access(directory, os.W_OK | os.X_OK):
        return f"folder {_short(directory)} is not writable"
    return None


def _stat(path: str) -> os.stat_result | None:
    """``os.stat`` (links followed, ``/dev/stdout`` too), ``None`` if missing."""
    try:
        return os.stat(path)
    except (FileNotFoundError, NotADirectoryError):
        return None


def _short(text: str) -> str:
    return repr(text) if len(text) <= 200 else f"{text[:60]!r}... ({len(text)} characters)"


def same_file(first: str, second: str) -> bool:
    """True when the two names lead to one file (through links, hard links too).

    >>> same_file("/a/../b", "/b")
    True
    """
    try:
        return os.path.samefile(first, second)
    except OSError:
        return os.path.realpath(first) == os.path.realpath(second)


def is_leftover(name: str) -> bool:
    """True for the name of a temporary file whose writer is no longer running.

    >>> is_leftover(partial_prefix("out.json").replace(str(os.getpid()), "999999999") + "abcd1234")
    True
    >>> is_leftover("out.json")
    False
    """
    match = _LEFTOVER.match(name)
    return match is not None and match.group(1) == _host() and not _running(int(match.group(2)))


def _running(pid: int) -> bool:
    if pid == os.getpid():
        return True
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except PermissionError:
        return True
    except (OverflowError, ValueError):
        return False
    return True


def remove_leftovers(directory: str) -> list[str]:
    """Remove the temporary files of killed writers in ``directory``; returns
    their names (sorted)."""
    try:
        names = sorted(n for n in os.listdir(directory) if is_leftover(n))
    except OSError:
        return []
    for name in names:
        try:
            os.unlink(os.path.join(directory, name))
        except OSError:
            pass
    return names


def _writes_through(output: str) -> bool:
    """True when ``output`` exists and is not a regular file (a device, a
    fifo, a terminal, ``/dev/stdout``): such a target is written into."""
    found = _stat(output)
    return found is not None and not stat.S_ISREG(found.st_mode)


@contextmanager
def atomic_output(output: str, binary: bool = False) -> Iterator[IO]:
    """A stream whose content becomes ``output`` when the block succeeds
    (atomically for regular files; see the module docstring).

    Raises
    ------
    InputError
        If ``output`` can never be written (:func:`destination_problem`).
    """
    problem = destination_problem(output)
    if problem is not None:
        raise InputError(f"--output: {problem}")
    mode, encoding = ("wb", None) if binary else ("w", "utf-8")
    if _writes_through(output):
        with open(output, mode, encoding=encoding) as handle:
            yield handle
        return
    target = os.path.realpath(output)
    directory, name = os.path.split(target)
    remove_leftovers(directory)
    import tempfile  # imported when a file is written, not at start-up

    fd, tmp = tempfile.mkstemp(dir=directory, prefix=partial_prefix(name))
    try:
        with os.fdopen(fd, mode, encoding=encoding) as handle:
            yield handle
        _publish(tmp, target)
    finally:
        if os.path.exists(tmp):
            os.unlink(tmp)


def _publish(tmp: str, target: str) -> None:
    """Give ``tmp`` the mode (and, where allowed, the owner) of the file it
    replaces, or the usual mode of a new file, and move it into place in one
    step."""
    if os.path.isfile(target):
        old = os.stat(target)
        mode = old.st_mode & 0o7777
        _keep_owner(tmp, old)
    else:
        mask = os.umask(0)
        os.umask(mask)
        mode = 0o666 & ~mask
    os.chmod(tmp, mode)
    os.replace(tmp, target)


def _keep_owner(tmp: str, old: os.stat_result) -> None:
    """Give ``tmp`` the owner and group of the replaced file when permitted."""
    if (old.st_uid, old.st_gid) == (os.geteuid(), os.getegid()):
        return
    try:
        os.chown(tmp, old.st_uid, old.st_gid)
    except OSError:
        pass
