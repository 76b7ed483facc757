"""The `covertree count` command (being written)."""

import click


@click.command("count")
def command() -> None:
    """Not available yet."""
    raise click.UsageError("'count' is not available in this build")
