"""`validate` and `build` share every rule: a spec validate passes always builds, and a spec
build refuses, validate refuses with the same JSON path. Specs come from the generator's
risky mode (extreme values, 0 to 40 lines, 1 to 12 levels, rules broken the way real specs
break them). `verify` and `read-back` of a workbook whose embedded spec breaks a rule say so.

Rules checked here, each with its source: SDPWS-2015 Table 4.3.4 aspect-ratio limit 3.5 for
blocked wood structural panels (from memory); ASCE 7-16 §12.3.1.1 flexible diaphragm spans
between distinct lines (derived: two lines at one position give a span of zero length);
spreadsheet sheet names unique ignoring case (ECMA-376 Part 1 §18.2.20).
"""

from __future__ import annotations

import json
import random
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from latbook.build import spec_digest
from latbook.cli import EXIT_BAD_INPUT, EXIT_OK, main
from latbook.engine.errors import CodeLimitError
from latbook.spec.load import parse_spec
from latbook.verify import verify_workbook
from latbook.workbook.builder import write_workbook
from tests.helpers.specgen import make_spec, rename_level, risky_spec

REPEATABLE = settings(
    derandomize=True,
    deadline=None,
    database=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.function_scoped_fixture],
)


def base_spec() -> dict:
    return make_spec(random.Random(41), 2, 2, seismic="site_class", wind=True)


def validate_and_build(folder: Path, capsys, spec: dict) -> tuple[int, int, str, str]:
    """(validate rc, build rc, validate stderr, build stderr); never a traceback."""
    spec_path = folder / "spec.json"
    spec_path.write_text(json.dumps(spec), encoding="utf-8")
    out = folder / "calc.xlsx"
    rc_v = main(["validate", str(spec_path)])
    err_v = capsys.readouterr().err
    rc_b = main(["build", str(spec_path), "-o", str(out)])
    err_b = capsys.readouterr().err
    assert "Traceback" not in err_v + err_b
    assert out.exists() == (rc_b == EXIT_OK)
    return rc_v, rc_b, err_v, err_b


def _stack_onto_nothing(spec):
    upper, lower = spec["wall_lines"][0]["stories"][:2]  # top-down
    upper["segments"][0]["hold_down_continues_below"] = True
    lower["segments"][0]["id"] = "other"
    return "$.wall_lines[0].stories[0].segments[0].hold_down_continues_below", "stacking"


def _same_position(spec):
    spec["wall_lines"][1]["position_ft"] = spec["wall_lines"][0]["position_ft"]
    return "$.wall_lines[1].position_ft", "distinct_position"


def _every_segment_too_slender(spec):
    for seg in spec["wall_lines"][0]["stories"][1]["segments"]:
        seg["height_ft"] = 3.6 * seg["length_ft"]
    return "$.wall_lines[0].stories[1].segments", "aspect_ratio"


def _level_in(spec):
    rename_level(spec, spec["building"]["levels"][1]["id"], "in")
    return "$.building.levels[1].id", "sheet_name"


def _level_IN(spec):
    rename_level(spec, spec["building"]["levels"][0]["id"], "IN")
    return "$.building.levels[0].id", "sheet_name"


BROKEN = [_stack_onto_nothing, _same_position, _every_segment_too_slender, _level_in, _level_IN]


@pytest.mark.parametrize("breaker", BROKEN, ids=[b.__name__.strip("_") for b in BROKEN])
def test_rule_build_used_to_refuse_with_a_traceback_is_refused_by_both(breaker, tmp_path, capsys):
    spec = base_spec()
    assert spec["wall_lines"][0]["direction"] == spec["wall_lines"][1]["direction"] == "x"
    path, rule = breaker(spec)
    rc_v, rc_b, err_v, err_b = validate_and_build(tmp_path, capsys, spec)
    assert rc_v == rc_b == EXIT_BAD_INPUT
    for err in (err_v, err_b):
        assert f"  {path}: " in err and f"[{rule}]" in err, err


def test_segment_past_the_limit_with_another_that_qualifies_builds(tmp_path, capsys):
    """Only a line with no qualifying segment is refused (SDPWS §4.3.3.4.1: k = 0 for the
    slender one, the other carries the line)."""
    spec = base_spec()
    segments = spec["wall_lines"][0]["stories"][1]["segments"]
    if len(segments) < 2:
        segments.append(
            {**segments[0], "id": "extra", "start_ft": 0.0, "length_ft": 0.5, "height_ft": 9.0}
        )
        segments[0]["start_ft"] = max(segments[0]["start_ft"], 1.0)
    else:
        segments[0]["height_ft"] = 3.6 * segments[0]["length_ft"]
    segments[-1]["hold_down_offset_ft"] = 0.1
    rc_v, rc_b, _, err = validate_and_build(tmp_path, capsys, spec)
    assert rc_v == rc_b == EXIT_OK, err


@settings(REPEATABLE, max_examples=30)
@given(n_levels=st.integers(1, 12), n_lines=st.integers(0, 40), seed=st.integers(0, 2**32 - 1))
def test_validate_and_build_agree_on_risky_specs(n_levels, n_lines, seed, tmp_path_factory, capsys):
    spec = risky_spec(random.Random(seed), n_levels, n_lines)
    folder = tmp_path_factory.mktemp("risky")
    rc_v, rc_b, err_v, err_b = validate_and_build(folder, capsys, spec)
    assert rc_v == rc_b and rc_v in (EXIT_OK, EXIT_BAD_INPUT), err_v + err_b
    if rc_v == EXIT_BAD_INPUT:
        first = [line for line in err_v.splitlines() if line.startswith("  $")]
        assert first and first[0] in err_b


@pytest.mark.parametrize("command", ["validate", "build", "results"])
def test_case_the_engine_refuses_after_every_rule_holds_is_a_clean_refusal(
    command, tmp_path, capsys, monkeypatch
):
    """The last resort: a refusal the rules missed still gives exit 2 and a message."""

    def refuse(spec):
        raise CodeLimitError("a case no rule foresaw (ASCE 7-16 §0.0)")

    monkeypatch.setattr("latbook.build.compute_results", refuse)
    spec_path = tmp_path / "spec.json"
    spec_path.write_text(json.dumps(base_spec()), encoding="utf-8")
    args = [command, str(spec_path)] + (
        ["-o", str(tmp_path / "c.xlsx")] if command == "build" else []
    )
    rc = main(args)
    err = capsys.readouterr().err
    assert rc == EXIT_BAD_INPUT
    assert "  $: the engine cannot compute: a case no rule foresaw" in err
    assert "Traceback" not in err and not (tmp_path / "c.xlsx").exists()


def test_verify_and_read_back_of_a_workbook_whose_embedded_spec_breaks_a_rule(tmp_path, capsys):
    good = base_spec()
    spec = parse_spec(good)
    from latbook.analysis import compute_results

    bad = json.loads(json.dumps(good))
    _same_position(bad)
    text, digest = spec_digest(bad)
    book = tmp_path / "calc.xlsx"
    write_workbook(spec, compute_results(spec), book, spec_json=text, spec_sha256=digest)
    for args in (["verify", str(book)], ["read-back", str(book), "-o", str(tmp_path / "s.json")]):
        rc = main(args)
        err = capsys.readouterr().err
        assert rc == EXIT_BAD_INPUT, args
        assert "the embedded spec does not validate" in err and "distinct_position" in err
        assert "Traceback" not in err
    assert not (tmp_path / "s.json").exists()
    with pytest.raises(Exception, match="does not validate"):
        verify_workbook(book)
