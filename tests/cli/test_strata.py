"""The ``covertree strata`` command through click's test runner."""

import csv
import io
import json

import pytest
from click.testing import CliRunner

from covertree.cli import main
from covertree.graphs import StableCurveGraph


def run(*args):
    return CliRunner().invoke(main, ["strata", *args])


def test_json_lists_the_strata_of_mbar_3():
    # M. Chan, Combinatorics of the tropical Torelli map (2012): 42 stable graphs of genus 3.
    result = run("--target-genus", "3", "--points", "0", "--format", "json")
    assert result.exit_code == 0, result.output
    data = json.loads(result.stdout)
    assert (data["target_genus"], data["points"]) == (3, 0)
    assert len(data["strata"]) == 42
    graphs = [StableCurveGraph.from_dict(d) for d in data["strata"]]
    assert len(set(graphs)) == 42
    codims = [d["codim"] for d in data["strata"]]
    assert codims == sorted(codims) and max(codims) == 6
    assert all(StableCurveGraph.from_dict(d).automorphisms == d["automorphisms"] for d in data["strata"])


def test_short_options_and_codim_limit():
    result = run("-t", "0", "-n", "5", "-k", "1", "-f", "json")
    data = json.loads(result.stdout)
    # codim 0 and the 2^4 - 5 - 1 = 10 boundary divisors of Mbar_{0,5} (classical)
    assert len(data["strata"]) == 11


def test_table():
    result = run("-t", "1", "-n", "2")
    assert result.exit_code == 0
    lines = result.stdout.splitlines()
    assert "Mbar_{1,2}: 5" in result.stdout
    assert any("g0{1}, g0{2} | 0-1^2" in line for line in lines)
    assert "|Aut|" in result.stdout


def test_csv():
    result = run("-t", "2", "-n", "0", "-f", "csv")
    rows = list(csv.DictReader(io.StringIO(result.stdout)))
    assert len(rows) == 7
    assert rows[0] == {"index": "1", "codim": "0", "vertices": "1", "automorphisms": "1", "notation": "g2"}


def test_latex():
    result = run("-t", "1", "-n", "1", "-f", "latex")
    assert result.exit_code == 0
    # the one table style of covertree: booktabs in a longtable, no typewriter font
    assert result.stdout.startswith("\\begin{longtable}") and "\\toprule" in result.stdout
    assert "\\hline" not in result.stdout and "\\texttt" not in result.stdout
    assert result.stdout.count("\\\\") == 3  # header and two strata
    # the loop 0-0 typeset as an edge (en dash), not as a subtraction
    assert "$g_{0}\\{1\\} \\allowbreak\\mid 0\\mbox{--}0$" in result.stdout


def test_output_file(tmp_path):
    target = tmp_path / "strata.json"
    result = run("-t", "1", "-n", "1", "-f", "json", "-o", str(target))
    assert result.exit_code == 0 and result.stdout == ""
    assert len(json.loads(target.read_text())["strata"]) == 2


@pytest.mark.parametrize(
    "args",
    [
        ("-t", "0", "-n", "2"),
        ("-t", "1", "-n", "0"),
        ("-t", "2", "-n", "0", "-k", "-1"),
        ("-t", "-1", "-n", "5"),
    ],
)
def test_bad_input_is_one_line_and_exit_2(args):
    result = run(*args)
    assert result.exit_code == 2
    assert result.stdout == ""
    assert len(result.stderr.strip().splitlines()) == 1
    assert result.stderr.startswith("covertree: error:")
    assert "Traceback" not in result.stderr


def test_missing_option_is_a_usage_error():
    result = run("-n", "3")
    assert result.exit_code == 2
    assert "--target-genus" in result.stderr
