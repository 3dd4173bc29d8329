"""Diaphragm deflection per span (AWC SDPWS-2015 §4.2.2, Eq. 4.2-1; the cantilever form for
overhangs), at strength-level unit shear: v from F_px (seismic) and from the governing wind
case W (wind), each the span's largest unit shear, unfactored.

Deflection needs five inputs of the diaphragm assembly (Ga, chord E and A, splice slip and
spacing); where one is missing every term is the text NOT_COMPUTED, never 0. The splice term
is an upper bound for splices at most s apart at points not known.
"""

from __future__ import annotations

from typing import Any

from latbook.engine.sdpws import diaphragm_deflection as dd
from latbook.spec.models import DiaphragmAssembly, Spec

NOT_COMPUTED = "not computed"
NOT_GIVEN = "not given"
MISSING = "not computed: needs Ga, chord E and A, splice slip and splice spacing (Lines sheet)"
COMPUTED = "computed: SDPWS-2015 Eq. 4.2-1 (overhangs: cantilever form)"

INPUTS = (
    "Ga_kips_per_in",
    "chord_E_psi",
    "chord_A_in2",
    "chord_splice_slip_in",
    "chord_splice_spacing_ft",
)


def inputs_given(assembly: DiaphragmAssembly) -> bool:
    """True where the assembly gives every input of Eq. 4.2-1."""
    return all(getattr(assembly, name) is not None for name in INPUTS)


def deflection_input_results(spec: Spec, out: dict[str, Any]) -> None:
    """The assemblies' deflection inputs as built (None: blank cell)."""
    for a in spec.assemblies.diaphragms:
        for name in INPUTS:
            out[f"dassembly.{a.id}.{name}"] = getattr(a, name)


def case_results(assembly: DiaphragmAssembly) -> dict[str, Any]:
    """A Dia sheet's copy of the assembly's deflection inputs ("not given" where blank), the
    flag that all are given (1/0) and the basis text."""
    q: dict[str, Any] = {}
    for name in INPUTS:
        value = getattr(assembly, name)
        q[name] = NOT_GIVEN if value is None else value
    q["defl_given"] = 1 if inputs_given(assembly) else 0
    q["defl_basis"] = COMPUTED if inputs_given(assembly) else MISSING
    return q


def span_deflection(
    assembly: DiaphragmAssembly, kind: str, L_ft: float, W_ft: float, v_plf: dict[str, float]
) -> dict[str, Any]:
    """Each term of one span: sx_ftin (Σ x Δc bound), slip_in, and per load source ("E"
    seismic F_px, "W" wind) bend_<src>, shear_<src>, defl_<src> [in]; text where not given."""
    r: dict[str, Any] = {}
    if not inputs_given(assembly):
        r["sx_ftin"] = r["slip_in"] = NOT_COMPUTED
        for src in v_plf:
            for term in ("bend", "shear", "defl"):
                r[f"{term}_{src}"] = NOT_COMPUTED
        return r
    E, A, Ga = assembly.chord_E_psi, assembly.chord_A_in2, assembly.Ga_kips_per_in
    slip, s = assembly.chord_splice_slip_in, assembly.chord_splice_spacing_ft
    assert E is not None and A is not None and Ga is not None
    assert slip is not None and s is not None
    if kind == "simple":
        r["sx_ftin"] = dd.splice_sum_simple_bound_ft_in(L_ft, s, slip)
        r["slip_in"] = dd.slip_simple_in(r["sx_ftin"], W_ft)
        bend, shear = dd.bending_simple_in, dd.shear_simple_in
    else:
        r["sx_ftin"] = dd.splice_sum_cantilever_bound_ft_in(L_ft, s, slip)
        r["slip_in"] = dd.slip_cantilever_in(r["sx_ftin"], W_ft)
        bend, shear = dd.bending_cantilever_in, dd.shear_cantilever_in
    for src, v in v_plf.items():
        r[f"bend_{src}"] = bend(v, L_ft, E, A, W_ft)
        r[f"shear_{src}"] = shear(v, L_ft, Ga)
        r[f"defl_{src}"] = r[f"bend_{src}"] + r[f"shear_{src}"] + r["slip_in"]
    return r
