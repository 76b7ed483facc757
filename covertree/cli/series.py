"""The ``covertree series`` command: a quantity in degrees 1..N and its
generating series identified as a quasimodular form."""

from __future__ import annotations

from fractions import Fraction

import click
from rich.table import Table

from covertree.cli.limits import deadline, max_work_option, time_limit_option
from covertree.cli.params import OneLineCommand, emit, format_option, output_option
from covertree.cli.render import progress, table_text
from covertree.errors import InputError
from covertree.export.series import SERIES_COLUMNS, series_rows, series_summary, series_to_csv, series_to_json, \
    series_to_latex
from covertree.series.family import Family, ProfileShape
from covertree.series.generating import DegreeSeries, degree_series
from covertree.series.quantities import ENGINES, KINDS, Quantity


def _fraction(text: str) -> Fraction:
    try:
        return Fraction(text)
    except (ValueError, ZeroDivisionError):
        raise InputError(f"--constant {text!r} is not a rational number p/q") from None


@click.command("series", cls=OneLineCommand,
               short_help="Generating series in the degree, as quasimodular forms.")
@click.option("--genus", "-g", "genus", type=int, default=None,
              help="Genus of the connected source in every degree; missing branch points are simple "
                   "[default: from Riemann-Hurwitz].")
@click.option("--target-genus", "-t", "target_genus", type=int, required=True, help="Genus of the target.")
@click.option("--shape", "-p", "shapes", multiple=True,
              help="Profile shape over the next branch point: parts INT, d or d-INT, PART^INT, 1^* filling "
                   "up the degree (e.g. 1^*, 3,1^*, d). Repeatable, in order.")
@click.option("--max-degree", "-D", "max_degree", type=click.IntRange(min=1), required=True,
              help="Compute degrees 1..N.")
@click.option("--quantity", "-q", "kind", type=click.Choice(list(KINDS)), default="hurwitz", show_default=True,
              help="hurwitz, disconnected: Hurwitz numbers; total: total weight over --stratum; source: weight "
                   "over --stratum landing on --source; pullback: c(--stratum, --coefficient); locus, locus_unordered: "
                   "the --coefficient (lambda, delta_j) of the class of the locus (labelled, or divided by "
                   "the symmetry of the profiles).")
@click.option("--stratum", "-s", "stratum", default=None, help="Base stratum (graph notation).")
@click.option("--source", "source", default=None, help="Stable source stratum (graph notation).")
@click.option("--coefficient", "-c", "coefficient", default=None, help="Divisor delta_i of Mbar_G (pullback), or lambda / delta_j (locus).")
@click.option("--engine", "-e", "engine", type=click.Choice(list(ENGINES)), default="types", show_default=True,
              help="How stratum tallies are computed (the same numbers).")
@click.option("--weight", "-w", "weight", type=click.IntRange(min=0), required=True,
              help="Weight W of the quasimodular forms tried (even).")
@click.option("--mixed", is_flag=True, help="Try every even weight up to W, not only W.")
@click.option("--constant", "constant", default="0", show_default=True,
              help="Coefficient of q^0 (no degree-0 problem exists).")
@click.option("--q-derivative", "-k", "q_derivative", type=click.IntRange(min=0), default=0, show_default=True,
              help="Apply (q d/dq)^K: the d-th coefficient is d^K times the quantity.")
@max_work_option
@time_limit_option
@format_option(["table", "json", "csv", "latex"])
@output_option
def command(genus, target_genus, shapes, max_degree, kind, stratum, source, coefficient, engine, weight, mixed,
            constant, q_derivative, max_work, time_limit, fmt, output):
    """Compute a quantity for the problems of degrees 1..N with a fixed genus,
    target genus and profile shapes, and identify sum_d d^K Q_d q^d as a
    quasimodular form: exact linear algebra over the monomials E2^a E4^b E6^c
    of weight W (or <= W), the first coefficients solving, the others checking.
    Says plainly when no form of that weight fits."""
    family = Family(genus, target_genus, tuple(ProfileShape.parse(s) for s in shapes))
    quantity = Quantity(kind, stratum, source, coefficient, engine)
    _check_family(family, max_degree, max_work)
    with deadline(time_limit), progress(max_degree, "degrees") as advance:
        def evaluate(problem):
            advance(f"degree {problem.degree}")
            return quantity.evaluate(problem)

        result = degree_series(family, quantity, max_degree, weight, mixed, _fraction(constant), q_derivative,
                               evaluate)
    if fmt == "json":
        text = series_to_json(result)
    elif fmt == "csv":
        text = series_to_csv(result)
    elif fmt == "latex":
        text = series_to_latex(result)
    else:
        text = series_table(result)
    emit(text, output)


def series_table(s: DegreeSeries) -> str:
    """The table rendering: one row per degree, then the verdict."""
    fam = s.family
    genus = "from Riemann-Hurwitz" if fam.genus is None else str(fam.genus)
    shapes = "; ".join(x.text for x in fam.shapes) or "none"
    table = Table(title=f"{s.quantity.label}: genus {genus} over genus {fam.target_genus}, shapes {shapes}, "
                        f"degrees 1..{s.max_degree}")
    for name in SERIES_COLUMNS:
        table.add_column(name if name != "coefficient" else f"q^d coefficient (d^{s.q_derivative} x value)",
                         justify="left" if name == "profiles" else "right", overflow="fold")
    for row in series_rows(s):
        table.add_row(*map(str, row))
    return table_text(table) + series_summary(s) + "\n"


def _check_family(family: Family, max_degree: int, max_work) -> None:
    """Refuse a series whose last degree is beyond the work limit (the
    largest degree costs the most: the estimate of its Hurwitz count)."""
    from covertree.errors import TooLargeError
    from covertree.hurwitz.cost import check_count
    from covertree.limits import MAX_DEGREE

    if max_degree > MAX_DEGREE:
        raise TooLargeError(f"--max-degree {max_degree} is larger than the largest degree covertree handles "
                            f"({MAX_DEGREE}; far smaller ones are refused as infeasible)")
    given = [shape.at(max_degree) for shape in family.shapes]
    if all(p is not None for p in given):
        check_count(max_degree, family.target_genus, family.genus, [tuple(p) for p in given], max_work)
