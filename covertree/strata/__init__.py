"""Boundary strata of the target: stable graphs of the base, up to the
symmetry of branch points carrying equal profiles."""

from covertree.strata.base import BaseStratum, base_strata

__all__ = ["BaseStratum", "base_strata"]
