"""``covertree merge`` of hostile files: each refused with one line naming
the file and the fault, exit 2, no output file, memory bounded
(issue 14, one-line errors)."""

import copy
import json
import resource

import pytest

from tests.sweep.helpers import invoke

SWEEP = ["sweep", "-g", "2", "-t", "1", "-d", "2..3", "-f", "json", "-q"]


@pytest.fixture(scope="module")
def shards(tmp_path_factory):
    folder = tmp_path_factory.mktemp("shards")
    docs = []
    for i in (1, 2):
        result = invoke(*SWEEP, "--shard", f"{i}/2")
        assert result.exit_code == 0, result.stderr
        docs.append(json.loads(result.stdout))
    return folder, docs


def refused(result, *words) -> str:
    assert result.exit_code == 2, (result.stdout, result.stderr)
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in result.stderr, result.stderr
    assert result.stdout == "" and len(lines[0]) < 300, lines[0]
    assert all(word in lines[0] for word in words), lines[0]
    return lines[0]


def merge_edited(tmp_path, docs, edit, *words):
    """Merge shard 1 edited by ``edit`` (given the document) with shard 2."""
    first = copy.deepcopy(docs[0])
    edit(first)
    paths = [tmp_path / "one.json", tmp_path / "two.json"]
    paths[0].write_text(json.dumps(first))
    paths[1].write_text(json.dumps(docs[1]))
    output = tmp_path / "merged.json"
    line = refused(invoke("merge", *map(str, paths), "-o", str(output)), *words)
    assert not output.exists()
    return line


def test_the_shards_merge(tmp_path, shards):
    paths = [tmp_path / f"{i}.json" for i in (1, 2)]
    for path, doc in zip(paths, shards[1]):
        path.write_text(json.dumps(doc))
    assert invoke("merge", *map(str, paths), "-q", "-f", "json").stdout == invoke(*SWEEP).stdout


def write(tmp_path, data: bytes):
    path = tmp_path / "hostile.json"
    path.write_bytes(data)
    return str(path)


@pytest.mark.parametrize("data, words", [
    (b'{"model_version": 1, "strata": []}\xff\xfe', ["not UTF-8", "byte 34"]),
    (b"\xc3\x28", ["not UTF-8"]),
    (b"[" * 100000, ["nested deeper than 32"]),
    (b'{"a": ' * 50000 + b"1" + b"}" * 50000, ["nested deeper"]),
    (b"{not json", ["not JSON"]),
    (b"", ["not JSON"]),
    (b'"1/0"', ["not a covertree sweep"]),
    (b"[1, 2]", ["not a covertree sweep"]),
])
def test_unreadable_files_refused(tmp_path, data, words):
    refused(invoke("merge", write(tmp_path, data)), "hostile.json", *words)


def set_path(path, value):
    def edit(doc):
        inner = doc
        for key in path[:-1]:
            inner = inner[key]
        inner[path[-1]] = value
    return edit


@pytest.mark.parametrize("path, value, words", [
    (["strata", 0, "hurwitz_number"], "1/0", ["strata[0].hurwitz_number", "rational", "'1/0'"]),
    (["strata", 0, "total_weight"], "0.5", ["strata[0].total_weight", "rational"]),
    (["strata", 0, "landing", "other"], 0.5, ["strata[0].landing.other", "rational"]),
    (["strata", 0, "landing"], ["1/2"], ["strata[0].landing", "an object"]),
    (["strata", 0, "landing", "delta_7"], "1", ["landing keys", "delta_7"]),
    (["strata", 0, "total_weight"], "12345", ["total_weight", "sum of the landing"]),
    (["strata", 0, "degree"], "2", ["strata[0].degree", "an integer", "'2'"]),
    (["strata", 0, "degree"], True, ["strata[0].degree", "an integer"]),
    (["strata", 0, "profiles"], [[2], "x" * 24000], ["strata[0].profiles[1]", "a list"]),
    (["strata", 0, "base"], "g9 | 0-" + "1" * 5000, ["row over 'g9 | 0-111", "..."]),
    (["strata", 0, "base"], "g0 | 0-0", ["row over 'g0 | 0-0'"]),
    (["strata", 0, "base"], None, ["strata[0].base", "a text"]),
    (["strata"], {"0": 1}, ["strata", "a list"]),
    (["problems"], None, ["problems", "a list"]),
    (["skipped"], [{"genus": None}], ["skipped[0].target_genus", "missing"]),
    (["sweep", "degree"], "2..3", ["sweep.degree", "a list"]),
    (["model_version"], "1" * 24000, ["model version", "..."]),
])
def test_wrong_types_and_values_refused(tmp_path, shards, path, value, words):
    merge_edited(tmp_path, shards[1], set_path(path, value), "one.json", *words)


@pytest.mark.parametrize("shard, words", [
    ({"index": 1, "count": 10 ** 12, "tasks": 7}, ["shard 1/1000000000000 of 7 tasks", "impossible"]),
    ({"index": 0, "count": 2, "tasks": 7}, ["impossible"]),
    ({"index": 1, "count": 2, "tasks": 10 ** 400}, ["different sweeps"]),
    ({"index": 1, "count": 2, "tasks": 1}, ["impossible"]),
])
def test_impossible_shards_refused(tmp_path, shards, shard, words):
    merge_edited(tmp_path, shards[1], set_path(["shard"], shard), "one.json", *words)


def test_a_huge_shard_count_refused_in_bounded_memory(tmp_path, shards):
    docs = copy.deepcopy(shards[1])
    paths = []
    for i, doc in enumerate(docs, 1):
        doc["shard"] = {"index": i, "count": 10 ** 12, "tasks": 10 ** 12}
        doc["task_indices"], doc["strata"] = [i - 1], doc["strata"][:1]
        paths.append(tmp_path / f"{i}.json")
        paths[-1].write_text(json.dumps(doc))
    before = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    refused(invoke("merge", *map(str, paths)), "3/1000000000000", "and 999999999993 more")
    grown_kib = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss - before
    assert grown_kib < 200_000  # a list of the 10^12 shards would need terabytes


def test_task_indices_outside_the_slice_refused(tmp_path, shards):
    def edit(doc):
        doc["task_indices"][0] += 1
    merge_edited(tmp_path, shards[1], edit, "task_indices do not match")
