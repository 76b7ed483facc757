"""The Python interface: results print the same JSON as the commands, are
immutable, exact, and display in notebooks."""

import dataclasses
import json
import subprocess
import sys
import xml.etree.ElementTree as ET
from fractions import Fraction

import pytest
from click.testing import CliRunner

import covertree as ct
from covertree.cli import main
from covertree.errors import InputError


def cli(*args) -> str:
    result = CliRunner().invoke(main, list(args))
    assert result.exit_code == 0, result.output
    return result.stdout


def same_text(api_text: str, cli_text: str) -> None:
    assert api_text.rstrip("\n") == cli_text.rstrip("\n")


PROBLEM = ("-g", "3", "-t", "1", "-d", "2")


@pytest.fixture(scope="module")
def problem():
    return ct.hurwitz_problem(degree=2, target_genus=1, genus=3)


def test_count_json_csv_latex_are_the_commands(problem):
    counts = ct.hurwitz_count(problem)
    for fmt, text in (("json", counts.to_json()), ("csv", counts.to_csv()), ("latex", counts.to_latex())):
        same_text(text, cli("count", *PROBLEM, "-f", fmt))
    assert counts.to_dict() == json.loads(counts.to_json())


def test_strata_are_the_commands():
    strata = ct.boundary_strata(2, 2, codim=2)
    same_text(strata.to_json(), cli("strata", "-t", "2", "-n", "2", "-k", "2", "-f", "json"))
    same_text(strata.to_csv(), cli("strata", "-t", "2", "-n", "2", "-k", "2", "-f", "csv"))


@pytest.mark.parametrize("engine", ["list", "types"])
def test_catalogue_json_is_the_commands(problem, engine):
    cat = ct.cover_catalogue(problem, codim=2, engine=engine)
    same_text(cat.to_json(), cli("catalogue", *PROBLEM, "-k", "2", "-e", engine, "-f", "json"))
    assert cat.to_dict() == json.loads(cat.to_json())
    assert not cat.failures


def test_catalogue_other_formats_are_the_commands(problem):
    cat = ct.cover_catalogue(problem, codim=1, stratum="g0{1,2,3,4} | 0-0")
    args = ("catalogue", *PROBLEM, "-s", "g0{1,2,3,4} | 0-0")
    for fmt, text in (("jsonl", cat.to_jsonl()), ("csv", cat.to_csv()), ("latex", cat.to_latex())):
        same_text(text, cli(*args, "-f", fmt))
    with pytest.raises(InputError, match="engine='list'"):
        ct.cover_catalogue(problem, engine="types").to_csv()
    with pytest.raises(InputError, match="engine 'fast'"):
        ct.cover_catalogue(problem, engine="fast")


@pytest.mark.parametrize("engine", ["list", "types"])
def test_pullback_is_the_commands(problem, engine):
    pb = ct.pullback_table(problem, engine=engine)
    same_text(pb.to_json(), cli("pullback", *PROBLEM, "-e", engine, "-f", "json"))
    same_text(pb.to_csv(), cli("pullback", *PROBLEM, "-e", engine, "-f", "csv"))
    row = pb.data.rows[0]
    assert pb.coefficient(row.base.graph.notation, "delta_0") == row.coefficients["delta_0"]
    with pytest.raises(InputError, match="not a row"):
        pb.coefficient("g1{1,2,3,4}", "delta_0")


def test_series_is_the_commands():
    s = ct.generating_series(2, 1, 8, 6)
    same_text(s.to_json(), cli("series", "-g", "2", "-t", "1", "-D", "8", "-w", "6", "-f", "json"))
    same_text(s.to_latex(), cli("series", "-g", "2", "-t", "1", "-D", "8", "-w", "6", "-f", "latex"))
    assert s.found and all(isinstance(c, Fraction) for c in s.coefficients)


def test_a_function_of_the_problem_can_be_the_quantity():
    # The number of labelled-preimage covers, |Aut| of each profile times H, is
    # still 2 F_2 here (the profiles (2,1^{d-2}) have |Aut| = (d-2)!, so no
    # form of weight 6 fits: the hook is really used).
    from math import prod
    s = ct.generating_series(2, 1, 8, 6, evaluate=lambda p: ct.hurwitz_count(p).connected
                             * prod(m.aut() for m in p.profiles))
    assert not s.found
    assert s.data.terms[3].value == 60 * 2 * 2  # d = 4: H = 60 (OEIS A170991), |Aut (2,1,1)| = 2 twice


def test_locus_class_is_the_commands():
    p = ct.hurwitz_problem(2, 1, genus=2)
    r = ct.locus_class(p, family={"delta_0": 10, "delta_1": 0})
    same_text(r.to_json(), cli("locus", "-g", "2", "-t", "1", "-d", "2", "--family", "delta_0=10,delta_1=0",
                               "-f", "json"))
    same_text(r.to_latex(), cli("locus", "-g", "2", "-t", "1", "-d", "2", "-f", "latex"))
    # the unordered class is the labelled one over the symmetry of the two simple points
    assert r.unordered == {k: v / 2 for k, v in r.labelled.items()} and r.consistent
    assert r.family == {"labelled": 10 * r.labelled["delta_0"], "unordered": 10 * r.unordered["delta_0"]}
    assert ct.locus_class(p, engine="list").labelled == r.labelled
    with pytest.raises(InputError, match="engine 'fast'"):
        ct.locus_class(p, engine="fast")


def test_cover_integral_is_the_commands():
    p = ct.hurwitz_problem(3, 1, genus=2)
    r = ct.cover_integral(p, source="delta_0", target="psi_1")
    same_text(r.to_json(), cli("integral", "-g", "2", "-t", "1", "-d", "3", "--source", "delta_0",
                               "--target", "psi_1", "-f", "json"))
    assert isinstance(r.value, Fraction) and r.value == ct.cover_integral(p, "delta_0", "psi_1", "list").value
    from covertree.locus.monomial import MonomialError
    with pytest.raises(MonomialError):
        ct.cover_integral(p, source="lambda^5")


def test_results_are_immutable(problem):
    for result in (ct.hurwitz_count(problem), ct.boundary_strata(1, 1), ct.cover_catalogue(problem),
                   ct.pullback_table(problem), ct.generating_series(2, 1, 4, 6),
               ct.locus_class(ct.hurwitz_problem(2, 1, genus=2)),
               ct.cover_integral(ct.hurwitz_problem(2, 0, genus=2), source="lambda^3")):
        with pytest.raises(dataclasses.FrozenInstanceError):
            result.data = None


def test_notebook_views_are_well_formed(problem):
    results = (ct.hurwitz_count(problem), ct.boundary_strata(1, 2), ct.cover_catalogue(problem),
               ct.pullback_table(problem), ct.generating_series(2, 1, 4, 6),
               ct.locus_class(ct.hurwitz_problem(2, 1, genus=2)),
               ct.cover_integral(ct.hurwitz_problem(2, 0, genus=2), source="lambda^3"))
    for result in results:
        table = ET.fromstring(result._repr_html_())
        assert table.tag == "table" and len(table.find("tbody")) >= 1
    for result in (results[0], *results[3:]):
        latex = result._repr_latex_()
        assert latex.startswith("$") and latex.endswith("$")


def test_the_public_names_are_listed_and_load_lazily():
    code = "import sys, covertree; print('covertree.api' in sys.modules); covertree.cover_catalogue; " \
           "print('covertree.api' in sys.modules)"
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert done.stdout.split() == ["False", "True"]
    assert "generating_series" in ct.__all__ and "graph_to_networkx" in dir(ct)
    with pytest.raises(AttributeError, match="no attribute 'nope'"):
        ct.nope


def test_the_readme_session_runs():
    import doctest
    from pathlib import Path

    text = (Path(__file__).parents[1] / "README.md").read_text()
    block = text.split("## From Python", 1)[1].split("```python", 1)[1].split("```", 1)[0]
    test = doctest.DocTestParser().get_doctest(block, {}, "README From Python", "README.md", 0)
    runner = doctest.DocTestRunner(optionflags=doctest.ELLIPSIS)
    runner.run(test)
    assert runner.summarize(verbose=False).failed == 0 and test.examples
