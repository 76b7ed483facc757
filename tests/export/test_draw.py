"""Images written by the drawer (skipped without the extra covertree[draw])."""

import pytest

from covertree.graphs.notation import parse_graph

pytest.importorskip("matplotlib")

from covertree.export.draw import draw_graph, draw_pair  # noqa: E402


@pytest.mark.parametrize("notation", ["g3", "g0 | 0-0^3", "g0, g0 | 0-0, 0-1^2, 1-1", "g0{1,2,3}, g0{4,5,6} | 0-1"])
def test_png_and_svg(tmp_path, notation):
    g = parse_graph(notation)
    draw_graph(g, str(tmp_path / "g.png"))
    draw_graph(g, str(tmp_path / "g.svg"))
    assert (tmp_path / "g.png").read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
    assert b"<svg" in (tmp_path / "g.svg").read_bytes()[:2000]


def test_pair(tmp_path):
    source = parse_graph("g0, g1 | 0-1^2")
    base = parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1")
    draw_pair(source, ["1", "1"], base, ["1,1"], 2, str(tmp_path / "c.png"))
    assert (tmp_path / "c.png").read_bytes()[:4] == b"\x89PNG"


def test_unknown_suffix(tmp_path):
    from covertree.errors import InputError

    with pytest.raises(InputError, match=".svg or .png"):
        draw_graph(parse_graph("g2"), str(tmp_path / "g.jpg"))
