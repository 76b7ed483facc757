"""Shared click parameter types and output helpers for the commands."""

from __future__ import annotations

import re
import sys
from collections.abc import Iterator
from contextlib import contextmanager
from typing import IO

import click

from covertree.cli.interrupts import interrupted_line, interrupted_status, signals_interrupt
from covertree.errors import InputError, ProfileError
from covertree.export.files import atomic_output, destination_problem, same_file
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


class Seconds(click.FloatRange):
    """A number of seconds in a range; unlike click's float range, refuses NaN
    (which compares false with both bounds and so passes the range check)."""

    name = "seconds"

    def convert(self, value, param, ctx):
        number = super().convert(value, param, ctx)
        if number != number:
            self.fail(f"{value!r} is not a number of seconds", param, ctx)
        return number


class OneLineCommand(click.Command):
    """Report a bad option value (malformed profile, non-integer, missing
    option) as one line on stderr with exit status 2, like the library's input
    errors, instead of click's usage block."""

    def make_context(self, info_name, args, parent=None, **extra):
        try:
            return super().make_context(info_name, args, parent=parent, **extra)
        except click.UsageError as error:
            raise InputError(error.format_message()) from None

    def invoke(self, ctx: click.Context):
        """Run the command; SIGTERM and SIGHUP interrupt it like Ctrl-C (temporary
        files are removed), and an interruption exits ``128 + signal`` (130 for
        Ctrl-C) with one line saying what was kept."""
        with signals_interrupt():
            try:
                return super().invoke(ctx)
            except KeyboardInterrupt as stop:
                click.echo(interrupted_line(stop, ctx.params), err=True)
                sys.exit(interrupted_status(stop))


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
    without write permission, a dangling link."""
    if output is None:
        return None
    problem = destination_problem(output)
    if problem is not None:
        raise click.BadParameter(problem, param=param, ctx=ctx)
    return output


def emit(text: str, output: str | None) -> None:
    """Write ``text`` to stdout, or atomically to ``output``: the file appears
    complete or not at all."""
    if not text.endswith("\n"):
        text += "\n"
    if output is None:
        click.echo(text, nl=False)
        return
    with atomic_output(output) as handle:
        handle.write(text)


@contextmanager
def AtomicOutput(output: str | None, binary: bool = False) -> Iterator[IO]:
    """A stream: stdout, or :func:`covertree.export.files.atomic_output` for
    ``output`` (no partial file is ever left behind)."""
    if output is None:
        yield sys.stdout.buffer if binary else sys.stdout
        return
    with atomic_output(output, binary) as handle:
        yield handle


def refuse_output_onto_store(output: str | None, store: str | None) -> None:
    """Refuse ``-o`` naming the ``--store`` file (it would be overwritten)."""
    if output is not None and store is not None and same_file(output, store):
        raise InputError(f"--output {quote_window(output)} is the --store file; give another output file")
