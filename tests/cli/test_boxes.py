"""The plain table drawing agrees with the terminal library's default table.

``covertree.cli.boxes.plain_table`` replaces the library for the tables of
``count`` and ``strata`` (a fast start); wherever it draws, the output must be
the library's, character for character, and where it declines the caller falls
back to the library.  The reference is the library itself (rich's ``Table``
with its default box, rendered without colour).
"""

from __future__ import annotations

import io

from hypothesis import given, settings, strategies as st
from rich.console import Console
from rich.table import Table
from rich.text import Text

from covertree.cli.boxes import plain_table

#: printable ASCII as the commands print it (notation, profiles, p/q numbers)
_CHARS = st.characters(min_codepoint=32, max_codepoint=126)
_TEXT = st.text(_CHARS, min_size=1, max_size=12)
_JUSTIFY = st.sampled_from(["left", "right"])


def _rich(title, columns, rows, width, as_text) -> str:
    table = Table(title=title)
    for header, justify in columns:
        table.add_column(header, justify=justify)
    for row in rows:
        table.add_row(*(Text(cell) if as_text else cell for cell in row))
    buffer = io.StringIO()
    Console(file=buffer, width=width, color_system=None).print(table)
    return buffer.getvalue()


@st.composite
def _tables(draw):
    columns = draw(st.lists(st.tuples(_TEXT, _JUSTIFY), min_size=1, max_size=5))
    rows = draw(st.lists(st.lists(_TEXT, min_size=len(columns), max_size=len(columns)),
                         min_size=1, max_size=6))
    return draw(_TEXT), columns, rows, draw(st.integers(20, 120))


@settings(max_examples=300, deadline=None)
@given(_tables(), st.booleans())
def test_plain_table_is_the_library_table_where_it_draws(table, as_text):
    title, columns, rows, width = table
    plain = plain_table(title, columns, rows, width)
    if plain is not None:
        assert plain == _rich(title, columns, rows, width, as_text)


@settings(max_examples=100, deadline=None)
@given(st.lists(st.tuples(st.text("abcdefghij0123456789/,^ -", min_size=1, max_size=10)
                          .map(str.strip).filter(bool), _JUSTIFY), min_size=1, max_size=5),
       st.integers(1, 6))
def test_plain_table_draws_every_plain_table_that_fits(columns, count):
    # cells of the commands' alphabet: the plain drawing must not decline
    rows = [[f"{header}{i}" for header, _ in columns] for i in range(count)]
    plain = plain_table("Title", columns, rows, 400)
    assert plain is not None
    assert plain == _rich("Title", columns, rows, 400, True)


def test_plain_table_declines_what_it_cannot_draw_verbatim():
    columns = [("a", "left"), ("b", "right")]
    fine = [["x", "1"]]
    assert plain_table("T", columns, fine, 80) is not None
    for title, rows, width in [
        ("T", [["[bold]x", "1"]], 80),      # markup
        ("T", [["x :smile: y", "1"]], 80),  # emoji code
        ("T", [["é", "1"]], 80),            # not ASCII
        ("T", [["x\ny", "1"]], 80),         # two lines in a cell
        ("T", [[" x", "1"]], 80),           # leading space
        ("T", [["x", "1 "]], 80),           # trailing space
        ("T", [], 80),                      # no rows
        ("", fine, 80),                     # no title
        ("a title wider than the table", fine, 80),
        ("T", [["x" * 90, "1"]], 80),       # wider than the console
        ("T", [["x"]], 80),                 # a short row
    ]:
        assert plain_table(title, columns, rows, width) is None, (title, rows)


def test_the_command_tables_take_the_plain_path(monkeypatch):
    # count and strata draw their tables without the library (a fast start)
    from click.testing import CliRunner

    import covertree.cli.count as count
    import covertree.cli.strata as strata
    from covertree.cli import main

    def refuse(*args):
        raise AssertionError("the library table was drawn")

    monkeypatch.setattr(count, "_rich_table", refuse)
    monkeypatch.setattr(strata, "_rich_table", refuse)
    for args in (["count", "-g", "2", "-t", "1", "-d", "4"], ["strata", "-t", "2", "-n", "1"]):
        result = CliRunner().invoke(main, args)
        assert result.exit_code == 0, result.output
        assert result.output.splitlines()[1].startswith("┏")
