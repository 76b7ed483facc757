"""Generating series in the degree, identified as quasimodular forms.

- :mod:`~covertree.series.quasimodular`: Eisenstein series, the monomials
  ``E_2^a E_4^b E_6^c`` and exact identification of a q-series;
- :mod:`~covertree.series.family`: families of Hurwitz problems indexed by the
  degree (fixed genus, target genus and profile shapes);
- :mod:`~covertree.series.quantities`: the per-degree numbers covertree
  computes (Hurwitz numbers, stratum totals, source weights, pullback
  coefficients), with a hook for further kinds;
- :mod:`~covertree.series.generating`: the series of a family and its
  identification.
"""
