"""Cross-field rules a schema cannot express; each broken rule is one `Problem`."""

from __future__ import annotations

from collections.abc import Iterator

from latbook.engine.sdpws import shear_wall, sheathing
from latbook.problems import Problem, json_path
from latbook.spec.models import Level, Spec, WallLine
from latbook.spec.plan_geometry import DIRECTIONS, POSITION_TOLERANCE_FT, resisting_lines
from latbook.spec.wall_heights import level_below, segment_height_ft, story_height_ft
from latbook.spec.wall_stories import stacking_gaps

_EPS_FT = 1e-6


def check_rules(spec: Spec) -> list[Problem]:
    """Every cross-field problem in `spec`, in document order. The rules on the walls story
    by story (stacking, line positions, aspect ratios) read story heights and the story
    below each story, so they run once every other rule holds; the rules that need the seismic
    analysis (§11.4.8 exception 3, §12.8.1.3) run last."""
    problems = [
        *_revisions(spec),
        *_levels(spec),
        *_sheet_names(spec),
        *_level_weights(spec),
        *_assembly_ids(spec),
        *_wall_lines(spec),
        *_wind(spec),
        *_seismic(spec),
    ]
    if not problems and spec.wall_lines:
        problems += [
            *_stacking(spec),
            *_distinct_positions(spec),
            *_wall_heights(spec),
            *_some_segment_qualifies(spec),
        ]
    if not problems:
        problems += _seismic_analysis(spec)
    return problems


def _revisions(spec: Spec) -> Iterator[Problem]:
    """Revision labels are unique; the last listed revision is the current issue, so the
    project's revision and date, where given, are its own (the page header prints them)."""
    project = spec.project
    seen: set[str] = set()
    for i, rev in enumerate(project.revisions):
        label = rev.revision.strip().casefold()
        if label in seen:
            path = json_path(("project", "revisions", i, "revision"))
            yield Problem(path, "unique", "revision listed twice")
        seen.add(label)
    if not project.revisions:
        return
    last = project.revisions[-1]
    given = project.model_fields_set
    n = len(project.revisions) - 1
    if "revision" in given and project.revision != last.revision:
        yield Problem(
            json_path(("project", "revision")),
            "consistent",
            f"must equal the last listed revision ({last.revision!r} at "
            f"$.project.revisions[{n}].revision), or be left out",
        )
    if "date" in given and project.date != last.date:
        yield Problem(
            json_path(("project", "date")),
            "consistent",
            f"must equal the date of the last listed revision ({last.date!r} at "
            f"$.project.revisions[{n}].date), or be left out",
        )


def _levels(spec: Spec) -> Iterator[Problem]:
    levels = spec.building.levels
    seen: set[str] = set()
    for i, level in enumerate(levels):
        # compared ignoring case: level ids name sheets (Dia_<level>_<dir>, Walls_<level>) and
        # spreadsheet sheet names are unique ignoring case
        if level.id.lower() in seen:
            yield Problem(
                json_path(("building", "levels", i, "id")),
                "unique",
                "duplicate level id (level ids must differ by more than letter case)",
            )
        seen.add(level.id.lower())
    increasing = spec.building.level_order == "bottom_up"
    for i in range(1, len(levels)):
        lower, upper = (levels[i - 1], levels[i]) if increasing else (levels[i], levels[i - 1])
        if not upper.elevation_ft > lower.elevation_ft:
            word = "increase" if increasing else "decrease"
            yield Problem(
                json_path(("building", "levels", i, "elevation_ft")),
                "elevation_order",
                f"elevations must strictly {word} down the list (level_order is "
                f"'{spec.building.level_order}')",
            )
    names = {a.id for a in spec.assemblies.diaphragms}
    for i, level in enumerate(levels):
        if level.diaphragm_assembly is not None and level.diaphragm_assembly not in names:
            yield Problem(
                json_path(("building", "levels", i, "diaphragm_assembly")),
                "reference",
                f"no diaphragm assembly with id '{level.diaphragm_assembly}'",
            )
        if spec.wall_lines and level.diaphragm_assembly is None:
            yield Problem(
                json_path(("building", "levels", i, "diaphragm_assembly")),
                "required",
                "a level with wall lines below needs a diaphragm assembly",
            )


def _sheet_names(spec: Spec) -> Iterator[Problem]:
    """A level id names sheets (`Walls_<level>`...); none may equal another sheet's name
    ignoring case."""
    from latbook.workbook.sheet_names import level_sheet_names, other_sheet_names

    taken = {name.lower(): name for name in other_sheet_names()}
    ids: set[str] = set()
    for i, level in enumerate(spec.building.levels):
        if level.id.lower() in ids:
            continue  # a duplicate id: reported by the level rules
        ids.add(level.id.lower())
        for name in sorted(level_sheet_names(level.id)):
            if name.lower() in taken:
                yield Problem(
                    json_path(("building", "levels", i, "id")),
                    "sheet_name",
                    f"level id '{level.id}' would name a sheet '{name}', which the workbook "
                    f"already has ('{taken[name.lower()]}'); choose another id",
                )
                break
        for name in level_sheet_names(level.id):
            taken.setdefault(name.lower(), name)


def _assembly_ids(spec: Spec) -> Iterator[Problem]:
    for group in ("diaphragms", "shear_walls"):
        seen: set[str] = set()
        for i, item in enumerate(getattr(spec.assemblies, group)):
            if item.id in seen:
                path = json_path(("assemblies", group, i, "id"))
                yield Problem(path, "unique", "duplicate assembly id")
            seen.add(item.id)


def line_length_ft(line: WallLine, level: Level) -> float:
    """Length of a wall line across the level's plan (the diaphragm depth there)."""
    plan = level.plan
    return plan.x_max_ft - plan.x_min_ft if line.direction == "x" else plan.y_max_ft - plan.y_min_ft


def _wall_lines(spec: Spec) -> Iterator[Problem]:
    if not spec.wall_lines:
        return
    levels = {lv.id: lv for lv in spec.building.levels}
    order = [lv.id for lv in sorted(spec.building.levels, key=lambda lv: lv.elevation_ft)]
    walls = {a.id for a in spec.assemblies.shear_walls}
    seen: set[str] = set()
    for li, line in enumerate(spec.wall_lines):
        base = ("wall_lines", li)
        if line.id in seen:
            yield Problem(json_path((*base, "id")), "unique", "duplicate wall line id")
        seen.add(line.id)
        story_levels: list[str] = []
        for si, story in enumerate(line.stories):
            spath = (*base, "stories", si)
            level = levels.get(story.level)
            if level is None:
                yield Problem(json_path((*spath, "level")), "reference", "no level with that id")
                continue
            if story.level in story_levels:
                yield Problem(json_path((*spath, "level")), "unique", "story listed twice")
                continue
            story_levels.append(story.level)
            yield from _line_story(line, level, story, spath, walls)
        yield from _line_continuity(line, story_levels, order, base)
    yield from _two_lines_each_way(spec)


def _stacking(spec: Spec) -> Iterator[Problem]:
    """A stacked hold-down needs a segment of the same id below it (its force goes there)."""
    for gap in stacking_gaps(spec):
        path = ("wall_lines", gap.line_index, "stories", gap.story_index)
        yield Problem(
            json_path((*path, "segments", gap.segment_index, "hold_down_continues_below")),
            "stacking",
            gap.message,
        )


def _distinct_positions(spec: Spec) -> Iterator[Problem]:
    """Two lines of one direction bearing on the same diaphragm cannot share a position
    (the diaphragm spans between distinct lines, ASCE 7-16 §12.3.1.1)."""
    reported: set[int] = set()
    for level in spec.building.levels:
        for direction in DIRECTIONS:
            lines = resisting_lines(spec, level.id, direction)
            for a, b in zip(lines, lines[1:], strict=False):
                if b.position_ft - a.position_ft > POSITION_TOLERANCE_FT:
                    continue
                if b.line_index in reported:
                    continue
                reported.add(b.line_index)
                yield Problem(
                    json_path(("wall_lines", b.line_index, "position_ft")),
                    "distinct_position",
                    f"lines '{a.id}' and '{b.id}' ({direction}-direction) are both at "
                    f"{b.position_ft:g} ft with walls below level '{level.id}'; merge them into "
                    "one line or move one",
                )


def _some_segment_qualifies(spec: Spec) -> Iterator[Problem]:
    """A line story carries shear only through segments within their sheathing's aspect-ratio
    limit (face 1, AWC SDPWS-2015 Table 4.3.4)."""
    kinds = {a.id: a.sheathing for a in spec.assemblies.shear_walls}
    levels = {lv.id: lv for lv in spec.building.levels}
    for li, line in enumerate(spec.wall_lines):
        for si, story in enumerate(line.stories):
            if not story.segments:
                continue
            level = levels[story.level]
            below = level_below(spec, level)
            if any(
                sheathing.meets_wall_aspect_limit(
                    shear_wall.aspect_ratio(segment_height_ft(level, below, seg), seg.length_ft),
                    kinds[seg.assembly],
                )
                for seg in story.segments
            ):
                continue
            yield Problem(
                json_path(("wall_lines", li, "stories", si, "segments")),
                "aspect_ratio",
                f"no segment of line '{line.id}' in the story below level '{story.level}' meets "
                "the aspect-ratio limit h/bs of its sheathing (AWC SDPWS-2015 Table 4.3.4): the "
                "line has no shear wall to resist its load; lengthen a segment or lower its height",
            )


def _wall_heights(spec: Spec) -> Iterator[Problem]:
    """A sheathed wall fits in its story: wall heights at most the story height."""
    for i, level in enumerate(spec.building.levels):
        below = level_below(spec, level)
        story_ft = story_height_ft(level, below)
        if level.wall_height_ft is not None and level.wall_height_ft > story_ft + _EPS_FT:
            yield Problem(
                json_path(("building", "levels", i, "wall_height_ft")),
                "wall_height",
                f"wall height {level.wall_height_ft:g} ft is taller than the story below level "
                f"'{level.id}' ({story_ft:g} ft); the sheathed wall fits within its story",
            )
    levels = {lv.id: lv for lv in spec.building.levels}
    for li, line in enumerate(spec.wall_lines):
        for si, story in enumerate(line.stories):
            level = levels[story.level]
            story_ft = story_height_ft(level, level_below(spec, level))
            for gi, seg in enumerate(story.segments):
                if seg.height_ft is not None and seg.height_ft > story_ft + _EPS_FT:
                    yield Problem(
                        json_path(("wall_lines", li, "stories", si, "segments", gi, "height_ft")),
                        "wall_height",
                        f"segment height {seg.height_ft:g} ft is taller than its story (below "
                        f"level '{level.id}', {story_ft:g} ft); the sheathed wall fits within "
                        "its story",
                    )


def _line_story(line, level, story, spath, walls) -> Iterator[Problem]:
    plan = level.plan
    lo, hi = (
        (plan.y_min_ft, plan.y_max_ft) if line.direction == "x" else (plan.x_min_ft, plan.x_max_ft)
    )
    if not lo - _EPS_FT <= line.position_ft <= hi + _EPS_FT:
        yield Problem(
            json_path((*spath[:2], "position_ft")),
            "inside_plan",
            f"line position {line.position_ft:g} ft is outside level '{level.id}' plan "
            f"({lo:g} to {hi:g} ft)",
        )
    length = line_length_ft(line, level)
    if not story.segments:
        yield Problem(json_path((*spath, "segments")), "required", "a story needs a segment")
    spans: list[tuple[float, float, int]] = []
    ids: set[str] = set()
    for gi, seg in enumerate(story.segments):
        gpath = (*spath, "segments", gi)
        if seg.id in ids:
            yield Problem(json_path((*gpath, "id")), "unique", "duplicate segment id in story")
        ids.add(seg.id)
        if seg.assembly not in walls:
            yield Problem(
                json_path((*gpath, "assembly")),
                "reference",
                f"no shear-wall assembly with id '{seg.assembly}'",
            )
        end = seg.start_ft + seg.length_ft
        if end > length + _EPS_FT:
            yield Problem(
                json_path((*gpath, "length_ft")),
                "inside_line",
                f"segment ends at {end:g} ft, past the line's length {length:g} ft",
            )
        if seg.hold_down_elongation_in is not None and seg.hold_down_rated_load_lb is None:
            yield Problem(
                json_path((*gpath, "hold_down_rated_load_lb")),
                "rated_load",
                "a rated hold-down elongation needs the load it is rated at "
                "(hold_down_rated_load_lb): Δa is scaled from it to the hold-down force "
                "(AWC SDPWS-2015 Eq. 4.3-1)",
            )
        if seg.hold_down_offset_ft * 2 >= seg.length_ft:
            yield Problem(
                json_path((*gpath, "hold_down_offset_ft")),
                "range",
                "hold-down offset must be less than half the segment length",
            )
        spans.append((seg.start_ft, end, gi))
    spans.sort()
    for (_, end_a, _), (start_b, _, gb) in zip(spans, spans[1:], strict=False):
        if start_b < end_a - _EPS_FT:
            yield Problem(
                json_path((*spath, "segments", gb, "start_ft")),
                "no_overlap",
                "segment overlaps another segment on the line",
            )
    for oi, opening in enumerate(story.openings):
        if opening.start_ft + opening.length_ft > length + _EPS_FT:
            yield Problem(
                json_path((*spath, "openings", oi, "length_ft")),
                "inside_line",
                "opening runs past the line's length",
            )
        for s0, s1, _ in spans:
            if (
                opening.start_ft < s1 - _EPS_FT
                and opening.start_ft + opening.length_ft > s0 + _EPS_FT
            ):
                yield Problem(
                    json_path((*spath, "openings", oi, "start_ft")),
                    "no_overlap",
                    "opening overlaps a shear-wall segment",
                )
                break


def _line_continuity(line, story_levels, order, base) -> Iterator[Problem]:
    """A line carrying shear in a story must continue in every story below it."""
    if not story_levels:
        return
    top = max(order.index(lv) for lv in story_levels)
    for lv in order[:top]:
        if lv not in story_levels:
            yield Problem(
                json_path((*base, "stories")),
                "continuity",
                f"line '{line.id}' has walls above level '{lv}' but none in the story below it; "
                "its shear has no path down (walls offset out of plane are not supported yet)",
            )
            return


def _two_lines_each_way(spec: Spec) -> Iterator[Problem]:
    for i, level in enumerate(spec.building.levels):
        for direction in ("x", "y"):
            lines = [
                ln
                for ln in spec.wall_lines
                if ln.direction == direction
                and any(st.level == level.id and st.segments for st in ln.stories)
            ]
            if len(lines) < 2:
                yield Problem(
                    json_path(("building", "levels", i)),
                    "two_lines",
                    f"level '{level.id}' needs at least two {direction}-direction wall lines "
                    f"with walls in the story below it (found {len(lines)})",
                )


def _wind(spec: Spec) -> Iterator[Problem]:
    if spec.wind is None:
        return
    from latbook.engine.asce7_16.wind_cases import torsional_cases_exempt

    top = max(lv.elevation_ft for lv in spec.building.levels)
    if spec.wind.mean_roof_height_ft < top - _EPS_FT:
        yield Problem(
            "$.wind.mean_roof_height_ft",
            "range",
            f"mean roof height is below the highest level ({top:g} ft)",
        )
    n = len(spec.building.levels)
    if spec.wind.torsional_load_cases == "cases_1_and_3" and not torsional_cases_exempt(
        n, spec.wind.mean_roof_height_ft, True
    ):
        yield Problem(
            "$.wind.torsional_load_cases",
            "appendix_d",
            f"Cases 1 and 3 alone are allowed only for buildings ASCE 7-16 Appendix D, D1.1 "
            f"exempts (one story with h <= 30 ft, or two stories or less with flexible "
            f"diaphragms); this building has {n} stories: use 'by_appendix_d' or 'all_cases'",
        )


def _level_weights(spec: Spec) -> Iterator[Problem]:
    """ASCE 7-16 §12.7.2: each level's w_x is typed or taken off, never both."""
    top = max(spec.building.levels, key=lambda lv: lv.elevation_ft).id
    for i, level in enumerate(spec.building.levels):
        base = ("building", "levels", i)
        t = level.weight_takeoff
        if t is not None and level.seismic_weight_kip is not None:
            yield Problem(
                json_path((*base, "weight_takeoff")),
                "one_weight",
                "give either seismic_weight_kip or weight_takeoff for a level, not both",
            )
        elif t is None and level.seismic_weight_kip is None:
            yield Problem(
                json_path((*base, "seismic_weight_kip")),
                "required",
                "give seismic_weight_kip or a weight_takeoff for the level",
            )
        if t is None:
            continue
        if level.seismic_weight_kip is None:
            from latbook.analysis.weights import takeoff_parts_kip

            if sum(takeoff_parts_kip(spec, level).values()) <= 0:
                yield Problem(
                    json_path((*base, "weight_takeoff")),
                    "positive",
                    "the takeoff sums to zero: a level needs a seismic weight above 0 kip",
                )
        for wi, wall in enumerate(t.walls):
            if wall.parapet_height_ft > 0 and level.id != top:
                yield Problem(
                    json_path((*base, "weight_takeoff", "walls", wi, "parapet_height_ft")),
                    "parapet",
                    "a parapet is added to the walls of the highest level only",
                )


def _seismic(spec: Spec) -> Iterator[Problem]:
    s = spec.seismic
    if s is None:
        return
    if s.omega0_flexible_diaphragm_reduction and s.system.Omega0 < 2.5:
        yield Problem(
            "$.seismic.omega0_flexible_diaphragm_reduction",
            "table_12_2_1_note_g",
            "Ω0 may be reduced by 0.5 for flexible diaphragms only where the tabulated Ω0 is "
            f"2.5 or more (ASCE 7-16 Table 12.2-1 note g); system.Omega0 is "
            f"{s.system.Omega0:g}",
        )
        return
    if s.rho_method != "typed" and "rho" in s.model_fields_set:
        yield Problem(
            "$.seismic.rho",
            "rho_override",
            f"rho is typed only with rho_method 'typed' (rho_method is '{s.rho_method}', "
            "which determines rho per ASCE 7-16 §12.3.4.2)",
        )
    if s.rho_method != "typed" and not spec.wall_lines:
        yield Problem(
            "$.seismic.rho_method",
            "needs_walls",
            f"rho_method '{s.rho_method}' judges the shear walls: give wall_lines, or type rho",
        )
    gm = s.ground_motion
    if s.limit_Ss_for_Cs and (gm.method != "site_class" or not spec.wall_lines):
        yield Problem(
            "$.seismic.limit_Ss_for_Cs",
            "conditions",
            "ASCE 7-16 §12.8.1.3 needs Ss (ground_motion.method 'site_class') and wall_lines "
            "(to check regularity and rho)",
        )
    if gm.method != "site_class":
        return
    basis = gm.site_class_basis
    if (basis == "default_D" and gm.site_class != "D") or (
        basis == "B_unmeasured_vs" and gm.site_class != "B"
    ):
        yield Problem(
            "$.seismic.ground_motion.site_class_basis",
            "site_class_basis",
            f"'{basis}' applies to site class {'D' if basis == 'default_D' else 'B'} only "
            f"(site_class is '{gm.site_class}'; ASCE 7-16 §11.4.3)",
        )


def _seismic_analysis(spec: Spec) -> list[Problem]:
    """Rules that need T, rho and the irregularity screen: §11.4.8 exception 3 and the
    conditions of §12.8.1.3."""
    if spec.seismic is None:
        return []
    from latbook.analysis.seismic import (
        EXC3_NOT_MET,
        SITE_STUDY_ADVICE,
        seismic_results,
        ss_cap_failures,
    )
    from latbook.engine.errors import CodeLimitError

    out: dict = {}
    try:
        seismic_results(spec, out)
    except CodeLimitError as exc:
        if EXC3_NOT_MET not in str(exc):
            raise
        return [
            Problem(
                "$.seismic.ground_motion.S1_g",
                "site_specific",
                "site class E with S1 >= 0.2 g: ASCE 7-16 §11.4.8 exception 3 needs T <= Ts "
                f"and T > Ts here; {SITE_STUDY_ADVICE}",
            )
        ]
    failed = ss_cap_failures(out)
    if not failed:
        return []
    text = {
        "stories": "more than five stories above the base",
        "T": "T > 0.5 s",
        "rho": "rho is not 1.0",
        "site": "site class E",
        "rc": "risk category III or IV",
        "regular": "an irregularity is present (Regularity sheet)",
    }
    return [
        Problem(
            "$.seismic.limit_Ss_for_Cs",
            "conditions",
            "ASCE 7-16 §12.8.1.3 does not apply: " + "; ".join(text[k] for k in failed),
        )
    ]
