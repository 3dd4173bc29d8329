"""`latbook results`: plain figures with their units, the same values as the JSON output."""

from __future__ import annotations

import json
import re
from pathlib import Path

import pytest

from latbook.cli import main

CEDAR = Path(__file__).resolve().parents[1] / "out_examples" / "cedar_row" / "spec.json"


def _text_and_json(capsys) -> tuple[dict[str, str], dict]:
    assert main(["results", str(CEDAR)]) == 0
    lines = capsys.readouterr().out.splitlines()
    assert main(["results", str(CEDAR), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    text = dict(line.split(" = ", 1) for line in lines)
    return text, data


def test_results_text_has_units_and_no_float_noise(capsys):
    text, data = _text_and_json(capsys)
    assert set(text) == set(data)
    # units from the workbook's rows (templates_src/20_seismic.toml): V and W in kip
    assert text["seismic.V"].endswith(" kip") and text["seismic.W"].endswith(" kip")
    assert text["seismic.W"] == "173.83 kip"  # the demo's weight takeoff sum, as stored
    numbers = 0
    for key, shown in text.items():
        value = data[key]
        if not isinstance(value, float):
            continue
        numbers += 1
        figure = shown.split(" ", 1)[0]
        # at most 10 significant digits: no binary noise such as 0.45999999999999996
        assert len(re.sub(r"[^0-9]", "", figure.split("e")[0]).lstrip("0")) <= 10, (key, figure)
        assert float(figure) == pytest.approx(value, rel=1e-9, abs=1e-12), key
    assert numbers > 1000
