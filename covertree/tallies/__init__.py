"""Weighted tallies of admissible covers from combinatorial types (no lists)."""

from covertree.tallies.types import TallyCatalogue, TallyEntry, TypeTally, tally_catalogue, tally_stratum

__all__ = ["TallyCatalogue", "TallyEntry", "TypeTally", "tally_catalogue", "tally_stratum"]
