"""The ``covertree series`` command through click's CliRunner."""

import json
import subprocess
import sys

from click.testing import CliRunner

from covertree.cli import main
from tests.quasimodular import f2_coefficients


def run(*args):
    return CliRunner().invoke(main, ["series", *args])


def test_genus_two_json_has_the_documented_shape():
    result = run("-g", "2", "-t", "1", "-D", "8", "-w", "6", "-f", "json")
    assert result.exit_code == 0, result.output
    doc = json.loads(result.stdout)
    assert list(doc) == ["family", "quantity", "terms", "basis", "identification"]
    assert doc["family"] == {"genus": 2, "target_genus": 1, "shapes": [], "max_degree": 8, "constant": "0",
                             "q_derivative": 0}
    assert set(doc["terms"][0]) == {"degree", "value", "coefficient", "profiles"}
    # 2 [q^d] F_2 (Dijkgraaf 1995; OEIS A170991)
    assert [t["value"] for t in doc["terms"]] == [str(2 * c) for c in f2_coefficients(9)[1:]]
    ident = doc["identification"]
    assert ident["found"] and ident["checked"] == 6 and ident["solved_with"] == 3 and ident["mismatch"] is None
    assert ident["coefficients"] == {"E2^3": "1/5184", "E2 E4": "-1/8640", "E6": "-1/12960"}
    assert [m["exponents"] for m in doc["basis"]["monomials"]] == [[3, 0, 0], [1, 1, 0], [0, 0, 1]]


def test_table_says_plainly_when_no_form_fits():
    result = run("-g", "2", "-t", "1", "-D", "8", "-w", "4")
    assert result.exit_code == 0, result.output
    assert "NO quasimodular form of weight 4 fits" in result.stdout


def test_unramified_covers_latex_and_csv():
    args = ("-g", "1", "-t", "1", "-p", "1^*", "-D", "6", "-w", "2", "--mixed", "-k", "1")
    latex = run(*args, "-f", "latex")
    assert latex.exit_code == 0 and r"\frac{1 - E_2}{24}" in latex.stdout
    csv = run(*args, "-f", "csv")
    # sigma_1(d)/d (index-d sublattices of Z^2, common knowledge) and d times it
    assert csv.stdout.splitlines()[:3] == ["degree,value,coefficient,profiles", "1,1,1,1", "2,3/2,3,1^2"]


def test_pullback_quantity_through_the_command():
    result = run("-g", "2", "-t", "1", "-D", "8", "-q", "pullback", "-s", "g0{1,2}, g1 | 0-1", "-c", "delta_1",
                 "-w", "4", "--mixed", "-f", "json")
    assert result.exit_code == 0, result.output
    doc = json.loads(result.stdout)
    assert doc["quantity"] == {"kind": "pullback", "stratum": "g0{1,2}, g1 | 0-1", "source": None,
                               "coefficient": "delta_1", "engine": "types"}
    assert doc["identification"]["found"]


def test_bad_input_is_one_line_and_exit_two(tmp_path):
    out = tmp_path / "s.json"
    for args in (["-g", "2", "-t", "1", "-D", "2", "-w", "6"], ["-g", "2", "-t", "1", "-D", "8", "-w", "5"],
                 ["-g", "2", "-t", "1", "-D", "8", "-w", "6", "-p", "2^"],
                 ["-g", "2", "-t", "1", "-D", "8", "-w", "6", "-q", "total"],
                 ["-g", "2", "-t", "1", "-D", "8", "-w", "6", "--constant", "x"]):
        result = run(*args, "-o", str(out))
        assert result.exit_code == 2, (args, result.output)
        assert result.stderr.count("\n") == 1 and result.stderr.startswith("covertree: error:")
        assert not out.exists()


def test_python_dash_m_runs_the_command_line():
    done = subprocess.run([sys.executable, "-m", "covertree", "series", "-g", "2", "-t", "1", "-D", "4", "-w", "6"],
                          capture_output=True, text=True, timeout=120)
    assert done.returncode == 0 and "identified as a quasimodular form of weight 6" in done.stdout
