"""The `covertree strata` command (being written)."""

import click


@click.command("strata")
def command() -> None:
    """Not available yet."""
    raise click.UsageError("'strata' is not available in this build")
