"""Mutation testing of one covertree layer at a time.

Usage: ``python tools/mutate.py LAYER`` (``make mutate LAYER=...``).  The layer's
modules and the tests that exercise them are copied into ``build/mutate/LAYER``
with a configuration of their own, the mutation tool runs there (so the work tree
is left alone), and the score is printed as ``LAYER: killed/total``, followed by
the names of the surviving mutants.

``python tools/mutate.py LAYER --again`` (``make mutate LAYER=... AGAIN=1``)
refreshes the code and the tests of an existing scratch copy and keeps its
verdicts: mutants of unchanged functions that were killed stay killed (tests
are only ever added), mutants of changed functions are made and run afresh,
and the survivors are run again against the new tests.  This is the quick
loop while killing survivors; a fresh run gives the same score.  The scratch
copy keeps its test selection (a new test file inside a selected folder is
picked up; a changed selection in ``LAYERS`` needs a fresh run).

References
----------
R. A. DeMillo, R. J. Lipton and F. G. Sayward, "Hints on test data selection:
help for the practicing programmer", Computer 11 (1978): mutation analysis.
"""

from __future__ import annotations

import shutil
import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent

#: the slowest cases of the brute-force check of Frobenius' formula (degree 5,
#: about 7 s each unloaded); degrees 1 to 4 of the same tests stay selected
_SLOW_BRUTE_FORCE = [f"--deselect=tests/hurwitz/test_numbers.py::test_against_brute_force[5-{h}]" for h in (0, 1)]

#: layer -> (modules to mutate, tests that exercise them; the layer's doctests
#: run too).  An entry starting with ``-`` is a pytest option (``--deselect=``
#: leaves out the slowest cases of a selected file).
LAYERS: dict[str, tuple[list[str], list[str]]] = {
    "symmetric": (["covertree/symmetric/*"], [
        "tests/symmetric", "tests/hurwitz/test_numbers.py", "tests/hurwitz/test_published_hurwitz.py",
        *_SLOW_BRUTE_FORCE]),
    "hurwitz": (["covertree/hurwitz/*"], ["tests/hurwitz", *_SLOW_BRUTE_FORCE]),
    "graphs": (["covertree/graphs/*"], ["tests/graphs"]),
    "monodromy": (["covertree/monodromy/*"], ["tests/monodromy"]),
    "gluing": (["covertree/gluing/*"], ["tests/gluing", "tests/catalogue/test_oracle_agreement.py"]),
    "stabilisation": (["covertree/stabilisation/*"], [
        "tests/stabilisation", "tests/catalogue/test_lcm_structure.py"]),
    "catalogue": (
        ["covertree/catalogue/local_structure.py", "covertree/catalogue/pullback.py"],
        ["tests/catalogue/test_local_structure.py", "tests/catalogue/test_lcm_structure.py",
         "tests/catalogue/test_pullback.py", "tests/catalogue/test_published_pullback.py",
         "tests/catalogue/test_pullback_marks.py",
         "tests/catalogue/test_hand_examples.py"],
    ),
    "tallies": (["covertree/tallies/*"], ["tests/tallies"]),
    "intersection": (["covertree/intersection/*"], ["tests/intersection", "tests/locus/test_published_marks.py"]),
}


def _config(modules: list[str], tests: list[str]) -> str:
    """The ``pyproject.toml`` of the scratch copy: the package plus the tool's section."""
    text = (ROOT / "pyproject.toml").read_text("utf-8")
    head = text.split("[tool.pytest.ini_options]")[0]
    doctests = sorted({m.rsplit("/", 1)[0] if m.endswith("*") else m for m in modules})
    quoted = ", ".join(f'"{t}"' for t in tests + doctests)
    only = ", ".join(f'"{m}"' for m in modules)
    return head + (
        '[tool.pytest.ini_options]\naddopts = "--doctest-modules -p no:cacheprovider"\n\n'
        "[tool.mutmut]\n"
        'source_paths = ["covertree"]\n'
        f"only_mutate = [{only}]\n"
        f"pytest_add_cli_args_test_selection = [{quoted}]\n"
        # each mutant in a fresh process: no cache filled by the clean run survives
        'process_isolation = "forkserver"\n'
        # a mutant gets 6 (est + 1) s of CPU, est the time of its tests in the
        # clean run (the tool's default, 30 (est + 1), let each endless loop
        # hold a niced child for many minutes on the shared cores)
        "timeout_multiplier = 3.0\n"
        "use_setproctitle = false\n"
    )


def _copy_tests(work: Path, revision: str | None) -> None:
    """The tests of the work tree, or those of ``revision`` (a baseline score)."""
    if revision is None:
        ignore = shutil.ignore_patterns("__pycache__", ".hypothesis")
        shutil.copytree(ROOT / "tests", work / "tests", ignore=ignore)
        return
    archive = subprocess.run(["git", "archive", revision, "tests"], cwd=ROOT,
                             capture_output=True, check=True).stdout
    subprocess.run(["tar", "-x", "-C", str(work)], input=archive, check=True)


def _prepare(layer: str, revision: str | None) -> Path:
    """A fresh scratch copy of the package and the tests for ``layer``."""
    modules, tests = LAYERS[layer]
    work = ROOT / "build" / "mutate" / (layer if revision is None else f"{layer}-baseline")
    if work.exists():
        shutil.rmtree(work)
    work.mkdir(parents=True)
    ignore = shutil.ignore_patterns("__pycache__", ".hypothesis")
    shutil.copytree(ROOT / "covertree", work / "covertree", ignore=ignore)
    _copy_tests(work, revision)
    present = [t for t in tests if t.startswith("-") or (work / t).exists()]
    (work / "pyproject.toml").write_text(_config(modules, present), "utf-8")
    return work


def _refresh(layer: str) -> Path:
    """The scratch copy of ``layer`` with the work tree's code and tests, its
    verdicts kept (a fresh copy if there is none).  Its configuration is kept
    too: the tool drops every verdict when the test selection changes, so a
    layer whose selection in :data:`LAYERS` changed needs a fresh run."""
    work = ROOT / "build" / "mutate" / layer
    if not (work / "mutants").is_dir():
        return _prepare(layer, None)
    ignore = shutil.ignore_patterns("__pycache__", ".hypothesis")
    for name in ("covertree", "tests"):
        shutil.rmtree(work / name)
        shutil.copytree(ROOT / name, work / name, ignore=ignore)
    return work


def _score(work: str | Path, tool: Path) -> tuple[int, int, list[str]]:
    """Killed and total mutants, and the survivors' names, from the tool's results."""
    out = subprocess.run(
        [str(tool), "results", "--all", "true"], cwd=work, capture_output=True, text=True
    ).stdout
    rows = [line.strip().rsplit(": ", 1) for line in out.splitlines() if ": " in line]
    total = [r for r in rows if len(r) == 2]
    survivors = sorted(name for name, status in total if status in ("survived", "no tests"))
    killed = sum(1 for _, status in total if status in ("killed", "timeout", "segfault"))
    return killed, len(total), survivors


def main(argv: list[str]) -> int:
    """Run the tool on the layer named in ``argv`` and print its score;
    ``--tests-from REV`` scores the layer's code against the tests of ``REV``,
    ``--again`` reruns an existing scratch copy (module docstring)."""
    revision, again = None, False
    if len(argv) == 3 and argv[1] == "--tests-from":
        argv, revision = argv[:1], argv[2]
    if len(argv) == 2 and argv[1] == "--again":
        argv, again = argv[:1], True
    if len(argv) != 1 or argv[0] not in LAYERS:
        sys.stderr.write(f"usage: mutate.py LAYER [--tests-from REV | --again], LAYER one of {', '.join(LAYERS)}\n")
        return 2
    tool = Path(sys.executable).parent / "mutmut"
    work = _refresh(argv[0]) if again else _prepare(argv[0], revision)
    run = ["nice", "-n", "10", str(tool), "run", "--max-children", "1"]
    subprocess.run(run, cwd=work)
    if again:
        survivors = _score(work, tool)[2]
        if survivors:
            subprocess.run(run + survivors, cwd=work)
    killed, total, survivors = _score(work, tool)
    label = argv[0] if revision is None else f"{argv[0]} (tests of {revision})"
    print(f"{label}: {killed}/{total} killed")
    for name in survivors:
        print(f"  survived: {name}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
