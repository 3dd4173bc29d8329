"""Exit codes of every latbook command (the README's Commands section lists the same)."""

EXIT_OK = 0
"""Done: the file was written, the spec is valid, the workbook is intact, `diff` found
nothing changed."""
EXIT_FAILED = 1
"""A check failed: `verify` found the workbook edited or inconsistent; `diff` found changes."""
EXIT_BAD_INPUT = 2
"""Bad input or usage: the spec or workbook is refused; nothing was written."""
EXIT_ENVIRONMENT = 3
"""The environment failed: the output cannot be written (folder not writable, disk full,
file-size limit, name too long), LibreOffice missing or failing, out of memory. Nothing
was written and an existing output is left as it was."""
EXIT_INTERRUPTED = 130
"""Stopped by Ctrl-C (SIGINT); temp files removed, nothing written."""
EXIT_TERMINATED = 143
"""Stopped by SIGTERM; temp files removed, nothing written."""
