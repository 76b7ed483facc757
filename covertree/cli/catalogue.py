"""The ``covertree catalogue`` command: every admissible cover over the boundary."""

from __future__ import annotations

import sys

import click
from rich.table import Table

from covertree.catalogue.catalogue import (
    DEFAULT_MAX_COVERS, Catalogue, StratumResult, build_catalogue, iter_stratum, problem_hurwitz,
    select_strata,
)
from covertree.cli.params import PROFILE, AtomicOutput, OneLineCommand, emit, format_option, output_option
from covertree.catalogue.covers import divisor_name
from covertree.catalogue.local_structure import local_structure
from covertree.cli.render import each_with_progress, table_text
from covertree.export.catalogue import catalogue_to_csv, catalogue_to_json, catalogue_to_latex, cover_to_jsonl
from covertree.errors import InputError
from covertree.export.rational import rational_str
from covertree.export.tallies import tallies_to_json
from covertree.graphs.notation import parse_graph
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


@click.command("catalogue", cls=OneLineCommand)
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
@format_option(["table", "json", "jsonl", "csv", "latex", "tikz"])
@output_option
def command(genus, target_genus, degree, profiles, marks, codim, stratum, labeled, max_covers, standalone, engine,
            fmt, output):
    """List every admissible cover over a fixed curve of each boundary stratum of
    the target: source and stable source, |Aut|, multiplicity, weight; check
    that each stratum's weights add up to the Hurwitz number."""
    problem = HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles, marks=marks)
    graph = parse_graph(stratum) if stratum is not None else None
    if engine == "types":
        if fmt not in ("table", "json"):
            raise InputError(f"--engine types gives summaries only: use --format table or json, not {fmt}")
        tallies = tally_catalogue(problem, codim, graph, labeled)
        emit(tallies_to_json(tallies) if fmt == "json" else tallies_table(tallies), output)
        _report([(s.base.graph.notation, s.total_weight, s.hurwitz_number) for s in tallies.failures])
        return
    if fmt == "jsonl":
        failures = _stream(problem, codim, graph, labeled, max_covers, output)
    else:
        cat = build_catalogue(problem, codim, graph, labeled, max_covers)
        emit(_render(cat, fmt, standalone), output)
        failures = [(s.base.graph.notation, s.total_weight, s.hurwitz_number) for s in cat.failures]
    _report(failures)


def _render(cat: Catalogue, fmt: str, standalone: bool) -> str:
    if fmt == "json":
        return catalogue_to_json(cat)
    if fmt == "csv":
        return catalogue_to_csv(cat)
    if fmt == "latex":
        return catalogue_to_latex(cat, standalone)
    if fmt == "tikz":
        from covertree.export.tikz import catalogue_tikz

        return catalogue_tikz(cat, standalone)
    return catalogue_table(cat)


def _stream(problem, codim, graph, labeled, max_covers, output) -> list:
    """JSON lines, one per cover, written as found; returns the failed strata."""
    hurwitz = problem_hurwitz(problem)
    strata = select_strata(problem, codim, graph, labeled)
    budget, failures = [max_covers], []
    with AtomicOutput(output) as out:
        for base in each_with_progress(strata, len(strata), "strata", lambda b: b.graph.notation):
            total = 0
            for cover in iter_stratum(problem, base, budget):
                total += cover.weight
                out.write(cover_to_jsonl(base, cover) + "\n")
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


def _stratum_table(s: StratumResult) -> Table:
    verdict = "holds" if s.identity_holds else "FAILS"
    table = Table(
        title=f"base {s.base.graph.notation}  (codim {s.base.graph.codim}, orbit {s.base.orbit_size})",
        caption=f"{len(s.covers)} covers, total weight {rational_str(s.total_weight)}, "
                f"Hurwitz number {rational_str(s.hurwitz_number)}: identity {verdict}",
    )
    for name, justify in [("#", "right"), ("over nodes", "left"), ("source", "left"),
                          ("stable source", "left"), ("name", "left"), ("|Aut|", "right"),
                          ("mult", "right"), ("weight", "right"), ("L", "right"), ("br", "right"),
                          ("orders", "left")]:
        table.add_column(name, justify=justify, overflow="fold")
    for i, c in enumerate(s.covers, start=1):
        profiles = "; ".join(",".join(map(str, p)) for p in c.edge_profiles) or "-"
        table.add_row(str(i), profiles, c.source.notation, c.stable_source.notation,
                      c.stable_source_name or "", str(c.automorphisms), str(c.multiplicity),
                      rational_str(c.weight), *_local_cells(c))
    return table


def _local_cells(cover) -> tuple[str, str, str]:
    """L per base node, branches, and per stable node ``order type`` (codim one)."""
    local = local_structure(cover)
    lcms = ";".join(str(n.lcm) for n in local.nodes) or "-"
    if local.stable_nodes is None:
        return lcms, str(local.branches), ""
    orders = ", ".join(f"{n.order} {n.type}" if n.type else str(n.order) for n in local.stable_nodes)
    return lcms, str(local.branches), orders or "-"


def _landing_table(cat: Catalogue) -> Table:
    table = Table(title="where the boundary lands: weight per stable source and base stratum")
    for name in ("base", "stable source", "name", "weight"):
        table.add_column(name, justify="right" if name == "weight" else "left", overflow="fold")
    for s in cat.strata:
        for graph, weight in s.by_source():
            table.add_row(s.base.graph.notation, graph.notation, divisor_name(graph) or "", rational_str(weight))
    return table


def catalogue_table(cat: Catalogue) -> str:
    """The table rendering: one table per stratum, then the landing summary."""
    p = cat.problem
    head = Table(title=f"admissible covers: genus {p.genus} over genus {p.target_genus}, degree {p.degree}, "
                       f"profiles {' '.join('(' + str(m) + ')' for m in p.profiles)}; Hurwitz number "
                       f"{rational_str(cat.hurwitz_number)}", show_header=False, box=None)
    return table_text(head, *(_stratum_table(s) for s in cat.strata), _landing_table(cat), width=100)


def tallies_table(tallies: TallyCatalogue) -> str:
    """The table rendering of ``--engine types``: one summary row per stratum,
    then the landing summary (weight per stable source)."""
    p = tallies.problem
    head = Table(title=f"tallies from types: genus {p.genus} over genus {p.target_genus}, degree {p.degree}, "
                       f"profiles {' '.join('(' + str(m) + ')' for m in p.profiles)}; Hurwitz number "
                       f"{rational_str(tallies.hurwitz_number)}", show_header=False, box=None)
    table = Table(title="total weight per base stratum")
    for name in ("base", "codim", "orbit", "total weight", "Hurwitz number", "identity"):
        table.add_column(name, justify="left" if name in ("base", "identity") else "right", overflow="fold")
    for s in tallies.strata:
        table.add_row(s.base.graph.notation, str(s.base.codim), str(s.base.orbit_size), rational_str(s.total_weight),
                      rational_str(s.hurwitz_number), "holds" if s.identity_holds else "FAILS")
    return table_text(head, table, _landing_table(tallies), width=100)
