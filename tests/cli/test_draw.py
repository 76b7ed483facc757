"""The ``covertree draw`` command."""

import json

import pytest
from click.testing import CliRunner

from covertree.cli import main


def test_missing_extra_is_one_line_exit_2(monkeypatch, tmp_path):
    import builtins

    real = builtins.__import__

    def no_matplotlib(name, *args, **kwargs):
        if name == "matplotlib" or name.startswith("matplotlib."):
            raise ImportError(name)
        return real(name, *args, **kwargs)

    monkeypatch.setattr(builtins, "__import__", no_matplotlib)
    result = CliRunner().invoke(main, ["draw", "g2", "-o", str(tmp_path / "g.png")])
    assert result.exit_code == 2 and "covertree[draw]" in result.stderr
    assert result.stderr.count("\n") == 1


def test_needs_notation_or_cover(tmp_path):
    result = CliRunner().invoke(main, ["draw", "-o", str(tmp_path / "g.png")])
    assert result.exit_code == 2


def test_graph_and_cover(tmp_path):
    pytest.importorskip("matplotlib")
    runner = CliRunner()
    png = tmp_path / "g.png"
    assert runner.invoke(main, ["draw", "g0, g1 | 0-0, 0-1^2", "-o", str(png)]).exit_code == 0
    assert png.read_bytes()[:4] == b"\x89PNG"
    lines = runner.invoke(main, ["catalogue", "-g", "2", "-t", "1", "-d", "3", "-f", "jsonl"]).stdout
    cat = tmp_path / "c.jsonl"
    cat.write_text(lines)
    records = [json.loads(x) for x in lines.splitlines()]
    line = next(i for i, r in enumerate(records, start=1) if r["local_structure"]["source_edge_indices"])
    svg = tmp_path / "c.svg"
    result = runner.invoke(main, ["draw", "--cover", str(cat), "--line", str(line), "-o", str(svg)])
    assert result.exit_code == 0, result.output
    assert b"<svg" in svg.read_bytes()[:2000]
    bad = runner.invoke(main, ["draw", "--cover", str(cat), "--line", "999", "-o", str(svg)])
    assert bad.exit_code == 2
