"""The JSON contract, the CSV columns and the LaTeX rendering of a catalogue."""

from __future__ import annotations

import csv
import io
import json
import re
import shutil
import subprocess
from fractions import Fraction
from math import lcm, prod

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.export.catalogue import (
    COVER_COLUMNS, catalogue_to_csv, catalogue_to_dict, catalogue_to_json, catalogue_to_latex, cover_to_jsonl,
)
from covertree.graphs.curve_graph import CurveGraph
from covertree.hurwitz.problem import HurwitzProblem

RATIONAL = re.compile(r"^-?\d+(/\d+)?$")
GRAPH_KEYS = {"vertices", "edges", "automorphisms", "codim", "notation"}


@pytest.fixture(scope="module")
def cat():
    # genus-2 double covers of an elliptic curve, all 5 strata of Mbar_{1,2}
    return build_catalogue(HurwitzProblem.build(2, 1, genus=2), max_codim=2)


def _graph(g):
    assert set(g) >= GRAPH_KEYS
    assert isinstance(g["notation"], str) and isinstance(g["codim"], int)
    assert isinstance(g["automorphisms"], int) and g["codim"] == len(g["edges"])
    for v in g["vertices"]:
        assert isinstance(v["genus"], int) and all(isinstance(x, int) for x in v["legs"])
    assert CurveGraph.from_dict(g).notation == g["notation"]


def _rational(text):
    assert isinstance(text, str) and RATIONAL.match(text), text
    return Fraction(text)


def _cover(c):
    assert set(c) >= {"edge_profiles", "source", "stable_source", "automorphisms", "multiplicity",
                      "weight", "stable_codim", "stable_name"}
    assert all(isinstance(p, list) and all(isinstance(x, int) for x in p) for p in c["edge_profiles"])
    _graph(c["source"])
    _graph(c["stable_source"])
    assert isinstance(c["automorphisms"], int) and isinstance(c["multiplicity"], int)
    assert _rational(c["weight"]) == Fraction(c["multiplicity"], c["automorphisms"])
    assert c["stable_codim"] == c["stable_source"]["codim"]
    assert c["stable_name"] is None or re.match(r"^delta_\d+$", c["stable_name"])
    _local(c)


def _local(c):
    """LOCAL: per base node the indices e_i above it, L = lcm, prod(e_i)/L branches."""
    local = c["local_structure"]
    assert set(local) >= {"nodes", "branches", "source_edge_indices", "stable_nodes"}
    mult, branches = 1, 1
    for k, node in enumerate(local["nodes"]):
        assert set(node) >= {"edge", "indices", "lcm", "branches"}
        assert node["edge"] == k and sorted(node["indices"], reverse=True) == c["edge_profiles"][k]
        assert node["lcm"] == lcm(*node["indices"])
        assert node["branches"] == prod(node["indices"]) // node["lcm"]
        mult *= prod(node["indices"])
        branches *= node["branches"]
    assert mult == c["multiplicity"] and local["branches"] == branches
    assert len(local["source_edge_indices"]) == len(c["source"]["edges"])
    stable = local["stable_nodes"]
    if len(local["nodes"]) != 1:
        assert stable is None
    else:
        assert len(stable) == len(c["stable_source"]["edges"])
        for j, node in enumerate(stable):
            assert set(node) >= {"edge", "ends", "order", "type"}
            assert node["edge"] == j and isinstance(node["order"], int) and node["order"] >= 1
            assert node["type"] is None or re.match(r"^delta_\d+$", node["type"])


def test_json_contract(cat):
    doc = json.loads(catalogue_to_json(cat))
    assert doc == catalogue_to_dict(cat)
    assert set(doc) >= {"problem", "hurwitz_number", "strata"}
    problem = doc["problem"]
    assert set(problem) >= {"genus", "target_genus", "degree", "profiles", "codim"}
    assert (problem["genus"], problem["target_genus"], problem["degree"], problem["codim"]) == (2, 1, 2, 2)
    assert problem["profiles"] == [[2], [2]]
    hurwitz = _rational(doc["hurwitz_number"])
    assert hurwitz == 2  # OEIS A170991, d = 2
    assert len(doc["strata"]) == 5
    for s in doc["strata"]:
        assert set(s) >= {"base", "codim", "orbit_size", "covers", "total_weight", "by_source",
                          "hurwitz_number", "identity", "n_covers"}
        _graph(s["base"])
        assert s["codim"] == s["base"]["codim"] and isinstance(s["orbit_size"], int)
        assert s["identity"] is True and s["n_covers"] == len(s["covers"])
        assert _rational(s["hurwitz_number"]) == hurwitz
        for c in s["covers"]:
            _cover(c)
        total = sum((_rational(c["weight"]) for c in s["covers"]), Fraction(0))
        assert _rational(s["total_weight"]) == total == hurwitz
        for entry in s["by_source"]:
            assert set(entry) >= {"stable_source", "weight"}
            _graph(entry["stable_source"])
        assert sum((_rational(e["weight"]) for e in s["by_source"]), Fraction(0)) == total
    # base legs are the branch points 1..b in the order of the profiles
    legs = sorted(x for v in doc["strata"][0]["base"]["vertices"] for x in v["legs"])
    assert legs == [1, 2]


def test_fractional_weights_are_strings():
    cat = build_catalogue(HurwitzProblem.build(2, 0, genus=2), max_codim=1)
    doc = catalogue_to_dict(cat)
    assert doc["hurwitz_number"] == "1/2"  # one hyperelliptic cover, |Aut| 2 (common knowledge)
    weights = {c["weight"] for s in doc["strata"] for c in s["covers"]}
    assert weights == {"1/2"}


def test_jsonl_record(cat):
    s = cat.strata[1]
    record = json.loads(cover_to_jsonl(s.base, s.covers[0]))
    assert set(record) >= {"base", "orbit_size"}
    _graph(record["base"])
    _cover(record)


def test_csv_header_and_rows(cat):
    text = catalogue_to_csv(cat)
    rows = list(csv.reader(io.StringIO(text)))
    # columns are only ever added: the first eleven are fixed, in this order
    assert tuple(rows[0]) == COVER_COLUMNS
    assert COVER_COLUMNS[:11] == (
        "base", "base_codim", "orbit_size", "edge_profiles", "source", "stable_source",
        "stable_codim", "stable_name", "automorphisms", "multiplicity", "weight",
    )
    assert set(COVER_COLUMNS[11:]) >= {"node_indices", "node_lcms", "node_branches", "branches",
                                        "stable_node_orders", "stable_node_types"}
    assert len(rows) - 1 == cat.n_covers
    for row in rows[1:]:
        record = dict(zip(rows[0], row))
        assert Fraction(record["weight"]) == Fraction(int(record["multiplicity"]), int(record["automorphisms"]))
    per_base = {}
    for row in rows[1:]:
        per_base[row[0]] = per_base.get(row[0], Fraction(0)) + Fraction(row[10])
    assert set(per_base.values()) == {Fraction(2)}


def test_latex_fragment_and_document(cat):
    body = catalogue_to_latex(cat)
    assert r"\begin{longtable}" in body and r"\end{longtable}" in body
    assert r"\documentclass" not in body
    doc = catalogue_to_latex(cat, standalone=True)
    assert doc.lstrip().startswith(r"\documentclass") and doc.rstrip().endswith(r"\end{document}")
    half = build_catalogue(HurwitzProblem.build(2, 1, genus=2), max_codim=1)
    assert r"\frac{1}{2}" in catalogue_to_latex(half)
    assert r"\delta_{1}" in body or r"\delta_1" in body


@pytest.mark.skipif(shutil.which("pdflatex") is None, reason="pdflatex not installed")
def test_latex_document_compiles(cat, tmp_path):
    (tmp_path / "cat.tex").write_text(catalogue_to_latex(cat, standalone=True), encoding="utf-8")
    subprocess.run(["pdflatex", "-interaction=nonstopmode", "-halt-on-error", "cat.tex"],
                   cwd=tmp_path, check=True, capture_output=True, timeout=120)
    assert (tmp_path / "cat.pdf").exists()
