"""Errors the engine raises when the standard itself refuses a case."""


class CodeLimitError(ValueError):
    """The standard does not permit this case with the chosen procedure (e.g. a
    site-specific ground-motion study is required). The message names the clause."""
