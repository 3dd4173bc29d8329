"""The cautions printed on the cover, on every calc sheet, in the README and by the CLI."""

CAUTION_SHORT = (
    "Preliminary calculation aid: results must be reviewed and sealed by a licensed "
    "engineer; local codes and amendments govern."
)

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
