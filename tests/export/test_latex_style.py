"""Structural checks of every LaTeX fragment (run with or without pdflatex):
one table style (booktabs), no typewriter font, edges typeset as edges, the
pullback table named by its problem."""

import re

import pytest

from tests.export.test_latex_paste import FRAGMENTS, fragment

#: A list of profiles in math mode (``2,1^{2};\allowbreak\ 3``): powers there are
#: repeated parts, the usual notation for partitions.
PART = r"\d+(\^\{\d+\})?"
PROFILE = rf"{PART}(,{PART})*"
PROFILES = re.compile(rf"{PROFILE}(;\\allowbreak\\ {PROFILE})*")

TABLES = [name for name in FRAGMENTS if "tikz" not in name and name != "locus"]


@pytest.mark.parametrize("name", TABLES)
def test_one_table_style(name):
    text = fragment(name)
    assert r"\toprule" in text and r"\bottomrule" in text
    assert r"\hline" not in text and r"\texttt" not in text


@pytest.mark.parametrize("name", sorted(FRAGMENTS))
def test_no_edge_reads_as_a_subtraction(name):
    # inside math, "0-1" would typeset as zero minus one; "1^2" as a square
    for math in re.findall(r"\$([^$]*)\$", fragment(name)):
        assert not re.search(r"\d\s*-\s*\d", math), math
        if not name.startswith("count") and not PROFILES.fullmatch(math):  # 2^{2}: a repeated part
            assert not re.search(r"\d\^\{?\d", math.replace(r"^{\times", "")), math


def test_edges_in_math():
    from covertree.export.graphs import notation_math

    text = notation_math("g1, g0 | 0-1^3, 1-1")
    assert r"(0\mbox{--}1)^{\times 3}" in text and r"1\mbox{--}1" in text


def test_pullback_names_its_problem():
    text = fragment("pullback")
    first = text.splitlines()[0]
    assert first.startswith(r"\noindent Pullback") and r"\overline{M}_{3}" in first
    assert "degree 2" in first and r"\overline{M}_{0,8}" in first and "genus-3" in first
