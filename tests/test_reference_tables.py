"""The workbook's own copy of the standards' tables (templates_src/tables) equals the
engine's copy in code. Both were typed independently from ASCE 7-16 (from memory); the
engine's copies are checked against the published tables in tests/engine/."""

from __future__ import annotations

import pytest

from latbook.engine.asce7_16 import elf, importance, sdc, site
from latbook.workbook.templates import reference_tables

TABLES = reference_tables()


@pytest.mark.parametrize("site_class", ["A", "B", "C", "D", "E"])
def test_fa_rows(site_class):
    """Every tabulated cell equals the engine's; an untabulated one holds the standard's
    "See §11.4.8" text in the workbook and None in the engine, never a number."""
    t = TABLES["Fa"]
    assert t["columns"] == list(site.TABLE_11_4_1_SS_G)
    row = t["values"][t["rows"].index(site_class)]
    for printed, value in zip(site.TABLE_11_4_1_FA[site_class], row, strict=True):
        if printed is None:
            assert value == "See §11.4.8"
        else:
            assert value == pytest.approx(printed, abs=1e-12)


@pytest.mark.parametrize("site_class", ["A", "B", "C", "D", "E"])
def test_fv_rows(site_class):
    """Supplement No. 1 tabulates every Site A-E cell of Table 11.4-2."""
    t = TABLES["Fv"]
    assert t["columns"] == list(site.TABLE_11_4_2_S1_G)
    row = t["values"][t["rows"].index(site_class)]
    assert row == pytest.approx(list(site.TABLE_11_4_2_FV[site_class]), abs=1e-12)


def test_site_tables_print_the_footnote_and_nothing_invented():
    notes = " ".join(TABLES["Fv"]["notes"])
    assert "used only for calculation of TS" in notes
    assert all(isinstance(v, float) for row in TABLES["Fv"]["values"] for v in row)
    texts = [v for row in TABLES["Fa"]["values"] for v in row if isinstance(v, str)]
    assert texts == ["See §11.4.8"] * 3


def test_importance_factors():
    t = TABLES["Ie"]
    for rc, (value,) in zip(t["rows"], t["values"], strict=True):
        assert value == importance.Ie_seismic(rc)


def test_period_parameters():
    t = TABLES["Ct_x"]
    for key, (ct, x) in zip(t["rows"], t["values"], strict=True):
        assert (ct, x) == elf.STRUCTURE_TYPES[key][:2]


def test_cu_breakpoints():
    t = TABLES["Cu"]
    for sd1, (cu,) in zip(t["rows"], t["values"], strict=True):
        assert cu == pytest.approx(elf.Cu(sd1), abs=1e-12)


@pytest.mark.parametrize(
    "name,func", [("SDC_short", sdc.sdc_short_period), ("SDC_long", sdc.sdc_one_second)]
)
def test_sdc_rows(name, func):
    t = TABLES[name]
    for bound, (low_rc, rc_iv) in zip(t["rows"], t["values"], strict=True):
        probe = bound + 1e-6
        assert func(probe, "II") == low_rc
        assert func(probe, "IV") == rc_iv


def test_shear_wall_sheathing_rows():
    # SDPWS-2015 Table 4.3.4 and §4.3.4 factors (from memory), both copies
    from latbook.engine.sdpws import sheathing

    t = TABLES["SW_sheathing"]
    assert t["rows"] == list(sheathing.WALL_SHEATHING)
    for kind, values in zip(t["rows"], t["values"], strict=True):
        row = sheathing.WALL_SHEATHING[kind]
        assert values == [row.limit, row.r0, *row.defl, *row.cap, row.wind_sum_group]


def test_diaphragm_sheathing_rows():
    from latbook.engine.sdpws import sheathing

    t = TABLES["Dia_sheathing"]
    assert t["rows"] == list(sheathing.DIAPHRAGM_ASPECT_LIMITS)
    for kind, (limit,) in zip(t["rows"], t["values"], strict=True):
        assert limit == sheathing.diaphragm_aspect_limit(kind)
