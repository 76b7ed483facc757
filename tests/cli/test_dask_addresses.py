"""``sweep --dask`` with addresses that are not a scheduler: a closed port, a
loopback socket that accepts and never answers, a peer speaking another
protocol, malformed addresses.  Each gives one line and exit 2 within the
connect timeout, and no traceback at exit (issue 14).  Only 127.0.0.1 is
ever contacted."""

import socket
import subprocess
import threading
import time

import pytest

from tests.sweep.helpers import COVERTREE, invoke

pytest.importorskip("distributed")

SWEEP = ["sweep", "-g", "2", "-t", "1", "-d", "2", "-q", "--dask-timeout", "1"]


def closed_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


class Listener:
    """A loopback socket that accepts connections and then sends ``reply``
    (never anything when ``reply`` is empty), keeping them open."""

    def __init__(self, reply: bytes = b"") -> None:
        self.reply, self.kept = reply, []
        self.sock = socket.socket()
        self.sock.bind(("127.0.0.1", 0))
        self.sock.listen(16)
        self.sock.settimeout(0.2)
        self.address = f"tcp://127.0.0.1:{self.sock.getsockname()[1]}"
        self.running = True
        self.thread = threading.Thread(target=self._serve, daemon=True)
        self.thread.start()

    def _serve(self) -> None:
        while self.running:
            try:
                conn, _ = self.sock.accept()
            except OSError:
                continue
            self.kept.append(conn)
            if self.reply:
                conn.sendall(self.reply)

    def close(self) -> None:
        self.running = False
        self.thread.join(5)
        for conn in self.kept:
            conn.close()
        self.sock.close()


@pytest.fixture
def silent():
    listener = Listener()
    yield listener
    listener.close()


def run_alone(*args):
    """``covertree ARGS`` in a fresh interpreter (a traceback printed at exit
    by a half-made client would show here); returns (status, stderr, seconds)."""
    start = time.monotonic()
    child = subprocess.run([*COVERTREE, *args], capture_output=True, text=True, timeout=120)
    return child.returncode, child.stderr, time.monotonic() - start


def assert_refused(status, stderr, address) -> None:
    assert status == 2, stderr
    assert stderr.count("\n") == 1 and "Traceback" not in stderr, stderr
    assert "cannot reach the dask scheduler" in stderr and address in stderr and "within 1 s" in stderr


def test_closed_port_refused_in_one_line():
    address = f"tcp://127.0.0.1:{closed_port()}"
    status, stderr, _ = run_alone(*SWEEP, "--dask", address)
    assert_refused(status, stderr, address)


def test_a_peer_that_never_answers_is_given_up_within_the_timeout(silent):
    status, stderr, seconds = run_alone(*SWEEP, "--dask", silent.address)
    assert_refused(status, stderr, silent.address)
    assert silent.kept  # it did connect, and was then given up
    assert seconds < 60  # without a handshake timeout the run never ends


@pytest.mark.parametrize("reply", [b"\xff" * 64, b"HTTP/1.1 400 Bad Request\r\n\r\n"])
def test_a_peer_speaking_another_protocol_is_refused(reply):
    listener = Listener(reply)
    try:
        result = invoke(*SWEEP, "--dask", listener.address)
    finally:
        listener.close()
    assert_refused(result.exit_code, result.stderr, listener.address)


@pytest.mark.parametrize("address", ["nonsense://x", "tcp://[::1", "tcp://127.0.0.1:99999", "tcp://" + "9" * 5000])
def test_malformed_addresses_refused_with_a_short_quote(address):
    result = invoke(*SWEEP, "--dask", address)
    assert_refused(result.exit_code, result.stderr, address[:40])
    assert len(result.stderr) < 300


@pytest.mark.parametrize("value", ["0", "-1", "soon", "1e9", "nan", "NaN", "inf"])
def test_bad_timeouts_refused(value):
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "2", "--dask", "tcp://127.0.0.1:1", "--dask-timeout", value)
    assert result.exit_code == 2 and result.stderr.count("\n") == 1 and "--dask-timeout" in result.stderr
