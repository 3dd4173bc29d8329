"""The Summary sheet: each element family's governing demand/capacity ratio and a status
that reads without colour ("FAILS" with a marker, or "ok")."""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import combinations
from latbook.spec.models import Spec
from latbook.spec.summary_items import SOURCE_TEXT, SummaryItem, summary_items
from latbook.spec.wall_stories import wall_stories

NO_CAPACITY = "no capacity in spec: choose one for the demand"
NOT_GIVEN = "not given"
HOLD_DOWN_NOT_CHECKED = "not checked: no hold-down capacity"
FAILS, OK, MARKER = "FAILS", "ok", "<<<"
INCOMPLETE = "INCOMPLETE: no DCR above 1.0, but some checks were not made. "
NOT_MADE = "Not made: "
NOTHING = "-"
FAILS_TEXT = "FAILS: see the rows marked <<<"
DRIFT_SEISMIC_BASIS = "strength-level E (QE), Cd δxe / Ie"


def drift_basis(source: str, spec: Spec) -> str:
    """The load level of a drift row (ASCE 7-16 §12.8.6; App. C for wind)."""
    if source == "seis":
        return DRIFT_SEISMIC_BASIS
    factor = combinations.number_text(spec.drift.wind_serviceability_factor)
    return f"serviceability wind {factor} x W (force-driven part; ASCE 7-16 App. C)"


CANTILEVER_OPEN = "limits ok; edge drift not checked: deflection inputs not given"
CANTILEVER_BASIS_TEXT = "geometry and edge drift, SDPWS-2015 §4.2.5.2"


def combination_text(item: SummaryItem, out: dict[str, Any], spec: Spec) -> str:
    """The load combination a row's check uses, named on the Combos sheet (ASCE 7-16 §2.3,
    §2.4, §12.4); unit shear with D adding, hold-downs with D resisting."""
    if item.kind == "cantilever":
        return CANTILEVER_BASIS_TEXT
    if item.kind == "diaph_ar":
        return "geometry, SDPWS-2015 Table 4.2.4"
    if item.kind == "diaph":
        return f"see Dia_{item.level}_{item.dir}"
    if item.kind in ("chord", "collector"):
        return out[f"diaph.{item.level}.{item.dir}.{item.kind}_source"]
    if item.kind == "drift":
        return drift_basis(item.source, spec)
    name = "seismic" if item.source == "seis" else "wind"
    role = "resisting" if item.kind == "hold_down" else "additive"
    return out[f"combo.{name}_{role}"]


def _element_and_values(item: SummaryItem, out: dict[str, Any]) -> tuple[str, Any, Any]:
    """(element text, demand, DCR) for one row."""
    if item.kind == "diaph":
        return f"level {item.level}, load in {item.dir}", "-", out[f"diaph.{item.key[6:]}.dcr_max"]
    if item.kind == "diaph_ar":
        base = f"diaph.{item.level}.{item.dir}"
        return f"level {item.level} spans, load in {item.dir}", "-", out[f"{base}.ar_dcr"]
    if item.kind == "cantilever":
        prefix = f"diaph.{item.level}.{item.dir}.cant."
        dcr = max(
            v
            for k, v in out.items()
            if k.startswith(prefix)
            and (k.endswith(".dcr") or k.endswith(".edge_dcr"))
            and not isinstance(v, str)
        )
        return f"level {item.level} overhang, load in {item.dir}", "-", dcr
    if item.kind == "wall":
        lv, src = item.level, item.source
        return out[f"walls.{lv}.dcr_{src}_gov"], "-", out[f"walls.{lv}.dcr_{src}_max"]
    if item.kind in ("chord", "collector"):
        base, kind = f"diaph.{item.level}.{item.dir}", item.kind
        element = f"level {item.level} {kind}s, load in {item.dir}"
        return element, out[f"{base}.{kind}_max_lb"], out[f"{base}.{kind}_dcr_max"]
    if item.kind == "hold_down":
        return _hold_down_row(item.level, item.source, out)
    return out[f"drift.gov_{item.source}"], "-", out[f"drift.dcr_{item.source}_max"]


def _edges_open(item: SummaryItem, out: dict[str, Any]) -> bool:
    """True where some overhang of the row's diaphragm has no edge-drift check."""
    prefix = f"diaph.{item.level}.{item.dir}.cant."
    return any(v for k, v in out.items() if k.startswith(prefix) and k.endswith(".edge_open"))


def _hold_down_row(lv: str, src: str, out: dict[str, Any]) -> tuple[str, Any, Any]:
    """The largest hold-down DCR of the story among segments with a capacity (AWC SDPWS-2015
    §4.3.6.4.2); while some segment with uplift has none and no DCR exceeds 1, the element
    names those segments."""
    dcr = out[f"walls.{lv}.T_dcr_{src}_max"]
    missing = out[f"walls.{lv}.T_dcr_{src}_missing"]
    if missing > 0 and dcr <= 1:
        element = out[f"walls.{lv}.T_dcr_{src}_missing_list"]
    else:
        element = out[f"walls.{lv}.T_dcr_{src}_gov"]
    return element, out[f"walls.{lv}.T_{src}_max"], dcr


ROOF_UPLIFT_BASIS = (
    "Roof wind uplift on shear walls: ASCE 7-16 Fig. 27.3-1 roof Cp for θ <= 10° at the end of "
    "the wall nearer a windward edge (zones measured with the mean roof height h; the -1.3 area "
    "reduction not taken), GCpi of Table 26.13-1 acting up; a blank roof width is the roof width "
    "of the line in the top story, 0 below"
)
MINIMUM_WIND_BASIS = (
    "Wind minimum load case (ASCE 7-16 §27.1.5): 16 psf walls + 8 psf roof projection, carried "
    "as its own case to every element"
)
CANTILEVER_BASIS = "Diaphragm overhangs: SDPWS-2015 §4.2.5.2 limits; deflections shown tolerable: "
CANTILEVER_EDGE = "; story drift at the overhang edge: see the Dia sheets"
DEFLECTION_BASIS = (
    "Diaphragm deflection: SDPWS-2015 Eq. 4.2-1 per span (overhangs: the cantilever form, "
    "fixed at the line), v at strength level (F_px seismic, governing W wind), splice slip as "
    "an upper bound for splices at most s apart; not computed where an assembly lacks Ga, "
    "chord E and A, splice slip or spacing"
)
SHEATHING_BASIS = (
    "Aspect ratios and factors by sheathing (SDPWS-2015 Table 4.3.4, §4.3.4, Table 4.2.4; values "
    "from memory): a segment past the limit of its face 1 is not a shear wall (listed below); two "
    "faces combined by §4.3.3.2 (wind: panels or fiberboard with gypsum opposite summed), Ga of "
    "the faces added"
)
HOLD_DOWN_DRIFT_BASIS = (
    "Δa (SDPWS-2015 Eq. 4.3-1): the rated elongation scaled to the hold-down force at strength "
    "level (design T over the lateral factor) + shrinkage + crushing, or the assembly's Δa as "
    "given where no rated elongation is given; story drift adds the rotation of the stacked "
    "walls below (hold-down elongation and end-post strain), 0 where a wall does not stack"
)
END_POST_BASIS = (
    "End-post compression: the larger of the combination with D and the one with the post's L "
    "and Lr or S (ASCE 7-16 §2.4.1 comb. 6a, §2.4.5 comb. 9; LRFD §2.3.1 comb. 4, §2.3.6 comb. 6; "
    "the 0.5L exception not taken); where no post load is given, the overturning part and the "
    "dead point load only (Basis column)"
)


WIND_SERVICE_BASIS = (
    "Serviceability wind for drift (ASCE 7-16 App. C, CC.2.2): 0.42 x strength-level W is about "
    "the 10-year wind (common practice)"
)


def distribution_by(spec: Spec) -> str:
    """How a wall line's shear is shared by its segments (SDPWS-2015 §4.3.3.4.1; SW_dist)."""
    if spec.shear_walls.line_distribution == "capacity":
        return "capacity L k v (the Exception)"
    return (
        "deflection (the same top displacement by Eq. 4.3-1; two fixed passes, Δa at the "
        "hold-down force)"
    )


LIVE_CHOICES = ("torsion", "collector", "omega", "distribution", "wind_drift", "cantilever")
"""Choices the Summary prints as live formulas of their input cells (the rest are fixed text)."""


def design_choices(spec: Spec, out: dict[str, Any]) -> dict[str, str]:
    """The designer's choices and the tool's stated assumptions, as the Summary prints them
    (id suffix -> text). Each names its clause."""
    texts: dict[str, str] = {}
    if spec.wind is not None:
        texts["torsion"] = (
            "Wind torsional load cases (ASCE 7-16 Fig. 27.3-8, App. D): "
            f"{spec.wind.torsional_load_cases}; Cases 2 and 4 applied: "
            f"{out['wind.x.torsion_applied']}"
        )
        texts["wind_minimum"] = MINIMUM_WIND_BASIS
        texts["roof_uplift"] = ROOF_UPLIFT_BASIS
    if spec.seismic is not None:
        texts["collector"] = (
            "Collectors (ASCE 7-16 §12.10.2.1): Exception 1 taken: "
            f"{out['diaph.collector_exception']}; overstrength applied: "
            f"{out['diaph.collector_overstrength']}"
        )
        texts["omega"] = (
            "Ω0 applied (ASCE 7-16 Table 12.2-1, note g for flexible diaphragms): "
            + combinations.number_text(out["combo.Omega0_used"])
        )
    texts["distribution"] = (
        f"Shear in a wall line (SDPWS-2015 §4.3.3.4.1): by {distribution_by(spec)}; collectors "
        "share the line force by L k"
    )
    texts["sheathing"] = SHEATHING_BASIS
    texts["hold_down_drift"] = HOLD_DOWN_DRIFT_BASIS
    if spec.wind is not None:
        texts["wind_drift"] = (
            "Wind drift at a serviceability wind: "
            + combinations.number_text(spec.drift.wind_serviceability_factor)
            + " x strength-level W on the force-driven deflection, limit h/"
            + combinations.number_text(spec.drift.wind_ratio)
        )
        texts["wind_service"] = WIND_SERVICE_BASIS
    texts["end_posts"] = END_POST_BASIS
    texts["dia_deflection"] = DEFLECTION_BASIS
    tolerated = "yes" if spec.diaphragms.cantilever_deflection_tolerated else "no"
    texts["cantilever"] = CANTILEVER_BASIS + tolerated + CANTILEVER_EDGE
    return texts


def _basis_results(spec: Spec, out: dict[str, Any]) -> None:
    """The Summary's seismic-basis rows: options, assumptions and declarations (live copies of
    the Seismic and Regularity cells)."""
    s = spec.seismic
    if s is None:
        return
    q: dict[str, Any] = {}
    gm = s.ground_motion
    q["exc1"] = out["seismic.exc1"]
    if gm.method == "site_class":
        q["site"] = gm.site_class_basis
        q["exc2"] = out["seismic.Cs_exc2_branch"]
        q["exc3"] = out["seismic.exc3"]
        q["fv_note"] = out["seismic.Fv_note"]
        hold = gm.site_class == "E" and 0.75 < gm.Ss_g < 1.0
        q["fa_hold"] = "1.3 held (no Site E value at Ss = 1.0 g): assumption" if hold else "-"
    q["ss_cap"] = out["seismic.cap_ok"] if s.limit_Ss_for_Cs else "not taken"
    q["rho"] = out["seismic.rho_basis"]
    q["rho_value"] = out["seismic.rho"]
    q["irregular"] = (
        "present: see the Regularity sheet"
        if out["irr.any"] == "yes"
        else "none checked or declared (Regularity sheet)"
    )
    declared = any(out[f"irr.{t}.declared"] for t in ("H1a", "H1b", "H3", "V3"))
    q["declared"] = "one or more declared present" if declared else "all declared not present"
    q["collector"] = out["irr.collector_25"]
    for key, value in q.items():
        out[f"summary.basis.{key}"] = value


def summary_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Summary quantity; nothing when the spec has no wall lines."""
    items = summary_items(spec)
    if not items:
        return
    for key, text in design_choices(spec, out).items():
        if key in LIVE_CHOICES:
            out[f"summary.choice.{key}"] = text
    out["summary.choice.distribution_by"] = distribution_by(spec)
    _basis_results(spec, out)
    dcrs: list[float] = []
    open_text = NOT_MADE
    for item in items:
        element, demand, dcr = _element_and_values(item, out)
        if isinstance(dcr, str):
            status = NO_CAPACITY
        else:
            ok = OK
            if item.kind == "cantilever" and _edges_open(item, out):
                ok = CANTILEVER_OPEN
            status = FAILS if dcr > 1 else ok
            dcrs.append(dcr)
        source_text = SOURCE_TEXT.get(item.source, "seismic or wind, governing")
        if item.kind == "hold_down":
            missing = out[f"walls.{item.level}.T_dcr_{item.source}_missing"]
            if status == OK and missing > 0:
                status = HOLD_DOWN_NOT_CHECKED
            lst = out[f"walls.{item.level}.T_dcr_{item.source}_missing_list"]
            row_open = (
                f"{item.family} ({source_text}): no capacity for {lst}; " if missing else NOTHING
            )
        elif status in (OK, FAILS):
            row_open = NOTHING
        else:
            row_open = f"{item.family} ({source_text}), {element}: {status}; "
        open_text += "" if row_open == NOTHING else row_open
        base = f"summary.{item.key}"
        out[f"{base}.element"] = element
        out[f"{base}.combination"] = combination_text(item, out, spec)
        out[f"{base}.demand"] = demand
        out[f"{base}.dcr"] = dcr
        out[f"{base}.status"] = status
        out[f"{base}.marker"] = MARKER if status == FAILS else "-"
        out[f"{base}.open"] = row_open
        out[f"{base}.open_cum"] = open_text
    out["summary.dcr_max"] = max(dcrs)
    out["summary.not_made"] = "-" if open_text == NOT_MADE else open_text
    if max(dcrs) > 1:
        overall = FAILS_TEXT + (f"; {open_text}" if open_text != NOT_MADE else "")
    elif open_text != NOT_MADE:
        overall = INCOMPLETE + open_text
    else:
        overall = "ok: every DCR is 1.0 or less"
    out["summary.overall"] = overall
    for story in wall_stories(spec):
        lv = story.level.id
        out[f"summary.excluded.{lv}.count"] = out[f"walls.{lv}.excluded_count"]
        out[f"summary.excluded.{lv}.list"] = out[f"walls.{lv}.excluded_list"]
