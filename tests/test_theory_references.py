"""The project's account of its mathematics is in the repository, and every
reference to it from the code points at a section that exists."""

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
THEORY = ROOT / "docs" / "theory.md"


def _sections() -> set[int]:
    return {int(m) for m in re.findall(r"^## (\d+)\.", THEORY.read_text(), flags=re.M)}


def _references() -> list[tuple[str, int]]:
    found = []
    for path in [*ROOT.glob("covertree/**/*.py"), *ROOT.glob("tests/**/*.py"), ROOT / "DEVELOPERS.md"]:
        text = path.read_text()
        for m in re.finditer(r"docs/theory\.md,\s+sections?\s+(\d+)(?:\s+and\s+(\d+))?", text):
            found += [(path.name, int(n)) for n in m.groups() if n]
    return found


def test_cited_sections_exist():
    refs = _references()
    assert len(refs) >= 20
    assert [r for r in refs if r[1] not in _sections()] == []


def test_no_reference_leaves_the_repository():
    for path in [*ROOT.glob("covertree/**/*.py"), ROOT / "DEVELOPERS.md", ROOT / "README.md"]:
        assert "../" + "shared" not in path.read_text(), path
