"""Resource guards (issue 14, issue 11): runs estimated beyond the work limit
are refused before they start with one line naming the size and the largest
feasible value (exit 2); ``--time-limit`` stops a long run (exit 3); huge or
foreign integers give one short line."""

import pytest
from click.testing import CliRunner

from covertree.cli import main
from covertree.errors import TooLargeError
from covertree.hurwitz.cost import check_count, count_work
from covertree.limits import DEFAULT_MAX_WORK


def run(*args):
    return CliRunner().invoke(main, list(args))


def refusal(result, status=2):
    assert result.exit_code == status, (result.exit_code, result.output)
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in result.output, result.output
    assert len(lines[0]) < 500
    assert result.stdout == ""
    return lines[0]


def largest_named(line: str) -> int:
    return int(line.rsplit(" ", 1)[1])


def test_huge_degree_refused_naming_the_largest_feasible_degree():
    line = refusal(run("count", "-t", "1", "-g", "2", "-d", "100000"))
    assert "degree 100000" in line and "largest feasible degree with 2 branch points" in line
    largest = largest_named(line)
    # the value named is feasible and the next one is not
    assert 60 <= largest < 100000
    check_count(largest, 1, 2, [], DEFAULT_MAX_WORK)
    with pytest.raises(TooLargeError):
        check_count(largest + 1, 1, 2, [], DEFAULT_MAX_WORK)


def test_feasible_high_degree_still_counts():
    # Dijkgraaf's genus-2 series 2 [q^d] F_2 is checked in the published tests;
    # here only that the guard lets degree 40 through (sparse engine)
    result = run("count", "-t", "1", "-g", "2", "-d", "40", "-f", "csv")
    assert result.exit_code == 0, result.output


def test_a_genus_needing_two_billion_points_refused_at_once():
    line = refusal(run("count", "-t", "1", "-d", "2", "-g", "1000000000"))
    assert "1999999998" in line and "largest feasible genus at degree 2" in line


def test_huge_repeated_part_refused_before_building_the_profile():
    line = refusal(run("count", "-t", "1", "-d", "100000000", "-p", "1^100000000"))
    assert "1^100000000" in line and "1000000" in line


def test_raised_work_limit_moves_the_boundary():
    refusal(run("count", "-t", "1", "-g", "2", "-d", "40", "--max-work", "1000"))
    assert count_work(40, 1, [], 2) > 1000


@pytest.mark.parametrize("value", ["abc", "-5", "10^x", "\u00b2", "9" * 5000])
def test_bad_work_limit_refused(value):
    line = refusal(run("count", "-t", "1", "-g", "2", "-d", "3", "--max-work", value))
    assert "--max-work" in line


@pytest.mark.parametrize("value", ["0", "-1", "nan", "NAN", "inf", "1e400", "x"])
def test_bad_time_limit_refused(value):
    # NaN passed click's range check and reached the timer (a traceback) before
    line = refusal(run("count", "-t", "1", "-g", "2", "-d", "3", "--time-limit", value))
    assert "--time-limit" in line or "time limit" in line.lower()


def test_time_limit_stops_a_long_count():
    line = refusal(run("count", "-t", "1", "-g", "2", "-d", "400", "--max-work", "0", "--time-limit", "0.3"), 3)
    assert "time limit of 0.3 s" in line


@pytest.mark.parametrize("args, shown", [
    (("-p", "1" * 5000), "5000 digits"),
    (("-p", "2,1^" + "9" * 5000), "5000 digits"),
    (("-g", "1" * 5000), "characters) is not a valid integer"),
    (("-p", "1^0,3"), "0 times"),
    (("-p", "\u00b2,1"), "is not a part"),
])
def test_hostile_integers_one_short_line(args, shown):
    line = refusal(run("count", "-t", "0", "-d", "3", *args))
    assert shown in line


def test_all_strata_of_a_huge_genus_refused_at_once():
    line = refusal(run("strata", "-t", "9" * 30, "-n", "4"))
    assert "Mbar_{" + "9" * 30 + ",4}" in line and "genus" in line


def test_all_strata_of_mbar_6_4_refused_naming_feasible_values():
    line = refusal(run("strata", "-t", "6", "-n", "4"))
    assert "Mbar_{6,4} up to codim 19" in line and "the largest feasible codim is" in line


def test_strata_layer_guard_counts_the_candidates():
    # Mbar_{0,7} (2752 strata, Arbarello-Cornalba-Griffiths ch. X; counted by the
    # enumeration tests): a tiny work limit stops it between two codimensions
    line = refusal(run("strata", "-t", "0", "-n", "7", "-f", "csv", "--max-work", "200000"))
    assert "the largest feasible codim is" in line
    assert run("strata", "-t", "0", "-n", "7", "-f", "csv").exit_code == 0


def test_feasible_strata_still_listed():
    result = run("strata", "-t", "1", "-n", "3", "-f", "csv")
    assert result.exit_code == 0 and len(result.stdout.strip().splitlines()) == 1 + 23


@pytest.mark.parametrize("notation, shown", [
    ("g0{1,2,3,4} | 0-0^100000000", "edge multiplicity 100000000"),
    ("g" + "9" * 5000, "5000 digits"),
    ("g0{1,2} | 0-0^" + "9" * 5000, "5000 digits"),
    ("g0, " * 3000 + "g0", "more than 600"),
])
def test_hostile_notations_one_short_line(notation, shown):
    line = refusal(run("catalogue", "-t", "0", "-d", "2", "-g", "1", "-s", notation))
    assert shown in line


@pytest.mark.parametrize("shard", ["1/\u00b2", "\u00b9/2", "1/" + "9" * 5000, "1/9999999999999999999999"])
def test_foreign_or_huge_shard_refused(shard):
    line = refusal(run("sweep", "-t", "1", "-g", "2", "-d", "2", "--shard", shard))
    assert "I/N" in line


def test_catalogue_with_too_many_smooth_covers_refused_before_searching():
    # 22 simple points on a rational base in degree 12: the Hurwitz number
    # alone bounds the covers over the smooth stratum (exit 3, a limit)
    line = refusal(run("catalogue", "-t", "0", "-d", "12", "-g", "0"), 3)
    assert "--max-covers" in line and "at least" in line


def test_catalogue_time_limit_stops_a_fruitless_search(tmp_path):
    out = tmp_path / "covers.jsonl"
    line = refusal(run("catalogue", "-t", "1", "-d", "12", "-g", "2", "--time-limit", "1", "-f", "jsonl",
                       "-o", str(out)), 3)
    assert "time limit of 1 s" in line
    assert list(tmp_path.iterdir()) == []


def test_pullback_over_too_many_labelled_divisors_refused():
    line = refusal(run("pullback", "-t", "0", "-d", "2", "-g", "20"))
    assert "Mbar_{0,42} up to codim 1" in line


def test_catalogue_count_guard_applies_before_building():
    line = refusal(run("catalogue", "-t", "1", "-d", "100000", "-g", "2"))
    assert "largest feasible degree" in line


def chain(vertices):
    return ", ".join(["g1"] + ["g0"] * (vertices - 2) + ["g1"]) + " | " + ", ".join(
        f"{i}-{i + 1}" for i in range(vertices - 1))


@pytest.mark.parametrize("vertices", [250, 300])
def test_picture_of_a_long_chain_refused(tmp_path, vertices):
    line = refusal(run("draw", chain(vertices), "-o", str(tmp_path / "chain.svg")))
    assert "largest feasible chain has 60 vertices" in line or "more than 600" in line
    assert list(tmp_path.iterdir()) == []


@pytest.mark.parametrize("args, shown", [
    (("-d", "1..100000", "-t", "1", "-g", "2"), "degree 100000 with 2 branch points"),
    (("-g", "0..99999", "-t", "1", "-d", "2"), "199996 branch points"),
    (("-d", "1..300", "-g", "0..300", "-t", "0..300"), "27180300 problems"),
])
def test_sweep_refused_before_planning(args, shown):
    line = refusal(run("sweep", *args))
    assert shown in line


def _with_terminal_stderr(args):
    """Run covertree with stderr on a pseudo-terminal and stdout on a pipe."""
    import os
    import pty
    import subprocess
    import sys

    leader, follower = pty.openpty()
    try:
        done = subprocess.run([sys.executable, "-m", "covertree", *args], stdout=subprocess.PIPE,
                              stderr=follower, timeout=120, env={**os.environ, "COLUMNS": "100"})
        os.close(follower)
        follower = None
        seen = b""
        while True:
            try:
                chunk = os.read(leader, 65536)
            except OSError:
                break
            if not chunk:
                break
            seen += chunk
        return done, seen.decode(errors="replace")
    finally:
        os.close(leader)
        if follower is not None:
            os.close(follower)


@pytest.mark.parametrize("args, shown", [
    (["strata", "-t", "0", "-n", "7", "-f", "csv"], "strata so far"),
    (["catalogue", "-t", "1", "-d", "4", "-g", "2", "-f", "csv"], "covers"),
])
def test_progress_with_running_count_on_a_terminal_only(args, shown):
    done, terminal = _with_terminal_stderr(args)
    assert done.returncode == 0
    assert shown in terminal
    assert shown.encode() not in done.stdout and b"\x1b" not in done.stdout


@pytest.mark.parametrize("args, shown", [
    (["series", "-g", "2", "-t", "1", "-D", "100000", "-w", "6"], "degree 100000"),
    (["series", "-g", "2", "-t", "1", "-D", "1000000000", "-w", "6"], "--max-degree 1000000000"),
    (["locus", "-g", "3", "-t", "0", "-d", "20000"], "degree 20000"),
    (["integral", "-g", "2", "-t", "0", "-d", "40000", "--source", "lambda"], "degree 40000"),
])
def test_series_locus_and_integral_guarded(args, shown):
    line = refusal(run(*args))
    assert shown in line and "largest" in line


def test_time_limit_fires_again_when_its_first_exception_is_swallowed():
    # as when the alarm lands in a collector or weak-reference callback
    import time as clock

    from covertree.cli.limits import deadline
    from covertree.errors import LimitError

    swallowed, start = 0, clock.monotonic()
    with pytest.raises(LimitError):
        with deadline(0.05):
            while clock.monotonic() - start < 30:
                try:
                    while clock.monotonic() - start < 30:
                        pass
                except LimitError:
                    if swallowed:
                        raise
                    swallowed += 1
    assert swallowed == 1 and clock.monotonic() - start < 10
