"""Run the engine over a spec: every quantity the workbook shows, by stable id.

Each module here walks one part of the building and calls the engine's clause
functions; none of them reads templates_src/ or the workbook.
"""

from __future__ import annotations

from typing import Any

from latbook.analysis.build_check import build_check_results
from latbook.analysis.combinations import combination_results
from latbook.analysis.criteria import criteria_results
from latbook.analysis.diaphragm import diaphragm_results
from latbook.analysis.foundation import foundation_results
from latbook.analysis.inputs import input_results
from latbook.analysis.overhang_drift import overhang_drift_results
from latbook.analysis.plans import plan_results
from latbook.analysis.schedules import schedule_results
from latbook.analysis.seismic import seismic_results
from latbook.analysis.shear_walls import shear_wall_results
from latbook.analysis.story_drift import drift_results
from latbook.analysis.summary import summary_results
from latbook.analysis.weights import weight_results
from latbook.analysis.wind import wind_results
from latbook.spec.models import Spec

Results = dict[str, Any]

STEPS = [
    input_results,
    plan_results,
    weight_results,
    seismic_results,
    wind_results,
    combination_results,
    diaphragm_results,
    shear_wall_results,
    foundation_results,
    drift_results,
    overhang_drift_results,
    summary_results,
    schedule_results,
    criteria_results,
    build_check_results,
]


def compute_results(spec: Spec) -> Results:
    """Every quantity id -> value (float, or str for labels) for `spec`."""
    results: Results = {}
    for step in STEPS:
        step(spec, results)
    return results
