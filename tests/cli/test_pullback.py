"""The ``covertree pullback`` command through click's test runner."""

import csv
import io
import json

import pytest
from click.testing import CliRunner

from covertree.cli import main


def run(*args):
    return CliRunner().invoke(main, ["pullback", *args])


@pytest.mark.parametrize("degree,target,genus", [
    (2, 0, 2), (3, 0, 2), (2, 0, 3), (3, 0, 3),  # covers of the line
    (2, 1, 2), (3, 1, 2), (2, 1, 3), (3, 1, 3),  # covers of an elliptic curve
])
def test_every_check_holds(degree, target, genus):
    result = run("-g", str(genus), "-t", str(target), "-d", str(degree), "-f", "json")
    assert result.exit_code == 0, result.output
    data = json.loads(result.stdout)
    assert set(data) == {"problem", "hurwitz_number", "rows"}
    assert data["problem"]["codim"] == 1 and data["problem"]["genus"] == genus
    deltas = [f"delta_{i}" for i in range(genus // 2 + 1)]
    assert data["rows"]
    for row in data["rows"]:
        assert set(row) == {"base", "orbit_size", "coefficients", "branch_total"}
        assert list(row["coefficients"]) == deltas
        assert row["branch_total"] == data["hurwitz_number"]
        assert row["base"]["codim"] == 1


def test_json_values_genus_2_double_covers():
    data = json.loads(run("-g", "2", "-t", "0", "-d", "2", "-f", "json").stdout)
    assert data["hurwitz_number"] == "1/2"
    assert [(r["orbit_size"], r["coefficients"]) for r in data["rows"]] == [
        (15, {"delta_0": "1", "delta_1": "0"}), (10, {"delta_0": "0", "delta_1": "1/4"}),
    ]


def test_labeled():
    data = json.loads(run("-g", "2", "-t", "0", "-d", "2", "-l", "-f", "json").stdout)
    assert len(data["rows"]) == 25 and {r["orbit_size"] for r in data["rows"]} == {1}


def test_table_csv_latex():
    table = run("-g", "2", "-t", "1", "-d", "2")
    assert table.exit_code == 0 and "delta_1" in table.stdout and "holds" in table.stdout
    rows = list(csv.DictReader(io.StringIO(run("-g", "2", "-t", "1", "-d", "2", "-f", "csv").stdout)))
    assert rows and all(r["check"] == "holds" and r["branch_total"] == r["hurwitz_number"] for r in rows)
    latex = run("-g", "2", "-t", "0", "-d", "2", "-f", "latex").stdout
    assert r"\toprule" in latex and r"$\delta_{1}$" in latex and r"\frac{1}{4}" in latex
    doc = run("-g", "2", "-t", "0", "-d", "2", "-f", "latex", "--standalone").stdout
    assert doc.startswith(r"\documentclass") and r"\end{document}" in doc


def test_output_file(tmp_path):
    out = tmp_path / "p.json"
    result = run("-g", "2", "-t", "0", "-d", "2", "-f", "json", "-o", str(out))
    assert result.exit_code == 0 and json.loads(out.read_text())["rows"]


def test_genus_below_two_is_one_line_exit_2():
    result = run("-g", "1", "-t", "1", "-d", "2", "-p", "1,1")
    assert result.exit_code == 2
    assert result.stderr.count("\n") == 1 and "G >= 2" in result.stderr


def test_failed_check_exits_1(monkeypatch):
    from covertree.catalogue import pullback as module

    original = module.pullback_row

    def broken(*args):
        row = original(*args)
        return module.PullbackRow(row.base, row.coefficients, row.branch_total + 1, row.hurwitz_number, row.n_covers)

    monkeypatch.setattr(module, "pullback_row", broken)
    result = run("-g", "2", "-t", "0", "-d", "2")
    assert result.exit_code == 1 and "BUG" in result.stderr
