"""Command-line interface (the only layer that imports click and rich).

Commands are thin: parse the options, call the library, render.  Library
errors (:class:`covertree.errors.CovertreeError`) become one line on stderr:
exit status 2 for bad input, 3 for a limit reached, 1 for a failed self-check.
"""

from __future__ import annotations

import re
import sys

import click

from covertree import __version__
from covertree.errors import CovertreeError, IdentityError, InputError, LimitError


def exit_status(error: CovertreeError) -> int:
    """Exit status for a library error: 1 self-check, 3 limit, 2 otherwise."""
    if isinstance(error, IdentityError):
        return 1
    if isinstance(error, LimitError):
        return 3
    return 2


#: command name -> module of covertree.cli defining it; a module is imported
#: only when one of its commands runs (or when the full help lists them all), so
#: ``covertree count ...`` does not pay for the enumeration machinery or sympy
_COMMANDS = {
    "count": "count", "strata": "strata", "catalogue": "catalogue", "pullback": "pullback",
    "locus": "locus", "integral": "locus", "draw": "draw", "sweep": "sweep", "merge": "sweep",
    "export": "sweep", "series": "series",
}

#: command name -> its one-line help, as the command declares it (``short_help``);
#: ``covertree --help`` lists the commands from here without importing them
#: (a test checks that each entry equals the loaded command's)
_SHORT_HELP = {
    "catalogue": "Every admissible cover over each boundary stratum, checked.",
    "count": "Hurwitz numbers (connected and not) of a problem.",
    "draw": "Picture of a stable graph or of one cover of a catalogue.",
    "export": "Print every result in a store, nothing recomputed.",
    "integral": "Integral over the space of admissible covers.",
    "locus": "Class of the Hurwitz locus in Mbar_g (lambda, delta_j).",
    "merge": "Combine the JSON outputs of shards into one.",
    "pullback": "Pullback of each boundary divisor to the cover space.",
    "series": "Generating series in the degree, as quasimodular forms.",
    "strata": "Stable graphs (boundary strata) of Mbar_{h,n}.",
    "sweep": "Run many problems into a resumable store.",
}


#: Quotations of the user's input longer than this (characters) are cut ...
QUOTE_LIMIT = 240
#: ... to a window of this many characters.
QUOTE_WINDOW = 60
#: Longest error line (characters).
LINE_WIDTH = 600

_QUOTED = re.compile(r"'(?:[^'\\\n]|\\.)*'|\"(?:[^\"\\\n]|\\.)*\"")


def error_line(message: str) -> str:
    """``message`` on one line, each quotation longer than :data:`QUOTE_LIMIT`
    cut to a window of :data:`QUOTE_WINDOW` characters, the whole line to
    :data:`LINE_WIDTH`.

    >>> line = error_line("bad 'g" + "1" * 5000 + "' here")
    >>> len(line), line.endswith("1'... (5001 characters) here")
    (92, True)
    >>> error_line("two\\nlines")
    'two lines'
    """
    def cut(match: re.Match) -> str:
        quoted = match.group(0)
        if len(quoted) <= QUOTE_LIMIT:
            return quoted
        return f"{quoted[:QUOTE_WINDOW + 1]}{quoted[0]}... ({len(quoted) - 2} characters)"

    line = _QUOTED.sub(cut, " ".join(message.split("\n")))
    return line if len(line) <= LINE_WIDTH else line[:LINE_WIDTH] + f"... ({len(line)} characters)"


class CovertreeGroup(click.Group):
    """A click group that turns library errors, an unknown command and a bad
    option of the group itself into one-line messages."""

    def make_context(self, info_name, args, parent=None, **extra):
        try:
            return super().make_context(info_name, args, parent=parent, **extra)
        except click.UsageError as error:
            if type(error).__name__ == "NoArgsIsHelpError":  # bare ``covertree``: the help
                raise
            _refuse(InputError(error.format_message()))

    def resolve_command(self, ctx: click.Context, args: list[str]):
        try:
            return super().resolve_command(ctx, args)
        except click.UsageError as error:
            raise InputError(f"{error.format_message()} Commands: {', '.join(self.list_commands(ctx))}") from None

    def invoke(self, ctx: click.Context):
        try:
            return super().invoke(ctx)
        except CovertreeError as error:
            _refuse(error)


def _refuse(error: CovertreeError) -> None:
    click.echo(f"covertree: error: {error_line(str(error))}", err=True)
    sys.exit(exit_status(error))


class LazyCommands(CovertreeGroup):
    """The ``covertree`` group: each command's module is imported on first use."""

    def list_commands(self, ctx: click.Context) -> list[str]:
        return sorted(set(self.commands) | set(_COMMANDS))

    def get_command(self, ctx: click.Context, name: str) -> click.Command | None:
        if name not in self.commands and name in _COMMANDS:
            _load(self, _COMMANDS[name])
        return self.commands.get(name)

    def format_commands(self, ctx: click.Context, formatter: click.HelpFormatter) -> None:
        """The list of commands, as click draws it, without importing the
        modules of the commands not yet loaded (their help from ``_SHORT_HELP``)."""
        rows = [(name, self.commands[name].get_short_help_str() if name in self.commands
                 else _SHORT_HELP[name]) for name in self.list_commands(ctx)
                if name not in self.commands or not self.commands[name].hidden]
        if rows:
            with formatter.section("Commands"):
                formatter.write_dl(rows)


def _load(group: click.Group, module_name: str) -> None:
    # register every command of one covertree.cli module
    import importlib

    module = importlib.import_module(f"covertree.cli.{module_name}")
    for command in getattr(module, "commands", None) or (module.command,):
        group.add_command(command)


@click.group(cls=LazyCommands, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, "-V", "--version", prog_name="covertree")
def main() -> None:
    """Admissible covers over the boundary of the target's moduli space:
    Hurwitz numbers, boundary strata, catalogues of degenerate covers."""
