"""Story and wall heights of the shear-wall segments (geometry read from the spec).

The story height hsx (level elevation minus the level below, the base at 0) is the drift
height; the sheathed wall height drives the aspect ratio and Eq. 4.3-1 (AWC SDPWS-2015
§4.3.4, §4.3.2): the segment's height_ft, else its level's wall_height_ft, else hsx.
"""

from __future__ import annotations

from latbook.spec.models import Level, Segment, Spec


def story_height_ft(level: Level, below: Level | None) -> float:
    """h_x - h_(x-1), the base at 0 ft [ft]."""
    return level.elevation_ft - (below.elevation_ft if below is not None else 0.0)


def level_wall_height_ft(level: Level, below: Level | None) -> float:
    """The level's wall height, or the story height where it is blank [ft]."""
    if level.wall_height_ft is not None:
        return level.wall_height_ft
    return story_height_ft(level, below)


def segment_height_ft(level: Level, below: Level | None, segment: Segment) -> float:
    """Sheathed height h of a segment: its own, else its level's wall height [ft]."""
    if segment.height_ft is not None:
        return segment.height_ft
    return level_wall_height_ft(level, below)


def level_below(spec: Spec, level: Level) -> Level | None:
    """The highest level below `level`, None for the lowest."""
    lower = [lv for lv in spec.building.levels if lv.elevation_ft < level.elevation_ft]
    return max(lower, key=lambda lv: lv.elevation_ft, default=None)
