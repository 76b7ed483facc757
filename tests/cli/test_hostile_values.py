"""Hostile integer and range values: bounded integers, non-ASCII digits, huge
ranges and long inputs give one short line and exit 2 (issue 14)."""

import click
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.cli import CovertreeGroup, main
from covertree.cli.params import INT_RANGE, MAX_RANGE_VALUES, OneLineCommand, quote_window


def sweep(*args):
    return CliRunner().invoke(main, ["sweep", "-t", "0", *args])


def one_line_refusal(result):
    assert result.exit_code == 2, result.output
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in result.output
    return lines[0]


def test_superscript_digit_in_a_range_refused():
    line = one_line_refusal(sweep("-g", "0..\u00b2", "-d", "2"))
    assert "\u00b2" in line


def test_huge_range_refused_naming_the_limit():
    line = one_line_refusal(sweep("-g", "0..1000000000", "-d", "2"))
    assert "1000000001 values" in line and str(MAX_RANGE_VALUES) in line


def test_integer_beyond_conversion_limit_refused_with_short_quote():
    line = one_line_refusal(sweep("-g", "0", "-d", "9" * 5000))
    assert "5000 characters" in line and len(line) < 300


def test_quote_window_keeps_short_text_whole():
    assert quote_window("2..4") == "'2..4'"


@click.group(cls=CovertreeGroup)
def _probe_group():
    """Same error handling as ``covertree``."""


@_probe_group.command(cls=OneLineCommand)
@click.option("--values", type=INT_RANGE, required=True)
def probe(values):
    click.echo(len(values))


_TOKENS = st.one_of(
    st.integers(-10**30, 10**30).map(str),
    st.tuples(st.integers(-10**7, 10**7), st.integers(-10**7, 10**7)).map(lambda p: f"{p[0]}..{p[1]}"),
    st.text(alphabet="0123456789\u00b2\u0663-.,^ x", max_size=30),
    st.text(max_size=10),
)


@settings(max_examples=300, deadline=None)
@given(st.lists(_TOKENS, min_size=1, max_size=4).map(",".join))
def test_fuzzed_range_values_exit_cleanly(value):
    result = CliRunner().invoke(_probe_group, ["probe", "--values", value])
    assert result.exit_code in (0, 2, 3), result.output
    assert len(result.stderr.strip().splitlines()) <= 1
    assert len(result.stderr) < 400


def test_long_quote_escapes_line_breaks():
    assert "\n" not in quote_window("\n" * 100)
