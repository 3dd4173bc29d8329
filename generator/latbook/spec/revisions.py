"""The calculation's issues: the rows of the Cover's revision block and the current issue."""

from __future__ import annotations

from typing import NamedTuple

from latbook.spec.models import Project


class RevisionRow(NamedTuple):
    """One row of the revision block, as text."""

    revision: str
    date: str
    description: str
    by: str


def revision_rows(project: Project) -> list[RevisionRow]:
    """`project.revisions`, or for a spec without them (archived specs) one row from
    `project.revision` and `project.date` (their own limits, not those of a listed one)."""
    if project.revisions:
        return [RevisionRow(r.revision, r.date, r.description, r.by) for r in project.revisions]
    return [RevisionRow(project.revision, project.date, "", "")]


def current_revision(project: Project) -> tuple[str, str]:
    """(revision, date) of the current issue: the last listed revision, else the project's."""
    last = revision_rows(project)[-1]
    return last.revision, last.date
