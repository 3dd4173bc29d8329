"""The JSON project spec: models, loading with path-named problems, cross-field rules."""

from latbook.spec.load import load_spec, parse_spec
from latbook.spec.models import Spec

__all__ = ["Spec", "load_spec", "parse_spec"]
