"""The ``covertree locus`` and ``covertree integral`` commands: the class of a
divisorial Hurwitz locus in ``Mbar_G`` and integrals over the cover space."""

from __future__ import annotations

import re
from fractions import Fraction

import click
from rich.table import Table

from covertree.cli.catalogue import problem_options
from covertree.cli.limits import deadline, max_work_option, time_limit_option
from covertree.cli.params import OneLineCommand, emit, format_option, output_option
from covertree.cli.render import table_text
from covertree.errors import InputError
from covertree.export.locus import class_text, integral_to_json, locus_to_json, locus_to_latex
from covertree.export.rational import rational_str
from covertree.hurwitz.problem import HurwitzProblem


def _guarded(degree, target_genus, genus, profiles, marks, max_work) -> HurwitzProblem:
    """The problem, once its Hurwitz count and its base divisors are within
    the work limit (:mod:`covertree.limits`)."""
    from covertree.graphs.enumerate import check_strata
    from covertree.hurwitz.cost import check_count

    check_count(degree, target_genus, genus, profiles, max_work)
    problem = HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles, marks=marks)
    check_strata(target_genus, problem.points, 1, max_work)
    return problem

ENGINE = click.option("--engine", "-e", "engine", type=click.Choice(["types", "list"]), default="types",
                      show_default=True, help="How covers over each base stratum are found (same numbers).")


def parse_family(text: str) -> dict[str, Fraction]:
    """``"delta_0=10,delta_1=0"`` -> degrees; one-line errors naming the bad item."""
    degrees: dict[str, Fraction] = {}
    for item in filter(None, (s.strip() for s in re.split(r",(?![^{]*\})", text))):
        name, sep, value = item.partition("=")
        try:
            if not sep or len(value) > 60:
                raise ValueError
            degrees[name.strip()] = Fraction(value.strip())
        except (ValueError, ZeroDivisionError):
            raise InputError(f"family item {item[:40]!r} is not CLASS=NUMBER (e.g. delta_0=10)") from None
    return degrees


@click.command("locus", cls=OneLineCommand,
               short_help="Class of the Hurwitz locus in Mbar_g (lambda, delta_j).")
@problem_options
@click.option("--family", "family", default=None,
              help='Degrees of lambda and the delta_i (with --mark also psi_k and the delta_i_{...}) on a '
                   'one-parameter family, e.g. "delta_0=10,delta_1=0": print the locus\' intersection number with it.')
@ENGINE
@max_work_option
@time_limit_option
@format_option(["table", "json", "latex"])
@output_option
def locus_command(genus, target_genus, degree, profiles, marks, family, engine, max_work, time_limit, fmt, output):
    """The class of the Hurwitz locus (the pushforward of the cover space to
    Mbar_G, when it is a divisor) in lambda, delta_0, ..., solved from the
    integrals of every monomial of degree 3G-4 in lambda and the delta_i
    (more equations than unknowns; an inconsistent system exits 1). Printed
    for labelled branch points and divided by the symmetry of the profiles.
    With --mark the class lives on Mbar_{G,n}, in lambda, psi_k and its
    boundary divisors, and the symmetry fixes the marked branch points."""
    from covertree.locus.divisor import family_number, locus_class

    problem = _guarded(degree, target_genus, genus, profiles, marks, max_work)
    degrees = parse_family(family) if family is not None else None
    with deadline(time_limit):
        result = locus_class(problem, engine)
    numbers = None
    if degrees is not None:
        numbers = {"labelled": family_number(result, degrees), "unordered": family_number(result, degrees, True)}
    if fmt == "json":
        emit(locus_to_json(result, numbers), output)
    elif fmt == "latex":
        emit(locus_to_latex(result) + "\n", output)
    else:
        emit(_locus_table(result, numbers), output)


def _locus_table(result, numbers) -> str:
    p = result.problem
    space = f"Mbar_{{{p.genus},{p.n_marks}}}" if p.marks else f"Mbar_{p.genus}"
    table = Table(title=f"class of the locus in {space}: degree {p.degree} covers of genus {p.target_genus}, "
                        f"cover space of dimension {result.dimension}",
                  caption=f"{len(result.tests)} test monomials, system "
                          f"{'consistent' if result.consistent else 'INCONSISTENT'}")
    table.add_column("branch points")
    table.add_column("class", overflow="fold")
    table.add_row("labelled", class_text(result.labelled))
    table.add_row(f"unordered (/{result.symmetry})", class_text(result.unordered))
    if numbers is not None:
        table.add_row("family: labelled", rational_str(numbers["labelled"]))
        table.add_row("family: unordered", rational_str(numbers["unordered"]))
    return table_text(table)


@click.command("integral", cls=OneLineCommand,
               short_help="Integral over the space of admissible covers.")
@problem_options
@click.option("--source", "source", default="",
              help='Source classes: lambda, delta_i, e.g. "lambda delta_0^2"; with --mark also psi_k (k a leg) '
                   'and the divisors delta_i_{a,b,...} of Mbar_{G,n}.')
@click.option("--target", "target", default="", help='Target classes: psi_j (j a branch point), kappa.')
@ENGINE
@max_work_option
@time_limit_option
@format_option(["table", "json"])
@output_option
def integral_command(genus, target_genus, degree, profiles, marks, source, target, engine, max_work, time_limit,
                     fmt, output):
    """The integral over the space of admissible covers (labelled branch
    points, covers weighted 1/|Aut|) of src^*(source) br^*(target); the
    degrees must add up to the dimension 3H - 3 + b."""
    from covertree.locus.integrals import cover_space_integral
    from covertree.locus.monomial import Monomial

    problem = _guarded(degree, target_genus, genus, profiles, marks, max_work)
    src = _monomial(source, "source", "--source")
    tgt = _monomial(target, "target", "--target")
    with deadline(time_limit):
        result = cover_space_integral(problem, src, tgt, engine)
    if fmt == "json":
        emit(integral_to_json(result), output)
    else:
        emit(f"{rational_str(result.value)}\n", output)


def _monomial(text: str, kind: str, option: str):
    from covertree.locus.monomial import Monomial, MonomialError

    try:
        return Monomial.parse(text, kinds=kind)
    except MonomialError as error:
        raise MonomialError(f"{option}: {error}") from None


commands = (locus_command, integral_command)
