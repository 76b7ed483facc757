"""Running sweep tasks on an existing dask.distributed scheduler (the optional
extra ``covertree[dask]``).

The backend submits every pending task to the scheduler and yields results as
they come back; :func:`covertree.sweep.runner.run_tasks` puts them in task
order, so a cluster run gives the same output as a serial one.

References
----------
Dask Development Team, *Dask: Library for dynamic task scheduling* (2016),
``distributed.Client`` and ``distributed.as_completed``.
"""

from __future__ import annotations

import asyncio
import logging
from contextlib import contextmanager
from collections.abc import Iterator, Sequence

from covertree.errors import InputError
from covertree.sweep.tasks import StratumSummary, Task, compute_task, largest_first

__all__ = ["DaskBackend", "CONNECT_TIMEOUT"]

#: Seconds to wait for the scheduler's handshake before giving up (a closed
#: port, an address that accepts and never answers, another protocol).
CONNECT_TIMEOUT = 5.0


@contextmanager
def _quiet_logs() -> Iterator[None]:
    """Silence distributed's own log lines (the refusal is one line of ours)."""
    quiet = [logging.getLogger(name) for name in ("distributed", "distributed.client", "distributed.comm")]
    levels = [log.level for log in quiet]
    for log in quiet:
        log.setLevel(logging.CRITICAL)
    try:
        yield
    finally:
        for log, level in zip(quiet, levels):
            log.setLevel(level)


def _short(address: str) -> str:
    return repr(address) if len(address) <= 60 else f"{address[:60]!r}... ({len(address)} characters)"


def _distributed():
    try:
        import distributed
    except ImportError:
        raise InputError(
            "--dask needs the optional dask extra, which is not installed: "
            "pip install 'covertree[dask]'"
        ) from None
    return distributed


class DaskBackend:
    """Tasks on the dask scheduler at ``address`` (``tcp://host:port``).

    Raises
    ------
    InputError
        If the dask extra is missing or the scheduler cannot be reached within
        ``timeout`` seconds (default :data:`CONNECT_TIMEOUT`).
    """

    def __init__(self, address: str, timeout: float | None = None) -> None:
        self.address = address
        self.timeout = CONNECT_TIMEOUT if timeout is None else timeout
        self._distributed = _distributed()
        self._client = None

    def __enter__(self) -> "DaskBackend":
        self._client = self._connect()
        return self

    def __exit__(self, *exc) -> bool:
        self._client.close()
        return False

    def _connect(self):
        """Shake hands with the scheduler within the timeout (a closed port, a
        peer that never answers or one that speaks another protocol is refused
        before any client exists), then open the client."""
        with _quiet_logs():
            try:
                asyncio.run(asyncio.wait_for(self._handshake(), self.timeout))
                return self._distributed.Client(self.address, timeout=self.timeout, set_as_default=False)
            except Exception as error:  # whatever the peer sent: refuse in one line
                raise InputError(
                    f"cannot reach the dask scheduler at {_short(self.address)} within {self.timeout:g} s "
                    f"({type(error).__name__}); give the address of a running scheduler, e.g. tcp://host:8786"
                ) from None

    async def _handshake(self) -> None:
        comm = await self._distributed.comm.connect(self.address, timeout=self.timeout)
        await comm.close()

    def run(self, tasks: Sequence[Task]) -> Iterator[tuple[Task, StratumSummary]]:
        """Yield ``(task, summary)`` as the cluster finishes them (any order)."""
        futures = {self._client.submit(compute_task, task, pure=False, priority=-rank): task
                   for rank, task in enumerate(sorted(tasks, key=largest_first))}
        try:
            for future in self._distributed.as_completed(list(futures), loop=self._client.loop):
                yield futures[future], future.result()
        finally:
            self._client.cancel(list(futures))
