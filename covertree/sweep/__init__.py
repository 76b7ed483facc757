"""Sweep layer: many Hurwitz problems in one run, split across processes,
shards or a dask cluster, with an SQLite results store that survives
interruption.

It sits after the catalogue layer (it tallies :func:`iter_stratum`) and
before the exporters; it reads exact rationals as text through
:mod:`covertree.export.rational`, a leaf module.
"""
