"""Command-line interface (the only layer that imports click and rich).

Commands are thin: parse the options, call the library, render.  Library
errors (:class:`covertree.errors.CovertreeError`) become one line on stderr:
exit status 2 for bad input, 3 for a limit reached, 1 for a failed self-check.
"""

from __future__ import annotations

import sys

import click

from covertree import __version__
from covertree.errors import CovertreeError, IdentityError, LimitError


def exit_status(error: CovertreeError) -> int:
    """Exit status for a library error: 1 self-check, 3 limit, 2 otherwise."""
    if isinstance(error, IdentityError):
        return 1
    if isinstance(error, LimitError):
        return 3
    return 2


class CovertreeGroup(click.Group):
    """A click group that turns library errors into one-line messages."""

    def invoke(self, ctx: click.Context):
        try:
            return super().invoke(ctx)
        except CovertreeError as error:
            click.echo(f"covertree: error: {error}", err=True)
            sys.exit(exit_status(error))


@click.group(cls=CovertreeGroup, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, "-V", "--version", prog_name="covertree")
def main() -> None:
    """Admissible covers over the boundary of the target's moduli space:
    Hurwitz numbers, boundary strata, catalogues of degenerate covers."""


def _register() -> None:
    from covertree.cli import catalogue, count, draw, locus, pullback, series, strata, sweep

    for module in (count, strata, catalogue, pullback, locus, draw, sweep, series):
        for command in getattr(module, "commands", None) or (module.command,):
            main.add_command(command)


_register()
