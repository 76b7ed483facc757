"""Sweep layer: many Hurwitz problems in one run, split across processes,
shards or a dask cluster, with an SQLite results store that survives
interruption.

It sits after the catalogue layer (it tallies :func:`iter_stratum`) and
before the exporters, which it does not import; it stores exact rationals
as text through :mod:`covertree.rational`, a leaf module at the bottom of
the package.
"""
