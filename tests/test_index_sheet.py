"""Every registered quantity can be found from the workbook's own Index sheet by its id."""

from __future__ import annotations

import json
from pathlib import Path

from latbook.build import build_workbook
from latbook.workbook.index_sheet import locate_in_index

ROOT = Path(__file__).resolve().parents[1]


def test_every_id_located_through_the_index(tmp_path):
    spec = json.loads((ROOT / "out_examples" / "harbor_workshop" / "spec.json").read_text())
    built = build_workbook(spec, tmp_path / "calc.xlsx")
    wrong = {
        qid: (entry.address, locate_in_index(built.path, qid))
        for qid, entry in built.registry.entries.items()
        if locate_in_index(built.path, qid) != entry.address
    }
    assert not wrong, list(wrong.items())[:5]
    assert locate_in_index(built.path, "no.such.quantity") is None
