"""Smaller variants of the 3-story example maple_terrace (invented data), for tests whose
point is a mechanism (live inputs, hold-downs stacked over stories, narrow segments) rather
than the whole building. The `formulas` package recomputes about 8 ms a formula cell, and
most of a workbook's cells belong to the wall lines and the levels, so dropping lines the
test does not read (and a story, where the test needs two) halves the cost. Every example
is still recomputed in full by tests/test_parity_examples.py and
tests/test_libreoffice_recalc_examples.py.
"""

from __future__ import annotations

import copy
import json
from pathlib import Path
from typing import Any

DEMO_SPEC = Path(__file__).resolve().parents[2] / "out_examples" / "maple_terrace" / "spec.json"
STORY_HEIGHT_FT = 10.5  # the demo's level elevations: 10.5, 21.0, 31.5 ft


def demo_spec() -> dict[str, Any]:
    return json.loads(DEMO_SPEC.read_text(encoding="utf-8"))


def demo_with_lines(lines: tuple[str, ...], *, stories: int = 3) -> dict[str, Any]:
    """The demo keeping only the wall lines `lines` (ids), with `stories` stories (3: as
    built; 2: the third floor L3 left out, the roof and the mean roof height one story
    lower)."""
    data = copy.deepcopy(demo_spec())
    data["wall_lines"] = [line for line in data["wall_lines"] if line["id"] in lines]
    assert {line["id"] for line in data["wall_lines"]} == set(lines), lines
    if stories == 2:
        levels = data["building"]["levels"]
        data["building"]["levels"] = [lv for lv in levels if lv["id"] != "L3"]
        roof = data["building"]["levels"][-1]
        assert roof["id"] == "RF"
        roof["elevation_ft"] -= STORY_HEIGHT_FT
        data["wind"]["mean_roof_height_ft"] -= STORY_HEIGHT_FT
        for line in data["wall_lines"]:
            line["stories"] = [s for s in line["stories"] if s["level"] != "L3"]
    elif stories != 3:
        raise ValueError(f"stories must be 2 or 3, not {stories}")
    return data
