"""Every LaTeX fragment covertree prints, pasted into the body of a plain
``article`` and of an ``amsart`` document and compiled with pdflatex: it must
compile, raise no font warning and overfill no line by more than a few points.

Skipped cleanly when pdflatex is not installed.  The preamble is the one the
README documents for pasting (:data:`covertree.export.latex.PASTE_PACKAGES`).
"""

import re
import shutil
import subprocess

import pytest
from click.testing import CliRunner

from covertree.cli import main
from covertree.export.latex import PASTE_PACKAGES

#: Overfull boxes up to this many points are tolerated (rounding, hyphenation).
TOLERANCE_PT = 3.0

#: One invocation per command and LaTeX format, on the problems of the samples
#: and of the issue that found the overflows (kept small enough to compile fast).
FRAGMENTS = {
    "count": ["count", "-g", "3", "-t", "1", "-d", "3", "-f", "latex"],
    "count-profiles": ["count", "-t", "0", "-d", "4", "-p", "3,1", "-p", "2,2", "-p", "2,2", "-f", "latex"],
    "strata": ["strata", "-t", "3", "-n", "0", "-f", "latex"],
    "strata-legs": ["strata", "-t", "0", "-n", "6", "-k", "1", "-f", "latex"],
    "strata-tikz": ["strata", "-t", "3", "-n", "0", "-f", "tikz"],
    "strata-tikz-legs": ["strata", "-t", "1", "-n", "3", "-k", "2", "-f", "tikz"],
    "catalogue": ["catalogue", "-g", "3", "-t", "1", "-d", "2", "-k", "1", "-f", "latex"],
    "catalogue-hyperelliptic": ["catalogue", "-g", "3", "-t", "0", "-d", "2", "-k", "1", "-f", "latex"],
    "catalogue-tikz": ["catalogue", "-g", "2", "-t", "1", "-d", "3", "-f", "tikz"],
    "catalogue-tikz-elliptic": ["catalogue", "-g", "2", "-t", "1", "-d", "2", "-k", "2", "-f", "tikz"],
    "pullback": ["pullback", "-g", "3", "-t", "0", "-d", "2", "-f", "latex"],
    "pullback-elliptic": ["pullback", "-g", "2", "-t", "1", "-d", "3", "-f", "latex"],
    "sweep": ["sweep", "-t", "0", "-d", "2..3", "-g", "2..3", "-q", "-f", "latex"],
    "locus": ["locus", "-g", "2", "-t", "1", "-d", "2", "-f", "latex"],
    "series": ["series", "-g", "2", "-t", "1", "-D", "7", "-w", "6", "--mixed", "-f", "latex"],
}

CLASSES = ["article", "amsart"]


def fragment(name: str) -> str:
    result = CliRunner().invoke(main, FRAGMENTS[name])
    assert result.exit_code == 0, result.output
    return result.stdout


def document(document_class: str, body: str) -> str:
    return "\n".join([
        rf"\documentclass{{{document_class}}}",
        r"\usepackage{" + ",".join(PASTE_PACKAGES) + "}",
        r"\begin{document}",
        "Some text before the fragment.",
        "",
        body,
        "",
        "Some text after it.",
        r"\end{document}",
        "",
    ])


def compile_log(tmp_path, source: str) -> str:
    (tmp_path / "paste.tex").write_text(source)
    run = subprocess.run(["pdflatex", "-interaction=nonstopmode", "-halt-on-error", "paste.tex"],
                         cwd=tmp_path, capture_output=True, text=True, timeout=300)
    log = (tmp_path / "paste.log").read_text(errors="replace")
    assert run.returncode == 0, log[-3000:]
    return log


def overfull_points(log: str) -> list[float]:
    """The amounts (pt) of the overfull boxes reported in a pdflatex log."""
    return [float(x) for x in re.findall(r"Overfull \\[hv]box \(([0-9.]+)pt too", log)]


def test_overfull_points_reads_the_log():
    log = "Overfull \\hbox (179.2pt too wide) in paragraph\nOverfull \\vbox (2.0pt too high) has"
    assert overfull_points(log) == [179.2, 2.0]


@pytest.mark.skipif(shutil.which("pdflatex") is None, reason="pdflatex is not installed")
@pytest.mark.parametrize("document_class", CLASSES)
@pytest.mark.parametrize("name", sorted(FRAGMENTS))
def test_fragment_pastes_cleanly(tmp_path, name, document_class):
    log = compile_log(tmp_path, document(document_class, fragment(name)))
    too_wide = [x for x in overfull_points(log) if x > TOLERANCE_PT]
    assert not too_wide, f"{name} in {document_class}: overfull by {too_wide} pt"
    assert "Font shape" not in log, re.findall(r".*Font shape.*", log)
    assert "Missing character" not in log
