"""The ``covertree catalogue`` command through click's CliRunner."""

from __future__ import annotations

import csv
import io
import json
import os
from collections import defaultdict
from fractions import Fraction

import pytest
from click.testing import CliRunner

from covertree.cli import main

# genus-2 double covers of an elliptic curve: H = 2 (OEIS A170991, d = 2)
E2 = ["-g", "2", "-t", "1", "-d", "2"]


def run(*args):
    return CliRunner().invoke(main, ["catalogue", *args])


def test_table():
    result = run(*E2, "-k", "2")
    assert result.exit_code == 0, result.output
    out = result.stdout
    for notation in ["g1{1,2}", "g0{1,2} | 0-0", "g0{1,2}, g1 | 0-1", "g0{1}, g0{2} | 0-1^2"]:
        assert notation in out
    assert "delta_0" in out and "delta_1" in out and "holds" in out
    assert "FAILS" not in out


def test_json():
    result = run(*E2, "-f", "json")
    assert result.exit_code == 0
    doc = json.loads(result.stdout)
    assert doc["hurwitz_number"] == "2"
    assert [s["base"]["notation"] for s in doc["strata"]] == ["g1{1,2}", "g0{1,2} | 0-0", "g0{1,2}, g1 | 0-1"]
    assert all(s["identity"] for s in doc["strata"])


def test_jsonl_weights_add_up_per_base():
    # genus-2 triple covers of an elliptic curve: H = 16 (Dijkgraaf 1995; OEIS A170991, d = 3)
    result = run("-g", "2", "-t", "1", "-d", "3", "-k", "2", "-f", "jsonl")
    assert result.exit_code == 0, result.stderr
    totals = defaultdict(Fraction)
    lines = result.stdout.splitlines()
    assert lines
    for line in lines:
        record = json.loads(line)
        totals[record["base"]["notation"]] += Fraction(record["weight"])
    assert len(totals) == 5  # the strata of Mbar_{1,2} (by hand)
    assert set(totals.values()) == {Fraction(16)}


def test_csv():
    result = run(*E2, "-f", "csv")
    rows = list(csv.reader(io.StringIO(result.stdout)))
    assert rows[0][:3] == ["base", "base_codim", "orbit_size"]
    assert len(rows) == 1 + 4 + 3 + 4  # the hand lists of test_hand_examples


def test_latex():
    result = run(*E2, "-f", "latex")
    assert result.exit_code == 0
    assert r"\begin{longtable}" in result.stdout and r"\documentclass" not in result.stdout
    result = run(*E2, "-f", "latex", "--standalone")
    assert result.stdout.startswith(r"\documentclass") and r"\end{document}" in result.stdout
    assert r"\frac{1}{2}" in result.stdout


def test_one_stratum():
    result = run("-g", "2", "-t", "0", "-d", "2", "-s", "g0{1,2,3}, g0{4,5,6} | 0-1", "-f", "json")
    assert result.exit_code == 0
    [s] = json.loads(result.stdout)["strata"]
    assert s["orbit_size"] == 10 and s["n_covers"] == 1
    assert s["covers"][0]["stable_name"] == "delta_1"


def test_labeled_lists_more_strata_with_matching_orbit_sizes():
    base = ["-g", "2", "-t", "0", "-d", "2", "-k", "1", "-f", "json"]
    orbits = json.loads(run(*base).stdout)["strata"]
    labelled = json.loads(run(*base, "--labeled").stdout)["strata"]
    # Mbar_{0,6}: 1 open stratum and 2^5 - 6 - 1 = 25 divisors (classical)
    assert len(labelled) == 26 > len(orbits) == 3
    assert sum(s["orbit_size"] for s in orbits) == len(labelled)
    assert all(s["orbit_size"] == 1 for s in labelled)


def test_max_covers_exits_3(tmp_path):
    result = run(*E2, "-m", "1")
    assert result.exit_code == 3
    assert len(result.stderr.strip().splitlines()) == 1 and "limit" in result.stderr
    target = tmp_path / "out.jsonl"
    result = run(*E2, "-m", "1", "-f", "jsonl", "-o", str(target))
    assert result.exit_code == 3
    assert os.listdir(tmp_path) == []  # no partial output, no temporary file


@pytest.mark.parametrize("fmt", ["json", "jsonl", "csv", "latex", "table"])
def test_output_file(tmp_path, fmt):
    target = tmp_path / f"cat.{fmt}"
    result = run(*E2, "-f", fmt, "-o", str(target))
    assert result.exit_code == 0, result.stderr
    assert result.stdout == ""
    assert os.listdir(tmp_path) == [target.name]
    text = target.read_text(encoding="utf-8")
    assert text == run(*E2, "-f", fmt).stdout
    if fmt == "json":
        assert json.loads(text)["hurwitz_number"] == "2"


@pytest.mark.parametrize("args,named", [
    (["-t", "1", "-d", "3", "-p", "2,1,1"], "2,1,1"),  # profile not summing to the degree
    (["-t", "1", "-d", "0"], "0"),  # non-positive degree
    (["-t", "1", "-d", "-2"], "-2"),
    (["-g", "0", "-t", "1", "-d", "2"], "genus 0"),  # impossible genus
    (["-t", "0", "-d", "2", "-p", "2"], "genus -1/2"),  # Riemann-Hurwitz parity
    (["-t", "0", "-d", "2", "-p", "2", "-p", "2"], "not stable"),  # unstable target
    (E2 + ["-s", "g0{1,2} | 0-x"], "'x'"),  # unparsable stratum
    (E2 + ["-s", "g1{1,2} | 0-0"], "g1{1,2} | 0-0"),  # genus 2, not the target's 1
    (E2 + ["-s", "g0{1}, g0{2} | 0-1"], "g0{1}, g0{2} | 0-1"),  # genus 0
    (E2 + ["-s", "g1{1,3}"], "1,3"),  # legs do not match the profiles
    (E2 + ["-s", "g1{1}"], "g1{1}"),
    (E2 + ["-k", "-1"], "-1"),
    (E2 + ["-f", "pdf"], "pdf"),
])
def test_bad_input(tmp_path, args, named):
    target = tmp_path / "out.json"
    result = run(*args, "-o", str(target))
    assert result.exit_code == 2, (result.stdout, result.stderr)
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    assert named in lines[0]
    assert "Traceback" not in result.stderr
    assert result.exception is None or isinstance(result.exception, SystemExit)
    assert os.listdir(tmp_path) == []
