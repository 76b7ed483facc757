"""Catalogue layer: admissible covers over each base stratum, stabilised,
tallied, and checked by the degeneration identity."""
