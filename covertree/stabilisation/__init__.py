"""Stabilisation: contract the unstable components of a source curve."""
