"""The Cover's live check of the inputs against the spec the workbook was built from.

For a spec, its inputs are the spec by definition: no input cell differs. `latbook verify`
puts the count it reads back from an edited workbook in place of these values.
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec

INPUTS_EDITED_ID = "build_check.inputs_edited"
STATUS_ID = "build_check.status"
AS_BUILT = "as built: the input cells hold the spec whose SHA-256 is above"
EDITED = "EDITED: the input cells counted below differ from that spec; run latbook verify"


def status_text(inputs_edited: int) -> str:
    """What the Cover says for `inputs_edited` input cells that differ from the spec."""
    return AS_BUILT if inputs_edited == 0 else EDITED


def build_check_results(spec: Spec, out: dict[str, Any]) -> None:
    """No input cell differs from the spec at the build."""
    out[INPUTS_EDITED_ID] = 0
    out[STATUS_ID] = status_text(0)
