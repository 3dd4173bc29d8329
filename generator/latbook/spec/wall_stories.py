"""Where the shear walls are, story by story: which lines and segments each story has, the
line story above each one and the segment each stacked hold-down lands on.

Layout only (no engineering numbers): shared by the analysis and the workbook context so
both walk the walls in the same order. Stories are listed roof first; in a story, lines in
spec order and each line's segments in spec order.
"""

from __future__ import annotations

from dataclasses import dataclass

from latbook.spec.models import Level, LineStory, Segment, Spec, WallLine


class WallStackError(ValueError):
    """A stacked hold-down has no segment to land on in the story below."""


@dataclass(frozen=True)
class SegmentPlace:
    """One segment in one story, with its spec indices and its stacking."""

    level: str
    line: WallLine
    segment: Segment
    line_index: int
    story_index: int
    segment_index: int
    stacked_from_above: bool
    """True when the segment of the same id in the story above stacks its hold-down here."""

    @property
    def key(self) -> str:
        """Row key, unique in a story: '<line>.<segment>'."""
        return f"{self.line.id}.{self.segment.id}"

    @property
    def spec_path(self) -> str:
        return (
            f"wall_lines[{self.line_index}].stories[{self.story_index}]"
            f".segments[{self.segment_index}]"
        )


@dataclass(frozen=True)
class LinePlace:
    """One wall line's walls in one story."""

    level: str
    line: WallLine
    story: LineStory
    line_index: int
    story_index: int
    above: str | None
    """Level above this story's level where the line also has walls (its shear comes down)."""
    segments: tuple[SegmentPlace, ...]


@dataclass(frozen=True)
class StoryPlace:
    """The story below `level` (the level its walls support)."""

    level: Level
    below: Level | None
    lines: tuple[LinePlace, ...]

    @property
    def segments(self) -> tuple[SegmentPlace, ...]:
        return tuple(seg for line in self.lines for seg in line.segments)


def levels_top_down(spec: Spec) -> list[Level]:
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def wall_stories(spec: Spec) -> list[StoryPlace]:
    """Every story that has walls, roof first; raises WallStackError for a stacked hold-down
    with no segment of the same id on the same line in the story below."""
    levels = levels_top_down(spec)
    below_of = {
        lv.id: (levels[i + 1] if i + 1 < len(levels) else None) for i, lv in enumerate(levels)
    }
    above_of = {lv.id: (levels[i - 1].id if i > 0 else None) for i, lv in enumerate(levels)}
    story_of: dict[tuple[str, str], tuple[int, LineStory]] = {}
    for line in spec.wall_lines:
        for si, story in enumerate(line.stories):
            story_of[(line.id, story.level)] = (si, story)
    _check_stacking(spec, below_of, story_of)

    stories: list[StoryPlace] = []
    for level in levels:
        lines: list[LinePlace] = []
        for li, line in enumerate(spec.wall_lines):
            found = story_of.get((line.id, level.id))
            if found is None or not found[1].segments:
                continue
            si, story = found
            above = above_of[level.id]
            story_above = story_of.get((line.id, above)) if above else None
            stacked_ids = {
                s.id
                for s in (story_above[1].segments if story_above else ())
                if s.hold_down_continues_below
            }
            segments = tuple(
                SegmentPlace(level.id, line, seg, li, si, gi, seg.id in stacked_ids)
                for gi, seg in enumerate(story.segments)
            )
            line_above = above if story_above and story_above[1].segments else None
            lines.append(LinePlace(level.id, line, story, li, si, line_above, segments))
        if lines:
            stories.append(StoryPlace(level, below_of[level.id], tuple(lines)))
    return stories


@dataclass(frozen=True)
class StackGap:
    """A segment that stacks its hold-down onto a story below without a segment to land on."""

    line_index: int
    story_index: int
    segment_index: int
    message: str


def stacking_gaps(spec: Spec) -> list[StackGap]:
    """Every stacked hold-down with no segment of the same id on the same line in the story
    below (a spec rule; `wall_stories` refuses the same cases)."""
    levels = levels_top_down(spec)
    below_of = {
        lv.id: (levels[i + 1] if i + 1 < len(levels) else None) for i, lv in enumerate(levels)
    }
    gaps: list[StackGap] = []
    for li, line in enumerate(spec.wall_lines):
        stories = {story.level: story for story in line.stories}
        for si, story in enumerate(line.stories):
            below = below_of.get(story.level)
            if below is None:
                continue  # the lowest story bears on the foundation: nothing below to stack on
            found = stories.get(below.id)
            ids_below = {s.id for s in found.segments} if found else set()
            for gi, seg in enumerate(story.segments):
                if seg.hold_down_continues_below and seg.id not in ids_below:
                    message = (
                        f"segment '{seg.id}' stacks its hold-downs onto the story below level "
                        f"'{below.id}', which has no segment '{seg.id}' on line '{line.id}' "
                        "(give the segment below the same id, or set this to false)"
                    )
                    gaps.append(StackGap(li, si, gi, message))
    return gaps


def _check_stacking(spec, below_of, story_of) -> None:
    gaps = stacking_gaps(spec)
    if gaps:
        raise WallStackError(gaps[0].message)
