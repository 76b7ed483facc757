"""The ``covertree count`` command through click's CliRunner."""

import csv
import io
import json

import pytest
from click.testing import CliRunner

from covertree.cli import main


def run(*args):
    return CliRunner().invoke(main, ["count", *args])


def test_genus_two_double_covers_of_elliptic_curve_json():
    # two double covers up to the pairs (a, b) in S_2: 4 / 2! = 2 (OEIS A170991, d = 2)
    result = run("--genus", "2", "--target-genus", "1", "--degree", "2", "--format", "json")
    assert result.exit_code == 0, result.output
    data = json.loads(result.stdout)
    assert data == {
        "genus": 2,
        "target_genus": 1,
        "degree": 2,
        "profiles": [[2], [2]],
        "connected": "2",
        "disconnected": "2",
    }


def test_short_options_and_given_profiles_first():
    result = run("-g", "0", "-t", "0", "-d", "3", "-p", "3", "-f", "json")
    assert result.exit_code == 0
    data = json.loads(result.stdout)
    # Hurwitz 1891: H_0((3)) = 2!/1 * 3^{-2} * 27/6 = 1
    assert data["profiles"] == [[3], [2, 1], [2, 1]]
    assert data["connected"] == "1" and data["disconnected"] == "1"


def test_profiles_complete_without_genus():
    result = run("-t", "0", "-d", "4", "-p", "2,1^2", "-p", "3,1", "-p", "4", "-p", "2^2", "-f", "json")
    assert result.exit_code == 0
    data = json.loads(result.stdout)
    assert data["genus"] == 1
    assert data["profiles"] == [[2, 1, 1], [3, 1], [4], [2, 2]]


def test_fraction_output():
    # unramified covers of a genus-2 surface, degree 2: 15 index-2 subgroups / 2
    result = run("-t", "2", "-d", "2", "-p", "1^2", "-f", "json")
    data = json.loads(result.stdout)
    assert data["connected"] == "15/2" and data["disconnected"] == "8"


def test_table():
    result = run("-g", "2", "-t", "1", "-d", "3")
    assert result.exit_code == 0
    assert "connected" in result.stdout and "16" in result.stdout  # OEIS A170991, d = 3
    assert "2,1; 2,1" in result.stdout  # one profile form in tables: the --profile syntax


def test_csv():
    result = run("-t", "2", "-d", "2", "-p", "1,1", "-f", "csv")
    rows = list(csv.reader(io.StringIO(result.stdout)))
    assert rows[0] == ["genus", "target_genus", "degree", "profiles", "connected", "disconnected"]
    assert rows[1] == ["3", "2", "2", "1,1", "15/2", "8"]


def test_latex():
    result = run("-t", "2", "-d", "2", "-p", "1,1", "-f", "latex")
    text = result.stdout
    assert text.startswith(r"\begin{tabular}") and r"\toprule" in text and r"\bottomrule" in text
    assert r"$\frac{15}{2}$" in text and "$1^{2}$" in text


def test_output_file(tmp_path):
    target = tmp_path / "count.json"
    result = run("-g", "2", "-t", "1", "-d", "2", "-f", "json", "-o", str(target))
    assert result.exit_code == 0 and result.stdout == ""
    assert json.loads(target.read_text())["connected"] == "2"


@pytest.mark.parametrize(
    "args, needle",
    [
        (["-t", "0", "-d", "3", "-p", "2,2"], "2,2"),  # profile does not sum to the degree
        (["-t", "0", "-d", "0"], "degree 0"),  # non-positive degree
        (["-t", "0", "-d", "-3"], "degree -3"),
        (["-t", "0", "-d", "3", "-p", "2,1"], "-3/2"),  # fractional Riemann-Hurwitz genus
        (["-g", "0", "-t", "0", "-d", "3", "-p", "3", "-p", "3", "-p", "3"], "genus 0"),  # negative
        (["-g", "-1", "-t", "0", "-d", "2"], "genus -1"),
        (["-t", "0", "-d", "3", "-p", "3", "-p", "3"], "genus 0 with 2 marked"),  # unstable (0, 2)
        (["-t", "1", "-d", "3"], "genus 1 with 0 marked"),  # unstable (1, 0)
        (["-t", "0", "-d", "3", "-p", "2,x"], "2,x"),  # malformed profile text
        (["-t", "0", "-d", "3", "-p", "0,3"], "0,3"),
        (["-t", "0", "-d", "x"], "'x'"),
    ],
)
def test_bad_input(args, needle):
    result = run(*args)
    assert result.exit_code == 2
    assert result.stdout == ""
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    assert needle in lines[0]
    assert "Traceback" not in result.stderr
    assert not isinstance(result.exception, Exception) or isinstance(result.exception, SystemExit)


def test_help_uses_short_h():
    result = run("-h")
    assert result.exit_code == 0 and "--target-genus" in result.stdout


def test_count_starts_without_the_other_commands():
    # the commands' modules load on first use: count needs neither the
    # enumeration machinery, sympy nor rich (for a non-table format)
    import subprocess
    import sys

    code = (
        "import sys; from covertree.cli import main\n"
        "try:\n    main(['count', '-g', '2', '-t', '1', '-d', '3', '-f', 'csv'])\n"
        "except SystemExit:\n    pass\n"
        "print(sorted(m for m in ('sympy', 'rich', 'covertree.catalogue', 'covertree.graphs.enumerate')"
        " if m in sys.modules), file=sys.stderr)"
    )
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert done.stderr.strip() == "[]"
    assert done.stdout.splitlines()[1].split(",")[-2] == "16"  # OEIS A170991: 16 at d = 3
