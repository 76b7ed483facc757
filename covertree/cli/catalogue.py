"""The `covertree catalogue` command (being written)."""

import click


@click.command("catalogue")
def command() -> None:
    """Not available yet."""
    raise click.UsageError("'catalogue' is not available in this build")
