"""Monodromy layer: local covers over one component of the base, up to conjugacy.

A *piece* is a connected cover of one base component (a transitive tuple of
permutations with the surface-group relation); a *local cover* of degree ``d``
is a multiset of pieces whose degrees add up to ``d``.
"""
