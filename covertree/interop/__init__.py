"""Bridges from covertree's values to general-purpose libraries.

:mod:`~covertree.interop.nxgraphs` converts dual graphs, base strata and covers
to and from :mod:`networkx` multigraphs, and counts isomorphisms and
automorphisms with networkx's matchers (an independent check of
:mod:`covertree.graphs.canonical`).
"""
