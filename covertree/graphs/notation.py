"""A one-line text notation for dual graphs.

Vertices are listed in order (their position is their 0-based index), each
as ``g`` and its genus, followed by its legs in braces when it has any; after
a bar come the edges as pairs of vertex indices, ``i-i`` being a loop and
``i-j^m`` standing for ``m`` parallel edges (the same ``^`` shorthand as in the
profile notation ``2,1^3``).

Grammar (whitespace is allowed between any two tokens)::

    graph    ::= vertices [ "|" [ edges ] ]
    vertices ::= vertex { "," vertex }
    vertex   ::= "g" INT [ "{" [ INT { "," INT } ] "}" ]
    edges    ::= edge { "," edge }
    edge     ::= INT "-" INT [ "^" INT ]
    INT      ::= digit { digit }

The printed form is canonical (canonical vertex and edge order, parallel
edges and loops merged with ``^``), so two graphs are isomorphic exactly when
they print the same.  Any graph parses, stable or not; :func:`parse_graph`
returns a :class:`~covertree.graphs.curve_graph.StableCurveGraph` when it is stable.

Examples
--------
A genus-2 vertex with legs 1 and 2 joined to a rational vertex with leg 3
carrying a loop:

>>> g = parse_graph("g2{1,2}, g0{3} | 0-1, 1-1")
>>> g.genus, g.codim, g.automorphisms
(3, 2, 2)
>>> format_graph(g)
'g0{3}, g2{1,2} | 0-0, 0-1'

The banana graph of genus 2 (two rational vertices, three parallel edges),
written loosely:

>>> b = parse_graph(" g0,g0|0 - 1 ^ 3 ")
>>> str(b), b.automorphisms
('g0, g0 | 0-1^3', 12)

Unstable graphs parse too:

>>> type(parse_graph("g0{1}, g0 | 0-1")).__name__
'CurveGraph'
>>> parse_graph("g0{1} | 0-2")
Traceback (most recent call last):
...
covertree.errors.NotationError: column 10: vertex index 2 out of range (the graph has 1 vertex)
"""

from __future__ import annotations

from covertree.errors import GraphError, NotationError
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.limits import MAX_DIGITS

#: most vertices, edges and legs (together) a notation may describe: far
#: beyond any stratum or source covertree can handle (a cap on memory before
#: anything is computed)
MAX_GRAPH_ITEMS = 600

__all__ = ["format_graph", "graph_parts", "parse_graph"]


def format_graph(g: CurveGraph) -> str:
    """The canonical one-line notation of ``g``.

    Examples
    --------
    >>> format_graph(StableCurveGraph([(0, [1])], nodes=[(0, 0), (0, 0)]))
    'g0{1} | 0-0^2'
    """
    vertices = ", ".join(_format_vertex(genus, legs) for genus, legs in zip(g.vertex_genera, g.vertex_legs))
    if not g.nodes:
        return vertices
    return f"{vertices} | {', '.join(_format_edges(g.nodes))}"


def _format_vertex(genus: int, legs: tuple[int, ...]) -> str:
    if not legs:
        return f"g{genus}"
    return f"g{genus}{{{','.join(map(str, legs))}}}"


def _format_edges(edges: tuple[tuple[int, int], ...]) -> list[str]:
    out: list[str] = []
    k = 0
    while k < len(edges):
        m = 1
        while k + m < len(edges) and edges[k + m] == edges[k]:
            m += 1
        a, b = edges[k]
        out.append(f"{a}-{b}" if m == 1 else f"{a}-{b}^{m}")
        k += m
    return out


def parse_graph(text: str) -> CurveGraph:
    """Parse the notation; a :class:`StableCurveGraph` when the graph is stable.

    Raises
    ------
    NotationError
        Naming the 0-based column and what was expected there, or why the
        described graph is not a valid dual graph.

    Examples
    --------
    >>> parse_graph("g1 | 0-0").genus
    2
    >>> parse_graph("g0 | 0-0^2") == StableCurveGraph([0], nodes=[(0, 0), (0, 0)])
    True
    >>> parse_graph("g0{1,2} g0")
    Traceback (most recent call last):
    ...
    covertree.errors.NotationError: column 8: expected ',' or '|' or the end, found 'g'
    """
    if not isinstance(text, str):
        raise NotationError(f"a graph notation is a string, not {type(text).__name__}")
    genera, legs, edges = _Parser(text).graph()
    try:
        graph = CurveGraph._from_parts(genera, edges, legs)
    except GraphError as error:
        raise NotationError(f"{text.strip()!r} is not a valid graph: {error}") from None
    if graph.is_stable():
        return StableCurveGraph._from_canonical(
            graph.vertex_genera, graph.nodes, graph.vertex_legs, graph.key, graph._aut_v
        )
    return graph


def graph_parts(text: str) -> tuple[list[int], list[list[int]], list[tuple[int, int]]]:
    """The vertices (genera, legs) and edges of a notation in the order
    written, not canonically reordered (for pictures that keep the user's
    numbering); the notation is checked as by :func:`parse_graph`.

    >>> graph_parts("g1, g0{2,1} | 1-0, 1-1")
    ([1, 0], [[], [2, 1]], [(1, 0), (1, 1)])
    """
    parse_graph(text)
    genera, legs, edges = _Parser(text).graph()
    return genera, legs, edges


class _Parser:
    """Recursive-descent parser with 0-based column positions."""

    def __init__(self, text: str) -> None:
        self.text, self.pos, self.items = text, 0, 0

    def _count(self, items: int) -> None:
        # vertices, edges and legs read so far, at most MAX_GRAPH_ITEMS
        self.items += items
        if self.items > MAX_GRAPH_ITEMS:
            raise NotationError(f"column {self.pos}: the graph has more than {MAX_GRAPH_ITEMS} "
                                "vertices, edges and legs")

    def graph(self) -> tuple[list[int], list[list[int]], list[tuple[int, int]]]:
        genera: list[int] = []
        legs: list[list[int]] = []
        while True:
            g, x = self._vertex()
            self._count(1 + len(x))
            genera.append(g)
            legs.append(x)
            if not self._accept(","):
                break
        edges: list[tuple[int, int]] = []
        if self._accept("|"):
            if self._peek() != "":
                edges = self._edges(len(genera))
        if self._peek() != "":
            self._fail("',' or '|' or the end" if not edges else "',' or the end")
        return genera, legs, edges

    def _vertex(self) -> tuple[int, list[int]]:
        self._expect("g", "'g' starting a vertex (as in g0 or g1{2,3})")
        genus = self._int("a genus after 'g'")
        labels: list[int] = []
        if self._accept("{"):
            if not self._accept("}"):
                labels.append(self._int("a leg label"))
                while self._accept(","):
                    labels.append(self._int("a leg label"))
                self._expect("}", "',' or '}' in the list of legs")
        return genus, labels

    def _edges(self, n: int) -> list[tuple[int, int]]:
        edges: list[tuple[int, int]] = []
        while True:
            a = self._index(n)
            self._expect("-", "'-' between the two ends of an edge")
            b = self._index(n)
            m = 1
            if self._accept("^"):
                column = self._column()
                m = self._int("an edge multiplicity after '^'")
                if m < 1:
                    raise NotationError(f"column {column}: edge multiplicity must be at least 1")
                if self.items + m > MAX_GRAPH_ITEMS:
                    raise NotationError(f"column {column}: edge multiplicity {m} makes the graph larger than "
                                        f"{MAX_GRAPH_ITEMS} vertices, edges and legs")
            self._count(m)
            edges.extend([(a, b)] * m)
            if not self._accept(","):
                return edges

    def _index(self, n: int) -> int:
        column = self._column()
        v = self._int("a vertex index")
        if v >= n:
            plural = "vertex" if n == 1 else "vertices"
            raise NotationError(
                f"column {column}: vertex index {v} out of range (the graph has {n} {plural})"
            )
        return v

    # -- tokens --------------------------------------------------------------
    def _skip(self) -> None:
        while self.pos < len(self.text) and self.text[self.pos].isspace():
            self.pos += 1

    def _column(self) -> int:
        self._skip()
        return self.pos

    def _peek(self) -> str:
        self._skip()
        return self.text[self.pos] if self.pos < len(self.text) else ""

    def _accept(self, char: str) -> bool:
        if self._peek() == char:
            self.pos += 1
            return True
        return False

    def _expect(self, char: str, what: str) -> None:
        if not self._accept(char):
            self._fail(what)

    def _int(self, what: str) -> int:
        self._skip()
        start = self.pos
        while self.pos < len(self.text) and self.text[self.pos] in "0123456789":
            self.pos += 1
        if start == self.pos:
            self._fail(what)
        digits = self.text[start : self.pos]
        if len(digits.lstrip("0")) > MAX_DIGITS:
            raise NotationError(f"column {start}: a number of {len(digits)} digits; at most {MAX_DIGITS} allowed")
        return int(digits)

    def _fail(self, what: str):
        found = self._peek()
        found = f"found {found!r}" if found else "found the end"
        raise NotationError(f"column {self.pos}: expected {what}, {found}")
