"""Shared click parameter types and output helpers for the commands."""

from __future__ import annotations

import os
import re
import sys
import tempfile

import click

from covertree.errors import InputError, ProfileError
from covertree.symmetric.partitions import Partition

_RANGE = re.compile(r"^\s*(-?[0-9]+)\s*\.\.\s*(-?[0-9]+)\s*$", re.ASCII)
_INTEGER = re.compile(r"^\s*-?[0-9]+\s*$", re.ASCII)

#: Longest integer accepted in a range (digits), far beyond anything feasible.
MAX_INTEGER_DIGITS = 18
#: Most values one range option may expand to (a sweep over more is refused).
MAX_RANGE_VALUES = 100_000


def quote_window(text: str, width: int = 40) -> str:
    """``repr`` of ``text``, shortened to a window of ``width`` characters.

    Examples
    --------
    >>> quote_window("1" * 100, 10)
    "'1111111111'... (100 characters)"
    """
    if len(text) <= width:
        return repr(text)
    return f"{text[:width]!r}... ({len(text)} characters)"


def check_range_size(lo: int, hi: int) -> str | None:
    """Why the range ``lo..hi`` is refused (too many values), or ``None``."""
    if hi - lo + 1 > MAX_RANGE_VALUES:
        return f"range {lo}..{hi} has {hi - lo + 1} values; at most {MAX_RANGE_VALUES} allowed"
    return None


def _bounded_int(token: str) -> int | None:
    """The integer written by ``token`` (ASCII digits, at most
    ``MAX_INTEGER_DIGITS``), or ``None``."""
    if len(token.strip().lstrip("-")) > MAX_INTEGER_DIGITS:
        return None
    return int(token)


class ProfileType(click.ParamType):
    """A profile ``3,1`` or ``2,1^3`` (one branch point)."""

    name = "profile"

    def convert(self, value, param, ctx):
        if isinstance(value, Partition):
            return value
        try:
            return Partition.parse(value)
        except ProfileError as error:
            self.fail(str(error), param, ctx)


class IntRangeList(click.ParamType):
    """``4``, ``2..6`` or ``2,3,5`` (or a mix ``2..4,7``): a sorted list of ints."""

    name = "range"

    def convert(self, value, param, ctx):
        if isinstance(value, list):
            return value
        out: set[int] = set()
        for token in str(value).split(","):
            m = _RANGE.match(token)
            ends = [_bounded_int(m.group(1)), _bounded_int(m.group(2))] if m else []
            if m and None not in ends:
                lo, hi = ends
                if lo > hi:
                    self.fail(f"range {quote_window(token.strip())} is empty (write low..high)", param, ctx)
                too_big = check_range_size(lo, hi)
                if too_big:
                    self.fail(too_big, param, ctx)
                out.update(range(lo, hi + 1))
            elif _INTEGER.match(token) and _bounded_int(token) is not None:
                out.add(int(token))
            else:
                self.fail(
                    f"{quote_window(token.strip())} is not an integer of at most {MAX_INTEGER_DIGITS} digits,"
                    " a range a..b or a list a,b,c",
                    param,
                    ctx,
                )
        return sorted(out)


class OneLineCommand(click.Command):
    """Report a bad option value (malformed profile, non-integer, missing
    option) as one line on stderr with exit status 2, like the library's input
    errors, instead of click's usage block."""

    def make_context(self, info_name, args, parent=None, **extra):
        try:
            return super().make_context(info_name, args, parent=parent, **extra)
        except click.UsageError as error:
            raise InputError(error.format_message()) from None


class PickType(click.ParamType):
    """``S:K``: cover ``K`` of stratum ``S`` (both 1-based, as tables number them)."""

    name = "pick"

    def convert(self, value, param, ctx):
        if isinstance(value, tuple):
            return value
        m = re.fullmatch(r"\s*([0-9]{1,9})\s*:\s*([0-9]{1,9})\s*", str(value), re.ASCII)
        if not m or min(int(m.group(1)), int(m.group(2))) < 1:
            self.fail(f"{quote_window(str(value))} is not S:K with stratum S >= 1 and cover K >= 1 (e.g. 2:5)",
                      param, ctx)
        return int(m.group(1)), int(m.group(2))


PROFILE = ProfileType()
PICK = PickType()
INT_RANGE = IntRangeList()


def format_option(choices: list[str], default: str = "table"):
    """The ``--format/-f`` option with the given choices."""
    return click.option(
        "--format",
        "-f",
        "fmt",
        type=click.Choice(choices),
        default=default,
        show_default=True,
        help="Output format.",
    )


output_option = click.option(
    "--output",
    "-o",
    "output",
    type=click.Path(dir_okay=False, writable=True),
    default=None,
    callback=lambda ctx, param, value: check_destination(value, param, ctx),
    help="Write to this file (atomically) instead of standard output.",
)


def check_destination(output: str | None, param=None, ctx=None) -> str | None:
    """Refuse an ``--output`` that can never be written, before any computing:
    an empty name, a missing folder, a file used as a folder, a folder
    without write permission."""
    if output is None:
        return None
    if output == "":
        raise click.BadParameter("empty file name; give a path", param=param, ctx=ctx)
    target = os.path.realpath(output)
    if os.path.exists(target) and not os.path.isfile(target):
        if os.path.isdir(target):
            raise click.BadParameter(f"{output!r} is a folder; give a file", param=param, ctx=ctx)
        return output
    directory = os.path.dirname(target)
    if not os.path.isdir(directory):
        raise click.BadParameter(f"folder {directory!r} does not exist", param=param, ctx=ctx)
    if not os.access(directory, os.W_OK | os.X_OK):
        raise click.BadParameter(f"folder {directory!r} is not writable", param=param, ctx=ctx)
    return output


def _writes_through(output: str) -> bool:
    """True when ``output`` (after links) exists and is not a regular file
    (a device, a fifo): such a target is written into, never replaced."""
    target = os.path.realpath(output)
    return os.path.exists(target) and not os.path.isfile(target)


def emit(text: str, output: str | None) -> None:
    """Write ``text`` to stdout, or atomically to ``output``: the file appears
    complete or not at all."""
    if not text.endswith("\n"):
        text += "\n"
    if output is None:
        click.echo(text, nl=False)
        return
    if _writes_through(output):
        with open(os.path.realpath(output), "w", encoding="utf-8") as handle:
            handle.write(text)
        return
    directory = os.path.dirname(os.path.realpath(output))
    fd, tmp = tempfile.mkstemp(dir=directory, prefix=".covertree-", suffix=".tmp")
    try:
        with os.fdopen(fd, "w", encoding="utf-8") as handle:
            handle.write(text)
        _publish(tmp, output)
    except BaseException:
        if os.path.exists(tmp):
            os.unlink(tmp)
        raise


class AtomicOutput:
    """Context manager giving a text stream: stdout, or a temporary file next to
    ``output`` that replaces it only when the block succeeds (no partial file
    is ever left behind)."""

    def __init__(self, output: str | None) -> None:
        self.output = output
        self.tmp: str | None = None

    def __enter__(self):
        if self.output is None:
            return sys.stdout
        if _writes_through(self.output):
            self.handle = open(os.path.realpath(self.output), "w", encoding="utf-8")
            return self.handle
        directory = os.path.dirname(os.path.realpath(self.output))
        fd, self.tmp = tempfile.mkstemp(dir=directory, prefix=".covertree-", suffix=".tmp")
        self.handle = os.fdopen(fd, "w", encoding="utf-8")
        return self.handle

    def __exit__(self, kind, value, traceback) -> bool:
        if self.tmp is None:
            if self.output is not None:
                self.handle.close()
            return False
        self.handle.close()
        if kind is None:
            _publish(self.tmp, self.output)
        else:
            os.unlink(self.tmp)
        return False


def _publish(tmp: str, output: str) -> None:
    """Give the finished temporary file the mode of the file it replaces (or
    the usual permissions for a new one) and move it into place in one step;
    a symlink is followed, so its target is replaced, not the link."""
    target = os.path.realpath(output)
    if os.path.isfile(target):
        mode = os.stat(target).st_mode & 0o7777
    else:
        mask = os.umask(0)
        os.umask(mask)
        mode = 0o666 & ~mask
    os.chmod(tmp, mode)
    os.replace(tmp, target)
