"""Smaller refusals of issue 14: sweeps with nothing computable, profiles
repeating a part zero times, error lines quoting a short window of a long
input."""

import pytest

from covertree.cli import LINE_WIDTH, error_line
from tests.sweep.helpers import invoke


def one_line(result, *words) -> str:
    assert result.exit_code == 2, (result.stdout, result.stderr)
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in result.stderr, result.stderr
    assert all(word in lines[0] for word in words), lines[0]
    return lines[0]


@pytest.mark.parametrize("ranges, words", [
    (["-g", "2", "-t", "1", "-d", "1"], ["genus 2 over genus 1 in degree 1", "impossible in degree 1"]),
    (["-g", "2..4", "-t", "1", "-d", "1"], ["and 2 more skipped problems"]),
    (["-t", "1", "-d", "1..2", "-p", "3"], ["profile 3", "1 more skipped problem"]),
])
def test_a_sweep_with_every_problem_skipped_is_refused(tmp_path, ranges, words):
    store, output = tmp_path / "s.sqlite", tmp_path / "out.json"
    line = one_line(invoke("sweep", *ranges, "--store", str(store), "-o", str(output)),
                    "nothing to compute", *words)
    assert "every problem of the ranges is skipped" in line
    assert not store.exists() and not output.exists()


def test_a_sweep_with_some_problems_skipped_still_runs():
    result = invoke("sweep", "-g", "2", "-t", "1", "-d", "1..2", "-f", "csv", "-q")
    assert result.exit_code == 0 and result.stdout.count("\n") == 4


@pytest.mark.parametrize("profile", ["1^0,3", "3,2^0", "1^00"])
@pytest.mark.parametrize("command", [["count", "-g", "2", "-t", "0", "-d", "3"],
                                     ["sweep", "-g", "2", "-t", "0", "-d", "3"]])
def test_a_part_repeated_zero_times_is_refused(command, profile):
    one_line(invoke(*command, "-p", profile), "0 times", "a^k")


LONG = {
    "profile": ["count", "-g", "2", "-t", "0", "-d", "3", "-p", "1," * 12000 + "x"],
    "points": ["strata", "-t", "0", "-n", "7" * 30000],
    "range": ["sweep", "-t", "1", "-d", "2..x" + "9" * 24000],
    "store": ["export", "--store", "/nonexistent/" + "s" * 24000],
}


@pytest.mark.parametrize("case", sorted(LONG))
def test_errors_quote_a_short_window_of_a_long_input(case):
    line = one_line(invoke(*LONG[case]))
    assert len(line) < LINE_WIDTH + 40 and "characters)" in line


def test_error_line_keeps_ordinary_messages_whole():
    message = "store '/home/someone/a rather long folder name/results.sqlite' does not exist"
    assert error_line(message) == message
    assert error_line("first\nsecond") == "first second"


@pytest.mark.parametrize("data, words", [
    (b"\xff\xfe{}", ["not UTF-8"]),
    (b"[" * 100000, ["nested deeper"]),
    (b"{not json", ["not JSON"]),
    (b'{"base": 7, "source": [], "edge_profiles": "x"}', ["not a cover"]),
    (b'{"base": {"vertices": "1/0"}, "source": {}, "edge_profiles": []}', ["not a cover"]),
])
def test_draw_refuses_hostile_cover_files(tmp_path, data, words):
    cover, image = tmp_path / "covers.jsonl", tmp_path / "cover.svg"
    cover.write_bytes(data)
    one_line(invoke("draw", "--cover", str(cover), "-o", str(image)), "line 1", *words)
    assert not image.exists()


@pytest.mark.parametrize("args, words", [
    (["nosuch"], ["No such command 'nosuch'", "Commands: catalogue"]),
    (["--bogus"], ["No such option '--bogus'"]),
    (["x" * 24000], ["No such command", "characters)"]),
])
def test_unknown_commands_and_group_options_in_one_line(args, words):
    line = one_line(invoke(*args), *words)
    assert len(line) < LINE_WIDTH + 40
