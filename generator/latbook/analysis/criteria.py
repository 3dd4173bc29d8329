"""The design criteria the Cover lists: each a live copy of a calc or input cell (the Cover's
quantity `cover.<key>` equals the quantity it shows), or a fixed statement where the value is
the spec's text or the tool's own assumption. The rows depend on the spec only."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from latbook.spec.models import Spec
from latbook.spec.overhangs import overhangs
from latbook.spec.plan_geometry import DIRECTIONS

COVER_PREFIX = "cover."

NO_SEISMIC = (
    "none: the spec has no seismic part, so no seismic load is considered in this calculation"
)
NO_WIND = "none: the spec has no wind part, so no wind load is considered in this calculation"
FLEXIBLE_DIAPHRAGMS = (
    "flexible: every diaphragm is analysed as flexible, its load shared by the wall lines by "
    "tributary area (the engineer confirms the idealization, ASCE 7-16 §12.3.1); overhangs "
    "continuous over their line"
)
DEFLECTION_BASIS = (
    "SDPWS-2015 Eq. 4.2-1 per span, the cantilever form for overhangs, at strength-level "
    "unit shear (F_px; W); computed where the diaphragm assembly gives Ga, chord E and A, "
    "splice slip and spacing, otherwise 'not computed' and the checks that need it 'not checked'"
)
NO_WALLS = "none: the spec has no wall lines, so only the loads are calculated"
RHO_BASIS = {
    "typed": "ASCE 7-16 §12.3.4: typed by the designer (override)",
    "removal_test": "ASCE 7-16 §12.3.4.2 (a): the larger of x and y",
    "perimeter_bays": "ASCE 7-16 §12.3.4.2 (b): both directions",
}


@dataclass(frozen=True)
class CriteriaRow:
    """One row of the Cover's design criteria: a heading, a live value or a fixed text."""

    label: str
    key: str | None = None  # the Cover quantity is "cover." + key
    source: str | None = None  # the quantity shown
    text: str | None = None  # a fixed statement (spec text or the tool's assumption)
    unit: str = ""
    basis: str = ""
    fmt: str | None = None
    heading: bool = False
    wide: bool = False  # the value spans the unit and basis columns

    @property
    def qid(self) -> str | None:
        return None if self.key is None else COVER_PREFIX + self.key


def _live(label, key, source, unit="-", basis="", fmt=None, wide=False) -> CriteriaRow:
    return CriteriaRow(label, key, source, None, unit, basis, fmt, wide=wide)


def criteria_rows(spec: Spec) -> list[CriteriaRow]:
    """The Cover's design criteria for `spec`, in print order."""
    rows = [
        CriteriaRow("Standards and method", heading=True),
        CriteriaRow("Loads standard", text=spec.code.loads, basis="edition used throughout"),
        CriteriaRow("Wood standard", text=spec.code.wood, basis="edition used throughout"),
        _live("Design method", "design_method", "input.design_method", "", "ASCE 7-16 §2.3 / §2.4"),
        _live("Risk category", "risk_category", "input.risk_category", "", "ASCE 7-16 Table 1.5-1"),
    ]
    rows += _seismic_rows(spec)
    rows += _wind_rows(spec)
    rows.append(CriteriaRow("Diaphragms and walls", heading=True))
    if spec.wall_lines:
        rows.append(CriteriaRow("Diaphragms", text=FLEXIBLE_DIAPHRAGMS, wide=True))
        rows.append(CriteriaRow("Diaphragm deflection", text=DEFLECTION_BASIS, wide=True))
        rows += _overhang_rows(spec)
    else:
        rows.append(CriteriaRow("Diaphragms and walls", text=NO_WALLS, wide=True))
    return rows


def _overhang_rows(spec: Spec) -> list[CriteriaRow]:
    """The outcome of each overhang's edge-drift check (SDPWS-2015 §4.2.5.2), live."""
    rows = []
    for level in sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft):
        for d in DIRECTIONS:
            for oh in overhangs(spec, level.id, d):
                n = oh.span.number
                rows.append(
                    _live(
                        f"Story drift at the overhang edge, level {level.id}, load in {d}, "
                        f"{oh.span.label}",
                        f"overhang.{level.id}.{d}.{n}",
                        f"diaph.{level.id}.{d}.cant.{n}.edge_status",
                        "",
                        f"SDPWS-2015 §4.2.5.2 (Dia_{level.id}_{d})",
                    )
                )
    return rows


def _seismic_rows(spec: Spec) -> list[CriteriaRow]:
    heading = CriteriaRow("Seismic: ELF procedure (ASCE 7-16 §12.8)", heading=True)
    s = spec.seismic
    if s is None:
        return [heading, CriteriaRow("Seismic", text=NO_SEISMIC, wide=True)]
    t1221 = "ASCE 7-16 Table 12.2-1"
    rows = [
        heading,
        _live(
            "Seismic force-resisting system", "seismic.system", "seismic.system_label", wide=True
        ),
        _live("Seismic design category", "seismic.SDC", "seismic.SDC", "", "ASCE 7-16 §11.6"),
        _live(
            "Importance factor Ie", "seismic.Ie", "seismic.Ie", "-", "ASCE 7-16 Table 1.5-2", "0.00"
        ),
        _live("Response modification R", "seismic.R", "seismic.R", "-", t1221, "0.0#"),
        _live("Deflection amplification Cd", "seismic.Cd", "seismic.Cd", "-", t1221, "0.0#"),
        _live("Overstrength Ω0", "seismic.Omega0", "seismic.Omega0", "-", t1221, "0.0#"),
        _live(
            "Ω0 applied",
            "seismic.Omega0_used",
            "combo.Omega0_used",
            "-",
            t1221 + ", note g",
            "0.0#",
        ),
    ]
    if s.rho_method == "removal_test":
        basis = "ASCE 7-16 §12.3.4.2 (a)"
        rows.append(
            _live("Redundancy ρ, x direction", "seismic.rho_x", "rho.a_x", "-", basis, "0.0")
        )
        rows.append(
            _live("Redundancy ρ, y direction", "seismic.rho_y", "rho.a_y", "-", basis, "0.0")
        )
    rows += [
        _live(
            "Redundancy ρ used",
            "seismic.rho",
            "seismic.rho_used",
            "-",
            RHO_BASIS[s.rho_method],
            "0.0",
        ),
        _live(
            "Response coefficient Cs",
            "seismic.Cs",
            "seismic.Cs",
            "-",
            "ASCE 7-16 §12.8.1.1",
            "0.0000",
        ),
        _live("Seismic weight W", "seismic.W", "seismic.W", "kip", "ASCE 7-16 §12.7.2", "0.0"),
        _live(
            "Base shear V = Cs W",
            "seismic.V",
            "seismic.V",
            "kip",
            "ASCE 7-16 Eq. 12.8-1 (strength level)",
            "0.00",
        ),
    ]
    return rows


def _wind_rows(spec: Spec) -> list[CriteriaRow]:
    heading = CriteriaRow("Wind: MWFRS, directional (ASCE 7-16 ch. 27 Part 1)", heading=True)
    if spec.wind is None:
        return [heading, CriteriaRow("Wind", text=NO_WIND, wide=True)]
    return [
        heading,
        _live("Basic wind speed V", "wind.V", "wind.V_mph", "mph", "ASCE 7-16 §26.5", "0"),
        _live("Exposure category", "wind.exposure", "wind.exposure", "", "ASCE 7-16 §26.7"),
        _live("Directionality Kd", "wind.Kd", "wind.Kd", "-", "ASCE 7-16 Table 26.6-1", "0.00"),
        _live("Enclosure", "wind.enclosure", "wind.enclosure", "", "ASCE 7-16 §26.12"),
    ]


def criteria_results(spec: Spec, out: dict[str, Any]) -> None:
    """Each live criterion's Cover quantity: the value of the quantity it shows."""
    for row in criteria_rows(spec):
        if row.qid is not None and row.source is not None:
            out[row.qid] = out[row.source]
