"""The ``covertree pullback`` command: pullbacks of the boundary divisors of
``Mbar_G`` to the boundary divisors of the base."""

from __future__ import annotations

import sys

import click
from rich.table import Table

from covertree.catalogue.catalogue import DEFAULT_MAX_COVERS
from covertree.catalogue.pullback import Pullback, build_pullback, pullback_strata
from covertree.cli.catalogue import TYPES_HINT, problem_options
from covertree.cli.limits import deadline, max_work_option, time_limit_option
from covertree.cli.params import OneLineCommand, emit, format_option, output_option
from covertree.cli.render import table_text, watched
from covertree.export.pullback import pullback_to_csv, pullback_to_json, pullback_to_latex
from covertree.export.rational import rational_str
from covertree.graphs.enumerate import check_strata
from covertree.hurwitz.cost import check_count
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.pullback import pullback_from_types


@click.command("pullback", cls=OneLineCommand,
               short_help="Pullback of each boundary divisor to the cover space.")
@problem_options
@click.option("--labeled", "-l", is_flag=True, help="Every labelled base divisor, not one per orbit.")
@click.option("--max-covers", "-m", "max_covers", type=click.IntRange(min=1), default=DEFAULT_MAX_COVERS,
              show_default=True, help="Stop with an error rather than list more covers than this.")
@click.option("--standalone", is_flag=True, help="LaTeX: a complete document.")
@click.option("--engine", "-e", "engine", type=click.Choice(["list", "types"]), default="list", show_default=True,
              help="list: from every cover; types: from combinatorial types (no covers listed, for large degree).")
@max_work_option
@time_limit_option
@format_option(["table", "json", "csv", "latex"])
@output_option
def command(genus, target_genus, degree, profiles, marks, labeled, max_covers, standalone, engine, max_work,
            time_limit, fmt, output):
    """For every boundary divisor D of the target's moduli space and every
    boundary divisor delta of Mbar_G, the coefficient c(D, delta) of D in
    br_* src^* delta: the sum over the covers f over D of
    #branches(f)/|Aut f| times the order of delta along a branch (the sum of
    the smoothing orders of the stable nodes of type delta). Checks that
    sum_f #branches * L / |Aut f| equals the Hurwitz number over every D.
    With --mark the source lands in Mbar_{G,n} and delta runs over its
    boundary divisors delta_0, delta_i_{a,b,...}."""
    check_count(degree, target_genus, genus, profiles, max_work)
    problem = HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles, marks=marks)
    check_strata(target_genus, problem.points, 1, max_work)
    with deadline(time_limit):
        pb = _compute(problem, labeled, max_covers, engine)
    emit(_render(pb, fmt, standalone), output)
    for r in pb.failures:
        click.echo(
            f"covertree: BUG: the branch-total check FAILS over {r.base.graph.notation}: "
            f"sum #branches*L/|Aut| = {rational_str(r.branch_total)} != Hurwitz number "
            f"{rational_str(r.hurwitz_number)}",
            err=True,
        )
    if pb.failures:
        sys.exit(1)


def _space(p: HurwitzProblem) -> str:
    return f"Mbar_{{{p.genus},{p.n_marks}}}" if p.marks else f"Mbar_{p.genus}"


def _compute(problem, labeled: bool, max_covers: int, engine: str) -> Pullback:
    if engine == "types":
        return pullback_from_types(problem, labeled)
    strata = pullback_strata(problem, labeled)
    watch = watched(strata, len(strata), "divisors", lambda b: b.graph.notation, hint=TYPES_HINT)
    return build_pullback(problem, labeled, max_covers, strata=watch)


def _render(pb: Pullback, fmt: str, standalone: bool) -> str:
    if fmt == "json":
        return pullback_to_json(pb)
    if fmt == "csv":
        return pullback_to_csv(pb)
    if fmt == "latex":
        return pullback_to_latex(pb, standalone)
    return pullback_table(pb)


def pullback_table(pb: Pullback) -> str:
    """The table rendering."""
    p = pb.problem
    table = Table(
        title=f"pullbacks of the boundary of {_space(p)}: genus {p.genus} over genus {p.target_genus}, "
              f"degree {p.degree}; Hurwitz number {rational_str(pb.hurwitz_number)}",
        caption="c(D, delta) = sum_f #branches/|Aut f| * (order of delta along a branch); "
                f"branch total == Hurwitz number: {'holds for every D' if not pb.failures else 'FAILS'}",
    )
    table.add_column("base divisor D", no_wrap=True)
    table.add_column("orbit", justify="right")
    for d in pb.divisors:
        table.add_column(d, justify="right")
    table.add_column("branch total", justify="right")
    table.add_column("check")
    for r in pb.rows:
        table.add_row(r.base.graph.notation, str(r.base.orbit_size),
                      *(rational_str(r.coefficients[d]) for d in pb.divisors),
                      rational_str(r.branch_total), "holds" if r.check_holds else "FAILS")
    return table_text(table)
