"""The Found sheet: what the foundation receives from each bottom-story segment (design
level), sill anchor spacing (AWC SDPWS-2015 §4.3.6.4.1) and plate washers (§4.3.6.4.3)."""

from __future__ import annotations

from typing import Any

from latbook.analysis.shear_walls import active_sources
from latbook.engine.sdpws import anchorage
from latbook.spec.models import Spec
from latbook.spec.wall_stories import wall_stories

_FACTOR = {"seis": "combo.Fac_E", "wind": "combo.Fac_W"}


def foundation_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Found quantity; nothing when the spec has no wall lines."""
    if not spec.wall_lines:
        return
    sources = active_sources(spec)
    assemblies = {a.id: a for a in spec.assemblies.shear_walls}
    base_story = wall_stories(spec)[-1]
    lv = base_story.level.id
    for seg in base_story.segments:
        walls = f"walls.{lv}.seg.{seg.key}"
        base = f"found.{seg.key}"
        for src in sources:
            out[f"{base}.V_{src}"] = out[_FACTOR[src]] * out[f"{walls}.V_{src}"]
            out[f"{base}.T_{src}"] = out[f"{walls}.T_{src}"]
            out[f"{base}.C_{src}"] = out[f"{walls}.C_{src}"]
            out[f"{base}.v_slide_{src}"] = out[f"{walls}.v_slide_{src}"]
        v_max = max(out[f"{base}.v_slide_{src}"] for src in sources)
        out[f"{base}.v_slide_max"] = v_max
        capacity = seg.segment.sill_anchor_capacity_lb
        if capacity is None:
            spacing: float | str = "not designed here"
        else:
            found = anchorage.sill_anchor_spacing_ft(capacity, v_max)
            spacing = "no shear" if found is None else found
        out[f"{base}.anchor_spacing_ft"] = spacing
        a = assemblies[seg.segment.assembly]
        faces = [
            max(a.vs_nominal_plf, a.vw_nominal_plf),
            max(a.face2_vs_nominal_plf or 0.0, a.face2_vw_nominal_plf or 0.0),
        ]
        out[f"{base}.v_face1_plf"], out[f"{base}.v_face2_plf"] = faces
        out[f"{base}.plate_washer"] = anchorage.plate_washer_text(faces)
