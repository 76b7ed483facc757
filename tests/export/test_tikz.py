"""TikZ pictures: compiled with pdflatex when it is installed, otherwise
checked structurally."""

import re
import shutil
import subprocess

import pytest
from click.testing import CliRunner

from covertree.cli import main
from covertree.graphs import stable_graphs
from covertree.export.tikz import graph_to_tikz, layout, strata_tikz


def _balanced(text):
    stack = []
    for kind, name in re.findall(r"\\(begin|end)\{(\w+)\}", text):
        if kind == "begin":
            stack.append(name)
        else:
            assert stack and stack.pop() == name
    assert not stack


def test_every_vertex_edge_and_leg_is_drawn():
    # M. Chan (2012): 42 stable graphs of genus 3; Mbar_{0,5}: 26 strata (OEIS A000311)
    for graphs in (stable_graphs(3, 0), stable_graphs(0, 5), stable_graphs(1, 2)):
        text = strata_tikz(graphs)
        _balanced(text)
        pictures = text.split(r"\begin{tikzpicture}")[1:]
        assert len(pictures) == len(graphs)
        for g, pic in zip(graphs, pictures):
            assert pic.count(r"\node[vertex]") == g.n_vertices
            assert pic.count(r"\draw (v") == g.n_nodes + g.n_legs
            assert pic.count(r"\node[llabel]") == g.n_legs
            loops = re.findall(r"\\draw \(v(\d+)\.[-\d.]+\) \.\. controls [^;]* \(v(\d+)\.[-\d.]+\);", pic)
            assert len(loops) == sum(a == b for a, b in g.nodes)
            assert all(a == b for a, b in loops)  # each loop leaves and re-enters one vertex


def test_parallel_edges_and_loops_are_distinct():
    from covertree.graphs.notation import parse_graph

    g = parse_graph("g0, g0 | 0-0, 0-1^3, 1-1")
    lay = layout(g.n_vertices, g.nodes, g.vertex_legs)
    bends = [lay.bends[k] for k, (a, b) in enumerate(g.nodes) if a != b]
    assert len(set(bends)) == 3
    loops = [x for x in lay.loop_angles if x is not None]
    assert len(loops) == 2
    pic = graph_to_tikz(g)
    # the three parallel edges: one straight, two curves through distinct control points
    assert pic.count(r"\draw (v0) -- (v1)") + pic.count(r"\draw (v1) -- (v0)") == 1
    assert len(set(re.findall(r"\(v[01]\) \.\. controls (\([^)]*\))", pic))) == 2


def _compile(tmp_path, source):
    path = tmp_path / "doc.tex"
    path.write_text(source)
    run = subprocess.run(["pdflatex", "-interaction=nonstopmode", "-halt-on-error", path.name],
                         cwd=tmp_path, capture_output=True, text=True, timeout=120)
    assert run.returncode == 0, run.stdout[-2000:]
    pdf = tmp_path / "doc.pdf"
    assert pdf.exists() and pdf.read_bytes()[:4] == b"%PDF"


@pytest.mark.parametrize("args", [
    ["strata", "-t", "3", "-n", "0", "-f", "tikz", "--standalone"],
    ["strata", "-t", "0", "-n", "5", "-k", "1", "-f", "tikz", "--standalone"],
    ["catalogue", "-g", "2", "-t", "1", "-d", "3", "-f", "tikz", "--standalone"],
])
def test_standalone_document(tmp_path, args):
    result = CliRunner().invoke(main, args)
    assert result.exit_code == 0, result.output
    text = result.stdout
    _balanced(text)
    assert text.startswith(r"\documentclass") and r"\usepackage{tikz}" in text
    if shutil.which("pdflatex"):
        _compile(tmp_path, text)


def test_catalogue_tikz_one_picture_per_cover():
    result = CliRunner().invoke(main, ["catalogue", "-g", "2", "-t", "0", "-d", "2", "-f", "tikz"])
    assert result.exit_code == 0
    # 3 covers (one per stratum of codim <= 1): source and base in one picture
    assert result.stdout.count(r"\begin{tikzpicture}") == 3
    assert result.stdout.count(r"\node[vertex] (s") == 1 + 2 + 2
    assert result.stdout.count(r"\node[vertex] (b") == 1 + 2 + 2
