"""``python -m covertree``: the command line."""

from covertree.cli import main

if __name__ == "__main__":
    main(prog_name="covertree")
