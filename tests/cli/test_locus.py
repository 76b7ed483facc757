"""The ``covertree locus`` and ``covertree integral`` commands through click's test runner."""

import json

import pytest
from click.testing import CliRunner

from covertree.cli import main


def run(*args):
    return CliRunner().invoke(main, list(args))


def test_locus_json_contract_and_family():
    result = run("locus", "-g", "2", "-t", "1", "-d", "2", "--family", "delta_0=10,delta_1=0", "-f", "json")
    assert result.exit_code == 0, result.output
    data = json.loads(result.stdout)
    assert {"problem", "dimension", "class", "class_unordered", "tests", "consistent", "family"} <= set(data)
    assert "codim" not in data["problem"] and data["problem"]["genus"] == 2
    assert data["dimension"] == 2 and data["consistent"] is True
    assert set(data["class"]) == set(data["class_unordered"]) == {"delta_0", "delta_1"}
    # labelled class 6 delta_0 + 24 delta_1; the pencil of the five fixed points meets it 4 * 15 times
    assert data["class"] == {"delta_0": "6", "delta_1": "24"} and data["family"] == "60"
    assert data["class_unordered"] == {"delta_0": "3", "delta_1": "12"}
    for row in data["tests"]:
        assert set(row) == {"monomial", "cover_space", "from_class"} and row["cover_space"] == row["from_class"]


def test_locus_table_and_latex():
    table = run("locus", "-g", "2", "-t", "1", "-d", "3")
    assert table.exit_code == 0 and "32 delta_0 + 96 delta_1" in table.stdout
    latex = run("locus", "-g", "2", "-t", "1", "-d", "3", "-f", "latex")
    assert latex.exit_code == 0 and latex.stdout.startswith(r"\[") and r"32\,\delta_{0}" in latex.stdout


@pytest.mark.parametrize("args,needle", [
    (("locus", "-g", "2", "-t", "0", "-d", "2"), "not a divisor"),
    (("locus", "-g", "2", "-t", "1", "-d", "2", "--family", "delta_0=ten"), "delta_0=ten"),
    (("locus", "-g", "2", "-t", "1", "-d", "2", "--family", "delta_7=1,delta_0=1,delta_1=0"), "delta_7"),
    (("locus", "-g", "2", "-t", "1", "-d", "2", "--family", "delta_0=1"), "delta_1"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "lambda^2"), "dimension 3"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "lambda^2 theta"), "column 10"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "lambda^0 lambda^3"), "power"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "delta_2 lambda^2"), "delta_2"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--target", "psi_9 psi_1 psi_2"), "psi_9"),
    (("integral", "-g", "2", "-t", "0", "-d", "2", "--target", "lambda^3"), "--target"),
])
def test_bad_input_is_one_line_exit_2(args, needle):
    result = run(*args)
    assert result.exit_code == 2, result.output
    assert needle in result.stderr and len(result.stderr.strip().splitlines()) == 1


def test_integral_json_contract():
    result = run("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "lambda * lambda^2", "-f", "json")
    assert result.exit_code == 0, result.output
    data = json.loads(result.stdout)
    assert set(data) == {"problem", "source", "target", "value"}
    # 6! labelled double covers per genus-2 curve: 720 * 1/2880 (Mumford 1983)
    assert data["source"] == "lambda^3" and data["target"] == "1" and data["value"] == "1/4"


def test_both_engines_agree():
    a = run("integral", "-g", "2", "-t", "1", "-d", "3", "--source", "delta_0 delta_1", "-e", "list")
    b = run("integral", "-g", "2", "-t", "1", "-d", "3", "--source", "delta_0 delta_1", "-e", "types")
    assert a.exit_code == b.exit_code == 0 and a.stdout == b.stdout
