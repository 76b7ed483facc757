"""The ``covertree catalogue`` command: every admissible cover over the boundary."""

from __future__ import annotations

import sys

import click
from rich.table import Table

from covertree.catalogue.catalogue import (
    DEFAULT_MAX_COVERS, Catalogue, StratumResult, build_catalogue, iter_stratum, problem_hurwitz, select_strata,
)
from covertree.catalogue.grouping import CoverGroup, group_covers
from covertree.catalogue.feasibility import check_cover_count
from covertree.cli.limits import deadline, max_work_option, time_limit_option
from covertree.cli.params import PROFILE, AtomicOutput, OneLineCommand, emit, format_option, output_option
from covertree.catalogue.covers import divisor_name
from covertree.catalogue.local_structure import local_structure
from covertree.cli.render import fitted_table, table_text, watched
from covertree.export.catalogue import (
    catalogue_to_csv, catalogue_to_json, catalogue_to_latex, contracted_note, source_heading, stratum_jsonl,
)
from covertree.errors import InputError
from covertree.export.rational import rational_str
from covertree.export.words import count_noun, profiles_text
from covertree.export.tallies import tallies_to_json
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.cost import check_count
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import TallyCatalogue, tally_catalogue


def problem_options(func):
    """The options naming a Hurwitz problem (shared by catalogue-like commands)."""
    options = [
        click.option("--genus", "-g", "genus", type=int, default=None,
                     help="Genus of the connected source; missing branch points are simple."),
        click.option("--target-genus", "-t", "target_genus", type=int, required=True, help="Genus of the target."),
        click.option("--degree", "-d", "degree", type=int, required=True, help="Degree of the cover."),
        click.option("--profile", "-p", "profiles", type=PROFILE, multiple=True,
                     help="Profile over the next branch point, e.g. 3,1 (repeatable, in order)."),
        click.option("--mark", "marks", multiple=True, metavar="J[:e[^c]]",
                     help="Mark points of the source (legs 1..n, by branch point then index): J every "
                          "ramified point over branch point J, J:e one point of index e, J:e^c c of them "
                          "(repeatable)."),
    ]
    for option in reversed(options):
        func = option(func)
    return func


@click.command("catalogue", cls=OneLineCommand,
               short_help="Every admissible cover over each boundary stratum, checked.")
@problem_options
@click.option("--codim", "-k", "codim", type=click.IntRange(min=0), default=1, show_default=True,
              help="List the base strata of codimension up to this (0 = smooth covers only).")
@click.option("--stratum", "-s", "stratum", default=None, help="Only this base stratum (graph notation).")
@click.option("--labeled", "-l", is_flag=True, help="List every labelled stratum, not one per orbit.")
@click.option("--max-covers", "-m", "max_covers", type=click.IntRange(min=1), default=DEFAULT_MAX_COVERS,
              show_default=True, help="Stop with an error rather than list more covers than this.")
@click.option("--standalone", is_flag=True, help="LaTeX, TikZ: a complete document.")
@click.option("--engine", "-e", "engine", type=click.Choice(["list", "types"]), default="list", show_default=True,
              help="list: every cover; types: per-stratum and per-source tallies from combinatorial types "
                   "(no covers listed, for large degree; table or json only).")
@click.option("--rows", "rows", type=click.Choice(["grouped", "all"]), default=None,
              help="grouped: covers whose rows agree in every printed column as one row with their count "
                   "and summed weight; all: one row per cover.  [default: grouped for table and latex, "
                   "all for json, jsonl, csv, tikz]")
@max_work_option
@time_limit_option
@format_option(["table", "json", "jsonl", "csv", "latex", "tikz"])
@output_option
def command(genus, target_genus, degree, profiles, marks, codim, stratum, labeled, max_covers, standalone, engine,
            rows, max_work, time_limit, fmt, output):
    """List every admissible cover over a fixed curve of each boundary stratum of
    the target: source and stable source, |Aut|, multiplicity, weight; check
    that each stratum's weights add up to the Hurwitz number.

    Refused before any search: a Hurwitz number or a list of strata estimated
    beyond --max-work steps, and (list engine) a smooth stratum with more
    covers than --max-covers (at least its Hurwitz number).  --time-limit
    stops a search that runs long whether or not it finds covers."""
    check_count(degree, target_genus, genus, profiles, max_work)
    problem = HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles, marks=marks)
    graph = parse_graph(stratum) if stratum is not None else None
    with deadline(time_limit):
        _run(problem, graph, (codim, labeled, max_covers, max_work), (standalone, engine, rows, fmt, output))


def _run(problem, graph, selection: tuple, rendering: tuple) -> None:
    codim, labeled, max_covers, max_work = selection
    standalone, engine, rows, fmt, output = rendering
    if engine == "types":
        if fmt not in ("table", "json"):
            raise InputError(f"--engine types gives summaries only: use --format table or json, not {fmt}")
        tallies = tally_catalogue(problem, codim, graph, labeled, max_work=max_work)
        emit(tallies_to_json(tallies) if fmt == "json" else tallies_table(tallies), output)
        _report([(s.base.graph.notation, s.total_weight, s.hurwitz_number) for s in tallies.failures])
        return
    grouped = _grouped(rows, fmt)
    check_cover_count(problem, graph, max_covers)
    strata = select_strata(problem, codim, graph, labeled, max_work=max_work)
    budget = [max_covers]
    watch = watched(strata, len(strata), "strata", lambda b: b.graph.notation,
                    hint=TYPES_HINT if fmt in ("table", "json") else None,
                    extra=lambda: f"{max_covers - budget[0]} covers")
    if fmt == "jsonl":
        failures = _stream(problem, watch, budget, output)
    else:
        cat = build_catalogue(problem, codim, graph, labeled, max_covers, strata=watch, budget=budget)
        emit(_render(cat, fmt, standalone, grouped), output)
        failures = [(s.base.graph.notation, s.total_weight, s.hurwitz_number) for s in cat.failures]
    _report(failures)


#: Said once on stderr when a list-engine run is slow.
TYPES_HINT = ("this takes a while with --engine list; --engine types gives the same numbers "
              "(without the cover rows) much faster")


def _grouped(rows: str | None, fmt: str) -> bool:
    """Whether identical rows are grouped: ``--rows``, else by format."""
    if rows is not None:
        if rows == "grouped" and fmt in ("csv", "jsonl", "tikz"):
            raise InputError(f"--rows grouped is for table, latex and json, not --format {fmt}")
        return rows == "grouped"
    return fmt in ("table", "latex")


def _render(cat: Catalogue, fmt: str, standalone: bool, grouped: bool) -> str:
    if fmt == "json":
        return catalogue_to_json(cat, grouped)
    if fmt == "csv":
        return catalogue_to_csv(cat)
    if fmt == "latex":
        return catalogue_to_latex(cat, standalone, grouped)
    if fmt == "tikz":
        from covertree.export.tikz import catalogue_tikz

        return catalogue_tikz(cat, standalone)
    return catalogue_table(cat, grouped)


def _stream(problem, strata, budget, output) -> list:
    """JSON lines, one per cover, in the order of the other formats, written
    stratum by stratum (``budget``: ``[covers still allowed]``); returns the
    failed strata."""
    hurwitz = problem_hurwitz(problem)
    failures = []
    with AtomicOutput(output) as out:
        for number, base in enumerate(strata, start=1):
            lines, total = stratum_jsonl(base, iter_stratum(problem, base, budget), number)
            for line in lines:
                out.write(line + "\n")
            if total != hurwitz:
                failures.append((base.graph.notation, total, hurwitz))
    return failures


def _report(failures: list) -> None:
    """Say loudly on stderr that a degeneration identity failed, and exit 1."""
    for notation, total, hurwitz in failures:
        click.echo(
            f"covertree: BUG: the degeneration identity FAILS over {notation}: total weight "
            f"{rational_str(total)} != Hurwitz number {rational_str(hurwitz)}",
            err=True,
        )
    if failures:
        sys.exit(1)


def _stratum_table(number: int, s: StratumResult, grouped: bool, heading: str) -> Table:
    verdict = "holds" if s.identity_holds else "FAILS"
    columns = [("#", "right", True), ("covers", "right", True), ("over nodes", "left", True),
               ("source", "left", False), (heading, "left", True), ("name", "left", False),
               ("|Aut|", "right", True), ("mult", "right", True), ("weight", "right", True),
               ("L", "right", False), ("br", "right", False), ("orders", "left", False)]
    if not grouped:
        del columns[1]
    rows = [_cover_cells(g, grouped) for g in _groups(s, grouped)]
    shown = f"{count_noun(len(rows), 'row')} for " if grouped else ""
    return fitted_table(
        columns, rows,
        title=f"stratum {number}: base {s.base.graph.notation}  (codim {s.base.graph.codim}, "
              f"orbit {s.base.orbit_size})",
        caption=f"{shown}{count_noun(len(s.covers), 'cover')}, total weight {rational_str(s.total_weight)}, "
                f"Hurwitz number {rational_str(s.hurwitz_number)}: identity {verdict}",
    )


def _groups(s: StratumResult, grouped: bool) -> list[CoverGroup]:
    if grouped:
        return group_covers(s, key=lambda c: _printed(c))
    return [CoverGroup(c, (k,), c.weight) for k, c in enumerate(s.covers, start=1)]


def _printed(c) -> tuple:
    """The cells of a cover's row apart from its number and count."""
    return (profiles_text(c.edge_profiles), c.source.notation, c.stable_source.notation,
            c.stable_source_name or "", str(c.automorphisms), str(c.multiplicity), *_local_cells(c))


def _cover_cells(g: CoverGroup, grouped: bool) -> tuple:
    cells = _printed(g.cover)
    head = (g.number_range, str(g.count)) if grouped else (g.number_range,)
    return (*head, *cells[:6], rational_str(g.total_weight), *cells[6:])


def _local_cells(cover) -> tuple[str, str, str]:
    """L per base node, branches, and per stable node ``order type`` (codim one)."""
    local = local_structure(cover)
    lcms = ";".join(str(n.lcm) for n in local.nodes) or "-"
    if local.stable_nodes is None:
        return lcms, str(local.branches), ""
    orders = ", ".join(f"{n.order} {n.type}" if n.type else str(n.order) for n in local.stable_nodes)
    return lcms, str(local.branches), orders or "-"


def _landing_table(cat: Catalogue) -> Table:
    heading = source_heading(cat.problem)
    columns = [("stratum", "right", True), ("base", "left", True), (heading, "left", True),
               ("name", "left", False), ("weight", "right", True)]
    rows = [(str(k), s.base.graph.notation, graph.notation, divisor_name(graph) or "", rational_str(weight))
            for k, s in enumerate(cat.strata, start=1) for graph, weight in s.by_source()]
    return fitted_table(columns, rows, title=f"where the boundary lands: weight per {heading} and base stratum",
                        caption=contracted_note(cat.problem) or None)


def catalogue_table(cat: Catalogue, grouped: bool = True) -> str:
    """The table rendering: one table per stratum (numbered; rows numbered
    within it, as ``draw --pick`` addresses them), then the landing summary."""
    p = cat.problem
    head = Table(title=f"admissible covers: genus {p.genus} over genus {p.target_genus}, degree {p.degree}, "
                       f"profiles {profiles_text(p.profiles)}; Hurwitz number "
                       f"{rational_str(cat.hurwitz_number)}", show_header=False, box=None)
    heading = source_heading(p)
    tables = (_stratum_table(k, s, grouped, heading) for k, s in enumerate(cat.strata, start=1))
    return table_text(head, *tables, _landing_table(cat))


def tallies_table(tallies: TallyCatalogue) -> str:
    """The table rendering of ``--engine types``: one summary row per stratum,
    then the landing summary (weight per stable source)."""
    p = tallies.problem
    head = Table(title=f"tallies from types: genus {p.genus} over genus {p.target_genus}, degree {p.degree}, "
                       f"profiles {profiles_text(p.profiles)}; Hurwitz number "
                       f"{rational_str(tallies.hurwitz_number)}", show_header=False, box=None)
    columns = [("stratum", "right", True), ("base", "left", True), ("codim", "right", False),
               ("orbit", "right", False), ("total weight", "right", True), ("Hurwitz number", "right", True),
               ("identity", "left", True)]
    rows = [(str(k), s.base.graph.notation, str(s.base.codim), str(s.base.orbit_size), rational_str(s.total_weight),
             rational_str(s.hurwitz_number), "holds" if s.identity_holds else "FAILS")
            for k, s in enumerate(tallies.strata, start=1)]
    table = fitted_table(columns, rows, title="total weight per base stratum")
    return table_text(head, table, _landing_table(tallies))
