"""Resource options shared by the commands: ``--max-work`` and ``--time-limit``.

``--max-work STEPS`` is the work limit of :mod:`covertree.limits`: a run
estimated beyond it is refused before it starts, with one line naming the
size that makes it infeasible and the largest feasible value (exit 2).
``--time-limit SECONDS`` stops a run that is still going after that long
(exit 3, :class:`~covertree.errors.LimitError`), whether or not it has found
anything: the cover limit ``--max-covers`` counts covers found, while a
search can run long finding none.
"""

from __future__ import annotations

import re
import signal
import sys
from collections.abc import Iterator
from contextlib import contextmanager, nullcontext

import click

from covertree.cli.params import Seconds
from covertree.errors import LimitError
from covertree.limits import DEFAULT_MAX_WORK, BYTES_PER_STEP, parse_natural

__all__ = ["deadline", "max_work_option", "on_terminal", "time_limit_option"]

_POWER = re.compile(r"\s*10\s*\^\s*([0-9]{1,3})\s*", re.ASCII)


class WorkType(click.ParamType):
    """A number of steps: ``1000000``, ``10^9``; ``0`` for no limit (``None``)."""

    name = "steps"

    def convert(self, value, param, ctx):
        if value is None or isinstance(value, (int, float)):
            return value or None
        text = str(value)
        m = _POWER.fullmatch(text)
        try:
            steps = 10 ** int(m.group(1)) if m else parse_natural(text, "work limit", 30)
        except Exception as error:  # InputError from parse_natural
            self.fail(f"{error}; or write 10^k", param, ctx)
        return steps or None


max_work_option = click.option(
    "--max-work", "max_work", type=WorkType(), default=str(DEFAULT_MAX_WORK), metavar="STEPS",
    help="Refuse a run estimated at more than STEPS steps (about a microsecond and at most "
         f"{BYTES_PER_STEP} bytes each; e.g. 10^9), naming the largest feasible value; 0 = no limit  "
         "[default: 10^8, about a minute or two and 1 GB].")


def _seconds(ctx, param, value):
    if value is not None and value <= 0:
        raise click.BadParameter(f"{value} is not a positive number of seconds", ctx=ctx, param=param)
    return value


time_limit_option = click.option(
    "--time-limit", "time_limit", type=Seconds(min=0, max=10**7), default=None, metavar="SECONDS",
    callback=_seconds,
    help="Stop (exit 3, no output file written) when the run is still going after SECONDS, "
         "whether or not it has found anything  [default: no limit].")


@contextmanager
def deadline(seconds: float | None) -> Iterator[None]:
    """Raise :class:`LimitError` in the block once ``seconds`` have passed
    (a real-time timer; ``None``: no limit), and again every 0.5 s until the
    block is left (an exception raised inside a callback of the collector is
    lost).  The previous handler is restored and the timer cleared on exit."""
    if seconds is None or not hasattr(signal, "setitimer"):
        yield
        return

    def expire(signum, frame):
        # fire again shortly: Python swallows an exception raised while a
        # weak-reference or collector callback runs, and the run would go on
        signal.setitimer(signal.ITIMER_REAL, 0.5)
        raise LimitError(f"stopped at the time limit of {seconds:g} s (--time-limit); no output file written; "
                         "raise --time-limit or make the problem smaller")

    previous = signal.signal(signal.SIGALRM, expire)
    signal.setitimer(signal.ITIMER_REAL, seconds)
    try:
        yield
    finally:
        signal.setitimer(signal.ITIMER_REAL, 0)
        signal.signal(signal.SIGALRM, previous)


def on_terminal(label: str, text=None):
    """A spinner with ``label``, the running ``text()`` and the elapsed time on
    stderr when it is a terminal (:func:`covertree.cli.render.running`; rich
    is imported only then, keeping the start of a piped command fast)."""
    if not sys.stderr.isatty():
        return nullcontext()
    from covertree.cli.render import running

    return running(label, text, enabled=True)
