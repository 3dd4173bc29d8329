"""The cautions printed on the cover, on every calc sheet, in the README and by the CLI.

The workbook says 'PRELIMINARY' only where the spec marks the calculation preliminary
(`project.preliminary`); the CLI's and README's caution (`CAUTION_SHORT`) is about the tool.
"""

from latbook.spec.models import Spec

CAUTION_SHORT = (
    "Preliminary calculation aid: results must be reviewed and sealed by a licensed "
    "engineer; local codes and amendments govern."
)

PRELIMINARY_MARK = "PRELIMINARY \u2014 not for construction"
REVIEW_CAUTION = (
    "Calculation aid: results must be reviewed and sealed by a licensed engineer; local codes "
    "and amendments govern."
)
# short enough for a third of the page footer at 8 pt; the full caution is on the Cover
FOOTER_REVIEW = "Engineer's review and seal required"

CAUTION_LINES = (
    "This workbook is a calculation aid, not a design. Its results must be checked, "
    "and the design taken responsibility for, by a licensed professional engineer.",
    "The local building code, its amendments and the authority having jurisdiction govern "
    "over the editions and methods used here.",
    "Only the procedures named on each sheet are implemented; their limits of applicability "
    "(ASCE 7-16 Table 12.6-1, ch. 27 Part 1, AWC SDPWS) must be confirmed by the engineer.",
    "Green cells are inputs. Everything else is a live formula; sheets are protected without "
    "a password so that a formula is not typed over by accident. The hidden Index sheet maps "
    "every quantity id to its cell (unhide it to browse); another hidden sheet holds the "
    "spec that built this file.",
)


def caution_line(spec: Spec) -> str:
    """The caution on the second row of every calc sheet (and the file's comments)."""
    if spec.project.preliminary:
        return f"{PRELIMINARY_MARK}. {REVIEW_CAUTION}"
    return REVIEW_CAUTION


def footer_caution(spec: Spec) -> str:
    """A short caution for the page footer (under 60 characters)."""
    return PRELIMINARY_MARK if spec.project.preliminary else FOOTER_REVIEW
