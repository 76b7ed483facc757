"""The --mark option on catalogue, pullback, locus and integral."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from covertree.cli import main


def run(*args):
    return CliRunner().invoke(main, list(args))


W = ["-g", "2", "-t", "0", "-d", "2", "--mark", "1"]


def test_locus_json_keys_for_a_marked_weierstrass_point():
    result = run("locus", *W, "-f", "json", "--family", "psi_1=2,lambda=0,delta_0=0,delta_1_{}=0")
    assert result.exit_code == 0, result.output
    doc = json.loads(result.output)
    assert list(doc["class_unordered"]) == ["lambda", "psi_1", "delta_0", "delta_1_{}"]
    assert doc["class_unordered"] == {"lambda": "-1", "psi_1": "3", "delta_0": "0", "delta_1_{}": "-1"}
    assert doc["symmetry"] == 120 and doc["problem"]["marks"] == [[1, 2]]
    assert doc["basis"] == ["lambda", "psi_1", "delta_1_{}"] and doc["family_unordered"] == "6"


def test_pullback_and_catalogue_take_marks():
    doc = json.loads(run("pullback", *W, "-f", "json").output)
    assert set(doc["rows"][0]["coefficients"]) == {"delta_0", "delta_1_{}"}
    cat = json.loads(run("catalogue", *W, "-k", "1", "-f", "json").output)
    assert cat["strata"][0]["covers"][0]["stable_source"]["notation"] == "g2{1}"


def test_integral_with_source_psi():
    marks = [x for j in range(1, 7) for x in ("--mark", str(j))]
    result = run("integral", "-g", "2", "-t", "0", "-d", "2", *marks, "--source", "psi_1 psi_2 psi_3")
    assert result.exit_code == 0 and result.output.strip() == "3/8"


@pytest.mark.parametrize("args, needle", [
    (["--mark", "7"], "names branch point 7"),
    (["--mark", "1:3"], "no point of index 3"),
    (["--mark", "1", "--mark", "1"], "already marked"),
    (["--mark", "1:2^2"], "has 1"),
    (["--mark", "one"], "is not J, J:e or J:e^c"),
])
@pytest.mark.parametrize("command", ["catalogue", "pullback", "locus", "integral"])
def test_bad_marks_are_one_line_errors(command, args, needle):
    result = run(command, "-g", "2", "-t", "0", "-d", "2", *args)
    assert result.exit_code == 2
    assert needle in result.output and result.output.count("\n") == 1 and "Traceback" not in result.output


def test_psi_of_the_source_needs_a_mark():
    result = run("integral", "-g", "2", "-t", "0", "-d", "2", "--source", "psi_1 lambda^2")
    assert result.exit_code == 2 and "--mark" in result.output


def test_inconsistent_family_is_refused():
    result = run("locus", *W, "--family", "psi_1=2,lambda=0,delta_0=1,delta_1_{}=0")
    assert result.exit_code == 2 and "10 lambda - 2 delta_1_{}" in result.output


def test_readme_marked_weierstrass_example_is_true():
    from pathlib import Path

    readme = (Path(__file__).parents[2] / "README.md").read_text()
    command = 'covertree locus -g 2 -t 0 -d 2 --mark 1 --family "psi_1=2,lambda=0,delta_0=0,delta_1_{}=0"'
    assert command in readme
    out = run("locus", *W, "--family", "psi_1=2,lambda=0,delta_0=0,delta_1_{}=0").output
    for line in ("-120 lambda + 360 psi_1 - 120 delta_1_{}", "-lambda + 3 psi_1 - delta_1_{}"):
        assert line in readme and line in out
