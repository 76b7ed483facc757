"""Output a researcher pastes as is: terminal width, grouped rows, one
vocabulary across commands, one order and one way to address a cover."""

import csv
import io
import json

import pytest
from click.testing import CliRunner

import covertree.cli.render as render
from covertree.cli import main
from covertree.graphs.curve_graph import StableCurveGraph

PROBLEM = ["-g", "2", "-t", "1", "-d", "3"]


def run(*args, env=None, **kwargs):
    result = CliRunner().invoke(main, list(args), env=env, **kwargs)
    return result


def _source_notations(problem=PROBLEM):
    doc = json.loads(run("catalogue", *problem, "-f", "json").stdout)
    return {c["source"]["notation"] for s in doc["strata"] for c in s["covers"]}


@pytest.mark.parametrize("columns", ["250", "120", "60"])
def test_notation_cells_are_never_broken(columns):
    # Every graph notation that is printed appears whole on one line, at any width;
    # narrow tables leave columns out and say so instead of breaking cells.
    text = run("catalogue", *PROBLEM, env={"COLUMNS": columns}).stdout
    cells = {cell.strip() for line in text.splitlines() for cell in line.split("│")}
    bases = [s["base"]["notation"] for s in json.loads(run("catalogue", *PROBLEM, "-f", "json").stdout)["strata"]]
    assert all(b in text for b in bases)
    if columns == "60":
        assert "left out at width 60" in text and "--format csv or json" in text
        assert "source" not in [c.strip() for c in text.split("┃")]  # the optional column went first
    else:
        assert _source_notations() <= cells or "columns source" in text
    if columns == "250":
        assert _source_notations() <= cells and "left out" not in text


def test_the_terminal_width_is_used():
    wide = run("catalogue", *PROBLEM, "--rows", "all", env={"COLUMNS": "250"}).stdout
    narrow = run("catalogue", *PROBLEM, "--rows", "all", env={"COLUMNS": "90"}).stdout
    assert max(map(len, narrow.splitlines())) <= 90
    assert max(map(len, wide.splitlines())) > 90


def test_grouped_rows_add_up_to_the_stratum():
    # Default table: identical rows collapse; their counts add up to the covers
    # and the summed weights to the total (the Hurwitz number: 16 here, see
    # tests/catalogue for the published check).
    text = run("catalogue", *PROBLEM, env={"COLUMNS": "250"}).stdout
    doc = json.loads(run("catalogue", *PROBLEM, "-f", "json", "--rows", "grouped").stdout)
    for s in doc["strata"]:
        assert s["grouped"] is True and s["n_groups"] == len(s["covers"])
        assert sum(c["count"] for c in s["covers"]) == s["n_covers"]
        numbers = sorted(n for c in s["covers"] for n in c["cover_numbers"])
        assert numbers == list(range(1, s["n_covers"] + 1))
        total = sum(json_fraction(c["group_weight"]) for c in s["covers"])
        assert total == json_fraction(s["total_weight"]) == 16
    assert "1 row for 16 covers" in text
    full = json.loads(run("catalogue", *PROBLEM, "-f", "json").stdout)
    assert all("count" not in c for s in full["strata"] for c in s["covers"])
    assert sum(len(s["covers"]) for s in full["strata"]) == 34


def json_fraction(text):
    from fractions import Fraction
    return Fraction(text)


def test_all_rows_are_available():
    grouped = run("catalogue", *PROBLEM, env={"COLUMNS": "250"}).stdout
    every = run("catalogue", *PROBLEM, "--rows", "all", env={"COLUMNS": "250"}).stdout
    rows = [line for line in every.splitlines() if line.startswith("│")]
    assert len(rows) == 34 + 6  # 34 covers, 6 landing rows
    assert len([line for line in grouped.splitlines() if line.startswith("│")]) < len(rows)


def test_latex_is_grouped_by_default():
    latex = run("catalogue", *PROBLEM, "-f", "latex").stdout
    every = run("catalogue", *PROBLEM, "-f", "latex", "--rows", "all").stdout
    assert r"$16\times$" in latex and r"$16\times$" not in every and r"$1\times$" not in every
    assert every.count(r" \\") > latex.count(r" \\")


def test_grouping_is_refused_where_it_has_no_meaning():
    result = run("catalogue", *PROBLEM, "-f", "csv", "--rows", "grouped")
    assert result.exit_code == 2 and "--rows grouped" in result.stderr and "csv" in result.stderr


def test_jsonl_has_the_order_and_numbers_of_the_table():
    doc = json.loads(run("catalogue", *PROBLEM, "-f", "json").stdout)
    lines = [json.loads(x) for x in run("catalogue", *PROBLEM, "-f", "jsonl").stdout.splitlines()]
    expected = [(i, k, c["source"]["notation"], c["edge_profiles"], c["local_structure"])
                for i, s in enumerate(doc["strata"], start=1) for k, c in enumerate(s["covers"], start=1)]
    got = [(r["stratum_number"], r["cover_number"], r["source"]["notation"], r["edge_profiles"],
            r["local_structure"]) for r in lines]
    assert got == expected


def test_draw_picks_cover_k_of_stratum_s(tmp_path, monkeypatch):
    pytest.importorskip("matplotlib")
    jsonl = tmp_path / "c.jsonl"
    jsonl.write_text(run("catalogue", *PROBLEM, "-f", "jsonl").stdout)
    picked = {}
    import covertree.export.draw as draw

    monkeypatch.setattr(draw, "draw_pair", lambda *a, **k: picked.setdefault("call", repr((a, k))))
    doc = json.loads(run("catalogue", *PROBLEM, "-f", "json").stdout)
    result = run("draw", "--cover", str(jsonl), "--pick", "3:5", "-o", str(tmp_path / "x.svg"))
    assert result.exit_code == 0, result.output
    assert doc["strata"][2]["covers"][4]["source"]["notation"] in picked["call"]
    missing = run("draw", "--cover", str(jsonl), "--pick", "3:99", "-o", str(tmp_path / "x.svg"))
    assert missing.exit_code == 2 and "stratum 3 has 10 covers" in missing.stderr
    too_far = run("draw", "--cover", str(jsonl), "--line", "99", "-o", str(tmp_path / "x.svg"))
    assert too_far.exit_code == 2 and "only 34 lines" in too_far.stderr


def test_every_json_document_has_one_layout():
    commands = [["count", *PROBLEM], ["strata", "-t", "0", "-n", "4"], ["catalogue", *PROBLEM],
                ["catalogue", *PROBLEM, "-e", "types"], ["pullback", *PROBLEM],
                ["sweep", "-g", "2", "-t", "1", "-d", "2..3", "-q"],
                ["locus", "-g", "2", "-t", "1", "-d", "2"],
                ["series", "-t", "1", "-g", "1", "-p", "1^*", "-D", "4", "-w", "2"]]
    for args in commands:
        result = run(*args, "-f", "json")
        assert result.exit_code == 0, (args, result.output)
        text = result.stdout.rstrip("\n")
        assert text == json.dumps(json.loads(text), indent=2), args


def test_sweep_and_pullback_do_not_share_a_header():
    # sweep: weight whose stable source lies in delta_i; pullback: c(D, delta_i)
    sweep_csv = run("sweep", "-g", "2", "-t", "1", "-d", "2", "-q", "-f", "csv").stdout
    header = next(csv.reader(io.StringIO(sweep_csv)))
    assert "delta_0" not in header and "lands_in_delta_0" in header and "lands_elsewhere" in header
    table = run("sweep", "-g", "2", "-t", "1", "-d", "2", "-q", env={"COLUMNS": "250"}).stdout
    assert "lands in delta_0" in table
    pullback = run("pullback", "-g", "2", "-t", "1", "-d", "2", env={"COLUMNS": "250"}).stdout
    assert "delta_0" in pullback and "lands in" not in pullback
    assert "c(D, delta_i)" in run("sweep", "--help").stdout.replace("\n", " ").replace("  ", " ")


def test_sweep_json_has_the_base_as_a_graph_too():
    doc = json.loads(run("sweep", "-g", "2", "-t", "1", "-d", "2", "-q", "-f", "json").stdout)
    for row in doc["strata"]:
        assert isinstance(row["base"], str)  # the contract stays
        assert StableCurveGraph.from_dict(row["base_graph"]) == StableCurveGraph.parse(row["base"])


def test_one_profile_form_per_medium():
    problem = ["-t", "0", "-d", "4", "-p", "2,1^2", "-p", "2,1^2", "-p", "4", "-p", "4"]
    table = run("count", *problem, env={"COLUMNS": "250"}).stdout
    csv_text = run("count", *problem, "-f", "csv").stdout
    latex = run("count", *problem, "-f", "latex").stdout
    assert "2,1^2; 2,1^2; 4; 4" in table
    assert "2,1,1;2,1,1;4;4" in csv_text
    assert r"$2,1^{2};\allowbreak\ 2,1^{2};\allowbreak\ 4;\allowbreak\ 4$" in latex
    cat = run("catalogue", "-g", "2", "-t", "1", "-d", "3", "-f", "csv").stdout
    assert "1,1,1" in cat and "1^3" not in cat
    cat_table = run("catalogue", "-g", "2", "-t", "1", "-d", "3", env={"COLUMNS": "250"}).stdout
    assert "1^3" in cat_table and "1,1,1" not in cat_table


def test_command_summaries_are_whole():
    text = run("--help").stdout
    commands = text.split("Commands:")[1].strip().splitlines()
    assert len(commands) >= 11
    assert not any(line.rstrip().endswith("...") for line in commands)


def test_slow_list_runs_suggest_the_types_engine_once(monkeypatch):
    monkeypatch.setattr(render, "SLOW_HINT_SECONDS", -1.0)
    result = run("catalogue", *PROBLEM, "-f", "json")
    assert result.exit_code == 0
    assert result.stderr.count("--engine types gives the same numbers") == 1
    assert json.loads(result.stdout)  # stdout untouched
    quiet = run("catalogue", *PROBLEM, "-f", "csv")
    assert "--engine types" not in quiet.stderr  # types cannot give csv


def test_an_interrupted_sweep_says_what_is_kept(tmp_path, monkeypatch):
    import covertree.cli.sweep as sweep_cli
    from covertree.sweep.tasks import compute_task

    def interrupted(tasks, backend, store, on_done):
        for task in tasks[:2]:
            store.save(task, compute_task(task))
            on_done(task, False)
        raise KeyboardInterrupt

    monkeypatch.setattr(sweep_cli, "run_tasks", interrupted)
    store = tmp_path / "runs.db"
    result = run("sweep", "-g", "2", "-t", "1", "-d", "2..4", "--store", str(store), "-q")
    assert result.exit_code == 130
    # 3 degrees x 3 base strata = 9 tasks
    assert "2 of 9 tasks are safely in the store" in result.stderr
    assert "run the same command with --store" in result.stderr and "other 7" in result.stderr
    assert result.stderr.count("\n") == 1
    monkeypatch.undo()
    resumed = run("sweep", "-g", "2", "-t", "1", "-d", "2..4", "--store", str(store))
    assert resumed.exit_code == 0 and "7 computed, 2 found in the store" in resumed.stderr


@pytest.mark.parametrize("problem, contracted", [
    (["-g", "1", "-t", "0", "-d", "2"], True),             # no Mbar_1
    (["-g", "1", "-t", "0", "-d", "2", "--mark", "1"], False),  # Mbar_{1,1} exists
    (["-g", "2", "-t", "0", "-d", "2"], False),
])
def test_contracted_source_is_said_plainly(problem, contracted):
    # A genus-1 source without marks has no stable model: every medium says that
    # what it prints is the contracted source.
    table = run("catalogue", *problem, env={"COLUMNS": "200"}).stdout
    doc = json.loads(run("catalogue", *problem, "-f", "json").stdout)
    latex = run("catalogue", *problem, "-f", "latex").stdout
    assert doc["problem"]["contracted_source"] is contracted
    assert ("contracted source" in table) is contracted
    assert ("stable source" in table) is not contracted
    assert ("not a point of a moduli space" in table) is contracted
    assert ("contracted source" in latex) is contracted
    if contracted:
        sources = {c["stable_source"]["notation"] for s in doc["strata"] for c in s["covers"]}
        assert sources == {"g1", "g0 | 0-0"}


def test_a_smooth_cover_is_drawn_with_its_degree(tmp_path, monkeypatch):
    # A cover over the open stratum has no node profiles to read the degree from:
    # the JSON line carries it, and the arrow is marked with it.
    pytest.importorskip("matplotlib")
    import covertree.export.draw as drawing

    lines = run("catalogue", *PROBLEM, "-f", "jsonl").stdout.splitlines()
    assert lines and {json.loads(x)["degree"] for x in lines} == {3}
    (tmp_path / "c.jsonl").write_text("\n".join(lines) + "\n")
    seen = []
    monkeypatch.setattr(drawing, "draw_pair", lambda *a, **k: seen.append(a[4]))
    result = run("draw", "-c", str(tmp_path / "c.jsonl"), "--pick", "1:1", "-o", str(tmp_path / "c.png"))
    assert result.exit_code == 0, result.output
    assert json.loads(lines[0])["edge_profiles"] == [] and seen == [3]
