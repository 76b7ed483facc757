"""Intersection numbers on the space of admissible covers and classes of
Hurwitz loci.

- :mod:`~covertree.locus.monomial`: monomials in the source classes
  ``lambda``, ``delta_i`` and the target classes ``psi_j``, ``kappa``;
- :mod:`~covertree.locus.edges`: what each cover contributes along each base
  node (lcm, smoothing orders of the source nodes, weight);
- :mod:`~covertree.locus.vertexring`: classes on products of vertex moduli
  spaces and their integrals;
- :mod:`~covertree.locus.integrals`: ``\\int_{Adm} src^*(...) br^*(...)``;
- :mod:`~covertree.locus.divisor`: the class of a divisorial Hurwitz locus in
  ``Pic(Mbar_G) (x) Q``, solved from an overdetermined system.
"""
