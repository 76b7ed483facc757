"""The ``covertree sweep``, ``covertree merge`` and ``covertree export`` commands:
ranges of Hurwitz problems in one run, split over processes, shards or a dask
cluster, with a results store that survives interruption."""

from __future__ import annotations

import sys
from contextlib import contextmanager
from collections.abc import Iterator

import click
from rich.console import Console
from rich.progress import BarColumn, MofNCompleteColumn, Progress, ProgressColumn, TextColumn, TimeElapsedColumn
from rich.table import Table
from rich.text import Text

from covertree.cli.interrupts import interrupted_status
from covertree.cli.limits import max_work_option
from covertree.cli.params import INT_RANGE, PROFILE, OneLineCommand, Seconds, emit, format_option, output_option, \
    refuse_output_onto_store
from covertree.cli.render import fitted_table, table_text
from covertree.errors import InputError
from covertree.export.rational import rational_str
from covertree.export.words import profiles_text
from covertree.export.sweep import count_text, landing_columns, landing_header, summary_line, sweep_from_json, sweep_to_csv, sweep_to_json, sweep_to_latex
from covertree.sweep.feasibility import check_sweep
from covertree.sweep.report import SweepReport, merge_reports, shard_report, store_report, sweep_report
from covertree.sweep.runner import ProcessBackend, RunOutcome, SerialBackend, run_tasks
from covertree.sweep.store import ResultStore
from covertree.sweep.tasks import Plan, SweepSpec, parse_shard, plan_sweep, shard_tasks

FORMATS = ["table", "json", "csv", "latex"]

quiet_option = click.option("--quiet", "-q", is_flag=True, help="No progress bar and no summary on stderr.")


def _check_range(name: str, values: list[int] | None, least: int) -> None:
    bad = [v for v in values or () if v < least]
    if bad:
        raise InputError(f"{name} {bad[0]} is not allowed; {name} values must be >= {least}")


def _spec(genus, target_genus, degree, profiles, codim, labeled, engine="list") -> SweepSpec:
    _check_range("--genus", genus, 0)
    _check_range("--target-genus", target_genus, 0)
    _check_range("--degree", degree, 1)
    return SweepSpec(tuple(genus) if genus else (None,), tuple(target_genus), tuple(degree),
                     tuple(profiles), codim, labeled, engine)


def _check_store(store: str | None, output: str | None) -> None:
    """Refuse an empty ``--store`` name and an ``-o`` naming the store."""
    if store == "":
        raise InputError("--store: empty file name; give the path of an SQLite file")
    refuse_output_onto_store(output, store)


def _refuse_nothing_to_do(plan: Plan) -> None:
    """Refuse a sweep in which every problem is skipped (nothing computable)."""
    if plan.problems or not plan.skipped:
        return
    first, rest = plan.skipped[0], len(plan.skipped) - 1
    genus = "the genus of the profiles" if first.genus is None else f"genus {first.genus}"
    more = f"; and {rest} more skipped problem{'s' if rest > 1 else ''}" if rest else ""
    raise InputError(f"nothing to compute: every problem of the ranges is skipped ({genus} over genus "
                     f"{first.target_genus} in degree {first.degree}: {first.reason}{more}); widen the ranges")


def _backend(jobs: int, dask: str | None, timeout: float | None = None):
    if dask is not None and jobs != 1:
        raise InputError("--jobs and --dask exclude each other (the cluster has its own workers)")
    if dask is not None:
        from covertree.sweep.cluster import DaskBackend

        return DaskBackend(dask, timeout)
    return ProcessBackend(jobs) if jobs > 1 else SerialBackend()


class _RateColumn(ProgressColumn):
    """Finished tasks per second."""

    def render(self, task) -> Text:
        speed = task.finished_speed or task.speed
        return Text("-- tasks/s" if speed is None else f"{speed:.2f} tasks/s")


@contextmanager
def _progress(total: int, enabled: bool) -> Iterator:
    """A stderr progress bar (done/total, elapsed, rate, current problem);
    yields ``advance(task, was_stored)``."""
    if not enabled:
        yield lambda task, was_stored: None
        return
    columns = (BarColumn(), MofNCompleteColumn(), TimeElapsedColumn(), _RateColumn(),
               TextColumn("{task.description}"))
    with Progress(*columns, console=Console(stderr=True), transient=True) as bar:
        handle = bar.add_task("sweep", total=total)
        yield lambda task, was_stored: bar.update(
            handle, advance=1, description=("stored " if was_stored else "") + task.label)


def _run(plan: Plan, tasks, backend, store: str | None, show: bool) -> RunOutcome:
    done = [0, 0]  # tasks finished, of which found in the store
    with backend:
        opened = ResultStore(store) if store is not None else None
        try:
            with _progress(len(tasks), show and sys.stderr.isatty()) as advance:
                def counted(task, was_stored):
                    done[0] += 1
                    done[1] += was_stored
                    advance(task, was_stored)
                return run_tasks(tasks, backend, opened, counted)
        except KeyboardInterrupt as stop:  # Ctrl-C, or SIGTERM/SIGHUP (see OneLineCommand)
            click.echo(interrupted_message(len(tasks), done[0], done[1], store), err=True)
            sys.exit(interrupted_status(stop))
        finally:
            if opened is not None:
                opened.close()


def interrupted_message(total: int, finished: int, from_store: int, store: str | None) -> str:
    """What an interrupted sweep kept, and how to go on.

    >>> interrupted_message(10, 4, 1, "runs.db")
    "covertree: sweep interrupted: 4 of 10 tasks are safely in the store 'runs.db' (3 computed now, 1 found there); run the same command with --store 'runs.db' to compute only the other 6"
    >>> interrupted_message(10, 4, 0, None)
    'covertree: sweep interrupted after 4 of 10 tasks; without --store nothing is kept (give --store FILE to make a sweep resumable)'
    """
    if store is None:
        return (f"covertree: sweep interrupted after {finished} of {total} tasks; without --store nothing is "
                "kept (give --store FILE to make a sweep resumable)")
    return (f"covertree: sweep interrupted: {finished} of {total} tasks are safely in the store {store!r} "
            f"({finished - from_store} computed now, {from_store} found there); run the same command with "
            f"--store {store!r} to compute only the other {total - finished}")


@click.command("sweep", cls=OneLineCommand,
               short_help="Run many problems into a resumable store.")
@click.option("--genus", "-g", "genus", type=INT_RANGE, default=None,
              help="Source genera: 2, 2..4 or 2,3,5 (default: derived from complete profiles).")
@click.option("--target-genus", "-t", "target_genus", type=INT_RANGE, required=True,
              help="Target genera: 1, 0..2 or 0,2.")
@click.option("--degree", "-d", "degree", type=INT_RANGE, required=True, help="Degrees: 3, 2..8 or 2,3,5.")
@click.option("--profile", "-p", "profiles", type=PROFILE, multiple=True,
              help="Profile over the next branch point (repeatable); the rest are simple.")
@click.option("--codim", "-k", "codim", type=click.IntRange(min=0), default=1, show_default=True,
              help="Base strata of codimension up to this.")
@click.option("--labeled", "-l", is_flag=True, help="Every labelled stratum, not one per orbit.")
@click.option("--engine", "-e", "engine", type=click.Choice(["list", "types"]), default="list", show_default=True,
              help="list: covers one by one (with counts); types: tallies from combinatorial types (large degrees).")
@format_option(FORMATS)
@click.option("--jobs", "-j", "jobs", type=click.IntRange(min=1), default=1, show_default=True,
              help="Local worker processes.")
@click.option("--shard", "shard", default=None, help="Run only slice I of N (tasks with index % N == I-1).")
@click.option("--dask", "dask", default=None, metavar="ADDRESS",
              help="Submit the tasks to this dask.distributed scheduler (extra covertree[dask]).")
@click.option("--dask-timeout", "dask_timeout", type=Seconds(min=0.1, max=600), default=None,
              metavar="SECONDS",
              help="With --dask: give up when the scheduler has not answered within this time (default 5).")
@click.option("--store", "store", type=click.Path(dir_okay=False), default=None,
              help="SQLite results store: finished tasks are kept, a rerun computes only the rest.")
@quiet_option
@max_work_option
@output_option
def sweep(genus, target_genus, degree, profiles, codim, labeled, engine, fmt, jobs, shard, dask, dask_timeout,
          store, quiet, max_work, output):
    """Run every Hurwitz problem of the ranges over every base stratum of
    codimension <= K: one row per (problem, stratum) with the number of
    covers, total weight, Hurwitz number, identity verdict and the weight
    whose stable source lands in each boundary divisor delta_i of the source
    space (columns "lands in delta_i": not the pullback coefficient
    c(D, delta_i) of the pullback command)."""
    _check_store(store, output)
    spec = _spec(genus, target_genus, degree, profiles, codim, labeled, engine)
    piece = parse_shard(shard) if shard is not None else None
    check_sweep(spec, max_work)
    plan = plan_sweep(spec)
    _refuse_nothing_to_do(plan)
    tasks = shard_tasks(plan.tasks, *piece) if piece else plan.tasks
    outcome = _run(plan, tasks, _backend(jobs, dask, dask_timeout), store, not quiet)
    report = shard_report(plan, tasks, outcome.results, piece) if piece else sweep_report(plan, outcome.results)
    emit(render(report, fmt), output)
    if not quiet:
        where = f"shard {piece[0]}/{piece[1]}: " if piece else ""
        click.echo(f"covertree: sweep: {where}{summary_line(report)}; {len(tasks)} tasks: "
                   f"{outcome.computed} computed, {outcome.stored} found in the store", err=True)
    _report_failures(report)


@click.command("merge", cls=OneLineCommand,
               short_help="Combine the JSON outputs of shards into one.")
@click.argument("files", nargs=-1, required=True, type=click.Path(exists=True, dir_okay=False))
@format_option(FORMATS)
@quiet_option
@output_option
def merge(files, fmt, quiet, output):
    """Combine the JSON outputs of the shards 1/N .. N/N of one sweep into the
    output a single run gives."""
    reports = []
    for name in files:
        with open(name, "rb") as handle:
            reports.append((name, sweep_from_json(handle.read(), name)))
    report = merge_reports(reports)
    emit(render(report, fmt), output)
    if not quiet:
        click.echo(f"covertree: merge: {len(files)} shards: {summary_line(report)}", err=True)
    _report_failures(report)


@click.command("export", cls=OneLineCommand,
               short_help="Print every result in a store, nothing recomputed.")
@click.option("--store", "store", type=click.Path(dir_okay=False), required=True, help="The SQLite results store.")
@format_option(FORMATS)
@quiet_option
@output_option
def export(store, fmt, quiet, output):
    """Print every result in a store (nothing is recomputed)."""
    _check_store(store, output)
    with ResultStore(store, create=False) as opened:
        report = store_report(opened.results())
    emit(render(report, fmt), output)
    if not quiet:
        click.echo(f"covertree: export: {summary_line(report)}", err=True)
    _report_failures(report)


commands = (sweep, merge, export)
command = sweep


def render(report: SweepReport, fmt: str) -> str:
    """The report in one of :data:`FORMATS`."""
    if fmt == "json":
        return sweep_to_json(report)
    if fmt == "csv":
        return sweep_to_csv(report)
    if fmt == "latex":
        return sweep_to_latex(report)
    return sweep_table(report)


def _report_failures(report: SweepReport) -> None:
    """Say loudly on stderr that a degeneration identity failed, and exit 1."""
    for row in report.failures:
        p = row.problem
        click.echo(f"covertree: BUG: the degeneration identity FAILS for genus {p.genus} over genus "
                   f"{p.target_genus}, degree {p.degree}, over {row.stratum}: total weight "
                   f"{rational_str(row.total_weight)} != Hurwitz number {rational_str(row.hurwitz_number)}",
                   err=True)
    if report.failures:
        sys.exit(1)


def sweep_table(report: SweepReport) -> str:
    """The table rendering: one line per (problem, stratum), then skipped problems."""
    columns = landing_columns(report)
    heads = [(name, "left" if name in ("profiles", "base", "identity") else "right", name != "orbit")
             for name in ("g", "h", "d", "profiles", "base", "orbit", "covers", "total", "H", "identity")]
    heads += [(landing_header(c), "right", True) for c in columns]
    rows = []
    for row in report.rows:
        p, landing = row.problem, dict(row.landing)
        rows.append((str(p.genus), str(p.target_genus), str(p.degree), profiles_text(p.profiles), row.stratum,
                     str(row.orbit_size), count_text(row.n_covers), rational_str(row.total_weight),
                     rational_str(row.hurwitz_number), "holds" if row.identity_holds else "FAILS",
                     *(rational_str(landing[c]) if c in landing else "" for c in columns)))
    tables = [fitted_table(heads, rows, title="sweep: weight per base stratum and where it lands "
                                              "(lands in delta_i: the weight whose stable source is in delta_i)",
                           caption=summary_line(report))]
    if report.skipped:
        skipped = Table(title="skipped problems")
        for name in ("g", "h", "d", "reason"):
            skipped.add_column(name, overflow="fold")
        for s in report.skipped:
            skipped.add_row("-" if s.genus is None else str(s.genus), str(s.target_genus), str(s.degree), s.reason)
        tables.append(skipped)
    return table_text(*tables)
