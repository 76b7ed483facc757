"""Interruptions of a command: Ctrl-C, SIGTERM and SIGHUP stop it the same
way (temporary output files are removed on the way out) and it exits
``128 + signal`` (130 for Ctrl-C) with one line saying what was kept."""

from __future__ import annotations

import os
import signal
import threading
from collections.abc import Iterator
from contextlib import contextmanager

__all__ = ["Terminated", "interrupted_line", "interrupted_status", "signals_interrupt"]


class Terminated(KeyboardInterrupt):
    """SIGTERM or SIGHUP received (handled like Ctrl-C)."""

    def __init__(self, signum: int) -> None:
        super().__init__(signum)
        self.signum = signum


def _signal_name(stop: KeyboardInterrupt) -> str:
    return signal.Signals(getattr(stop, "signum", signal.SIGINT)).name


def _kept(params: dict) -> str:
    """What an interrupted run leaves behind."""
    output = params.get("output")
    said = f"{output!r} not written" if output else "the output is incomplete"
    store = params.get("store")
    if store:
        said += f"; the finished tasks are kept in the store {store!r}"
    return said


#: Seconds after which a SIGTERM or SIGHUP is delivered again while the command
#: still runs: Python swallows an exception raised while a weak-reference or
#: collector callback runs, so the first one can be lost.
REPEAT_AFTER = 1.0


@contextmanager
def signals_interrupt() -> Iterator[None]:
    """Turn SIGTERM and SIGHUP into :class:`Terminated` (main thread only),
    delivered again every :data:`REPEAT_AFTER` seconds until the block is left."""
    if threading.current_thread() is not threading.main_thread():
        yield
        return
    timers: list[threading.Timer] = []

    def terminated(signum, frame) -> None:
        timer = threading.Timer(REPEAT_AFTER, os.kill, (os.getpid(), signum))
        timer.daemon = True
        timer.start()
        timers.append(timer)
        raise Terminated(signum)

    previous = {sig: signal.signal(sig, terminated) for sig in (signal.SIGTERM, signal.SIGHUP)}
    try:
        yield
    finally:
        for timer in timers:
            timer.cancel()
        for sig, handler in previous.items():
            signal.signal(sig, handler)


def interrupted_status(stop: KeyboardInterrupt) -> int:
    """``128 + signal``: 130 for Ctrl-C, 143 for SIGTERM, 129 for SIGHUP.

    >>> interrupted_status(KeyboardInterrupt()), interrupted_status(Terminated(signal.SIGTERM))
    (130, 143)
    """
    return 128 + getattr(stop, "signum", signal.SIGINT)


def interrupted_line(stop: KeyboardInterrupt, params: dict) -> str:
    """The line printed for an interrupted command with options ``params``.

    >>> interrupted_line(Terminated(signal.SIGHUP), {"output": "out.json"})
    "covertree: interrupted by SIGHUP: 'out.json' not written"
    """
    return f"covertree: interrupted by {_signal_name(stop)}: {_kept(params)}"
