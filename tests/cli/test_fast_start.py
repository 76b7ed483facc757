"""A fast start: ``count``, ``strata`` and the help load only what they use.

Shell loops call covertree thousands of times, so these commands must not
import the terminal library, sympy, networkx or the enumeration machinery of
the other commands; and the lazily listed help must be the help click would
print with every command loaded.  (The time itself is measured in
``benchmarks/bench_start.py``, not here.)
"""

from __future__ import annotations

import json
import subprocess
import sys

import click
import pytest
from click.testing import CliRunner

from covertree.cli import _COMMANDS, _SHORT_HELP, LazyCommands, _load, main

#: top-level packages and covertree layers a fast command must not import
HEAVY = ("rich", "sympy", "networkx", "covertree.gluing", "covertree.monodromy",
         "covertree.catalogue", "covertree.tallies", "covertree.locus", "covertree.sweep")

_PROBE = """
import json, sys
from covertree.cli import main
try:
    main(sys.argv[1:], prog_name="covertree")
except SystemExit as stop:
    code = stop.code
sys.stdout = sys.__stdout__
print(json.dumps({"code": code, "modules": sorted(sys.modules)}), file=sys.stderr)
"""


def _modules(args: list[str]) -> tuple[int, list[str]]:
    done = subprocess.run([sys.executable, "-c", _PROBE, *args], capture_output=True,
                          text=True, check=False)
    report = json.loads(done.stderr.strip().splitlines()[-1])
    return report["code"], report["modules"]


@pytest.mark.parametrize("args", [
    ["count", "-g", "2", "-t", "1", "-d", "4"],
    ["count", "-g", "2", "-t", "1", "-d", "4", "-f", "csv"],
    ["count", "-t", "0", "-d", "3", "-p", "3", "-p", "3", "-p", "3"],
    ["strata", "-t", "1", "-n", "2"],
    ["strata", "-t", "2", "-n", "0", "-f", "json"],
    ["--help"],
])
def test_fast_commands_import_nothing_heavy(args):
    code, modules = _modules(args)
    assert code in (0, None)
    loaded = [m for m in modules if any(m == h or m.startswith(h + ".") for h in HEAVY)]
    assert loaded == []
    assert "covertree.cli" in modules  # the probe did run covertree


def test_a_slow_command_is_seen_importing_its_machinery():
    # the probe can see heavy imports: the catalogue command loads the list engine
    code, modules = _modules(["catalogue", "-g", "2", "-t", "1", "-d", "2", "-k", "0"])
    assert code in (0, None)
    assert "covertree.gluing" in modules


def _groups() -> tuple[click.Group, LazyCommands]:
    """A plain click group with every command loaded, and a fresh lazy one."""
    settings = dict(name="covertree", params=main.params, help=main.help,
                    context_settings=main.context_settings)
    eager, lazy = click.Group(**settings), LazyCommands(**settings)
    for module in sorted(set(_COMMANDS.values())):
        _load(eager, module)
    return eager, lazy


def test_short_help_table_matches_the_commands():
    eager, _ = _groups()
    assert set(_SHORT_HELP) == set(_COMMANDS) == set(eager.commands)
    for name, command in eager.commands.items():
        assert _SHORT_HELP[name] == command.get_short_help_str(), name


@pytest.mark.parametrize("width", [40, 80, 200])
def test_lazy_help_is_the_help_with_every_command_loaded(width):
    texts = []
    for group in _groups():
        with click.Context(group, info_name="covertree", terminal_width=width) as ctx:
            texts.append(group.get_help(ctx))
    assert "catalogue" in texts[0] and "sweep" in texts[0]
    assert texts[0] == texts[1]


def test_listing_the_help_loads_no_command():
    _, lazy = _groups()
    with click.Context(lazy, info_name="covertree") as ctx:
        lazy.get_help(ctx)
    assert lazy.commands == {}


def test_help_through_the_command_line_lists_every_command():
    result = CliRunner().invoke(main, ["--help"])
    assert result.exit_code == 0
    listed = [line.split()[0] for line in result.output.split("Commands:")[1].splitlines() if line.strip()]
    assert listed == sorted(_COMMANDS)
