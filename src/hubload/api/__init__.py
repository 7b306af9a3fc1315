"""The Python API: every command as a plain function that returns a typed result.

``hubload.check(path)`` gives what ``hubload check`` prints, as an object: its
``governing_life`` is the life every output judges, ``to_dict()`` is the document
of ``--json``. The command-line interface calls these functions and hands their
results to the report layer; a notebook calls them directly. Nothing here prints.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

from hubload.domain.study import Study
from hubload.errors import InputError

# Static safety s0 of rolling bearings: 0.5 to 4 in the tables of common practice (ISO 76
# guidance, makers' catalogues); 20 is beyond any demand and keeps the ratings finite.
MAX_REQUIRED_S0 = 20.0


def load(path: str | Path, method: str | None = None) -> Study:
    """The study of a load-case file (SI units), computed by ``method`` when given.

    ``method`` ("iso281" or "refined") overrides the file's ``[project] method``.
    Bad input raises :class:`hubload.errors.InputError` naming the file and key.
    """
    from hubload.casefile import load_study
    from hubload.casefile.geometry import with_method

    study = load_study(path)
    try:
        return with_method(study, method)
    except InputError as error:
        raise error.located(str(path)) from None


def as_study(study_or_path: Study | str | Path, method: str | None = None) -> Study:
    if isinstance(study_or_path, Study):
        from hubload.casefile.geometry import with_method

        return with_method(study_or_path, method)
    return load(study_or_path, method)


@dataclass(frozen=True)
class Wrapped:
    """A typed result with the outputs of its command: attributes pass through to it.

    The results of most commands are this one field under their own class name (defined
    without a dataclass decorator of their own: each one cost a millisecond at start-up)."""

    value: object

    def __getattr__(self, name: str):
        return getattr(object.__getattribute__(self, "value"), name)


class CheckResult(Wrapped):
    """The result of a check: the engine's typed result, its governing life, its JSON."""

    @property
    def governing_life(self):
        return self.value.governing

    def to_dict(self) -> dict:
        """The document of ``hubload check --json``."""
        from hubload.report.json.check import result_document

        return result_document(self.value)


def check(study_or_path: Study | str | Path, method: str | None = None,
          on_progress=None) -> CheckResult:
    """Loads, lives, governing life, damage shares, static safety, shaft and verdict.

    ``on_progress(done, total)`` is called as the work advances (hubload.progress)."""
    from hubload.engine import evaluate

    return CheckResult(evaluate(as_study(study_or_path, method), on_progress=on_progress))


class MachineResult(Wrapped):
    """The result of a machine: every wheel end's result, the machine's lives and verdict."""

    @property
    def governing_life(self):
        return self.value.governing

    def to_dict(self) -> dict:
        """The document of ``hubload machine --json``."""
        from hubload.report.json.machine import machine_document

        return machine_document(self.value)


def machine(path: str | Path) -> MachineResult:
    """A machine file's wheel ends (spectra derived from its operations), its life as a
    series system of every bearing, the weakest wheel end and the verdict."""
    from hubload.casefile.machinefile import load_machine_study
    from hubload.engine.machine import evaluate_machine

    return MachineResult(evaluate_machine(load_machine_study(path)))


class SweepResult(Wrapped):
    """``value``: hubload.studies.sweep.Sweep."""

    def to_dict(self) -> dict:
        """The document of ``hubload sweep --json``."""
        from hubload.report.json.sweep import sweep_document

        return sweep_document(self.value)


class MachineSweepResult(Wrapped):
    """``value``: hubload.studies.machine_sweep.MachineSweep."""

    def to_dict(self) -> dict:
        """The document of ``hubload sweep --json`` on a machine file."""
        from hubload.report.json.machine_sweep import machine_sweep_document

        return machine_sweep_document(self.value)


def is_machine_file(path: str | Path) -> bool:
    """Whether ``path`` is a machine file (a [machine] table) rather than a load-case file."""
    from hubload.casefile.machinefile import is_machine_file as machine_text

    return machine_text(path)


def sweep(path: str | Path, vary: Sequence[str], method: str | None = None,
          on_progress=None) -> SweepResult | MachineSweepResult:
    """The file's lives over the grid of ``vary`` specs (``"wheel.offset_mm=40:200:17"``);
    for a machine file, the machine's (``"machine.cog_height_mm=700:1300:7"``)."""
    from hubload.studies.sweep import run_sweep

    if is_machine_file(path):
        from hubload.studies.machine_sweep import run_machine_sweep

        return MachineSweepResult(run_machine_sweep(str(path), tuple(vary),
                                                    on_progress=on_progress, method=method))

    return SweepResult(run_sweep(str(path), tuple(vary), on_progress=on_progress,
                                 method=method))


class ComparisonResult(Wrapped):
    """``value``: hubload.studies.compare.Comparison."""

    def to_dict(self) -> dict:
        """The document of ``hubload compare --json``."""
        from hubload.report.json.compare import compare_document

        return compare_document(self.value)


class MachineComparisonResult(Wrapped):
    """``value``: hubload.engine.machine.MachineResult, one per machine file."""

    def to_dict(self) -> dict:
        """The document of ``hubload compare --json`` on machine files."""
        from hubload.report.json.machine_compare import compare_document

        return compare_document(self.value)


def compare(studies_or_paths: Sequence[Study | str | Path],
            method: str | None = None,
            on_progress=None) -> ComparisonResult | MachineComparisonResult:
    """Several files (or studies) side by side, the first as the reference; machine files
    compare machines (their lives, wheel ends and verdicts).

    ``on_progress(done, total)``: files read, then the studies evaluated."""
    from hubload.progress import in_parts
    from hubload.studies.compare import run_compare

    machines = [not isinstance(s, Study) and is_machine_file(s) for s in studies_or_paths]
    if any(machines):
        return compare_machines(studies_or_paths, machines, method)
    reading, evaluating = in_parts(on_progress, 2)
    studies = []
    for item in studies_or_paths:
        studies.append(as_study(item, method))
        reading(len(studies), len(studies_or_paths))
    return ComparisonResult(run_compare(studies, evaluating))


def compare_machines(paths, machines: list[bool], method: str | None):
    if not all(machines):
        odd = next(p for p, is_machine in zip(paths, machines) if not is_machine)
        raise InputError("compare takes machine files or load-case files, not both; this one "
                         "is a load-case file", file=str(odd))
    return MachineComparisonResult(tuple(evaluated_machine(path, method) for path in paths))


def evaluated_machine(path: str | Path, method: str | None = None):
    """The machine file's result (engine.machine.MachineResult), ``method`` overriding its
    [project] method for every wheel end."""
    from hubload.casefile.load import read_document
    from hubload.casefile.machinefile import machine_from_document
    from hubload.engine.machine import evaluate_machine

    document = read_document(path)
    if method is not None:
        document = {**document, "project": {**document.get("project", {}), "method": method}}
    return evaluate_machine(machine_from_document(document, str(path)))


class SettingResult(Wrapped):
    """``value``: hubload.studies.setting.SettingSweep."""

    def to_dict(self) -> dict:
        """The document of ``hubload setting --json``."""
        from hubload.report.json.setting import sweep_document

        return sweep_document(self.value)


def setting(study_or_path: Study | str | Path, start_um: float = -60.0,
            stop_um: float = 120.0, step_um: float = 5.0, on_progress=None) -> SettingResult:
    """Lives against the axial setting from ``start_um`` to ``stop_um`` (refined method);
    ``on_progress(done, total)`` as the settings' blocks of cases are solved."""
    from hubload.studies.setting import run_setting_sweep, setting_values_um

    settings = setting_values_um(start_um, stop_um, step_um)
    return SettingResult(run_setting_sweep(as_study(study_or_path, "refined"), settings,
                                           on_progress))


@dataclass(frozen=True)
class BriefResult(Wrapped):
    value: object      # hubload.studies.requirements.Requirements
    inputs: dict

    def to_markdown(self) -> str:
        """The supplier brief as ``hubload brief`` writes it."""
        from hubload.report.markdown.brief import brief_markdown

        return brief_markdown(self.value, self.inputs)

    def to_html(self) -> str:
        """The same brief as a printable, self-contained HTML page."""
        from hubload.report.html.brief import brief_html

        return brief_html(self.value, self.inputs)


def brief(path: str | Path, required_s0: float | None = None,
          method: str | None = None, on_progress=None) -> BriefResult:
    """The numbers of a supplier brief: required ratings, loads, open questions;
    ``on_progress(done, total)`` after each root search for a required rating."""
    import math

    from hubload.casefile.load import read_document
    from hubload.engine.findings import STATIC_SAFETY_WARNING
    from hubload.studies.requirements import requirements_of

    required_s0 = STATIC_SAFETY_WARNING if required_s0 is None else required_s0
    if not (0 < required_s0 <= MAX_REQUIRED_S0 and math.isfinite(required_s0)):
        raise InputError(f"expected a positive required static safety s0 up to "
                         f"{MAX_REQUIRED_S0:g}, got {required_s0:g}", key_path="required_s0")
    return BriefResult(requirements_of(load(path, method), required_s0, on_progress),
                       read_document(path))


def cases(path: str | Path):
    """The file's cases as written (validated), with its input files: what ``hubload cases``
    writes as a table (a :class:`hubload.casefile.casetable.WrittenCases`)."""
    from hubload.casefile.casetable import written_cases

    return written_cases(path)


@dataclass(frozen=True)
class LogsResult(Wrapped):
    value: object      # hubload.logs.analysis.LogRun
    files: dict        # the spectrum file written for each log, where one was

    def to_dict(self) -> dict:
        """The document of ``hubload spectrum --json``."""
        from hubload.report.json.spectrum import fleet_document, single_document

        run = self.value
        if run.combined is not None:
            return fleet_document(run, run.options.gaps, self.files)
        return single_document(run.single, run.options.gaps,
                               self.files.get(run.single.summary.name), run.case_file)


def spectrum(log: str | Path, case_file: str | Path, columns: Sequence[str] = (),
             classes: Sequence[str] = (), gaps: str = "error", max_gap_s: float | None = None,
             jobs: int | None = None, cluster: str | None = None, skip_bad: bool = False,
             on_log_done=None, weights: str | Path | None = None,
             method: str | None = None, on_progress=None) -> LogsResult:
    """The direct lives and the classed spectrum of a measured log, or of a folder of logs
    (each log, the fleet combined -- by logged hours, or by the fleet mix of a ``weights``
    CSV file -- and the ranking); ``case_file`` describes the wheel end. ``on_log_done(path)``
    after each log of a folder; ``on_progress(rows done, total or None)`` as a single log is
    read (hubload.progress)."""
    from hubload.logs.analysis import analyse, log_options

    options = log_options(columns, classes, gaps, max_gap_s)
    return LogsResult(analyse(log, case_file, options, jobs=jobs, cluster=cluster,
                                  skip_bad=skip_bad, on_log_done=on_log_done,
                                  weights=weights, method=method, on_rows=on_progress), {})


# The reliability commands' API lives beside this module; imported last, as it builds on
# check() and load() above.
from hubload.api.reliability import FieldResult, ForecastResult, field, forecast  # noqa: E402

__all__ = ["load", "check", "machine", "sweep", "compare", "setting", "brief", "cases",
           "spectrum", "forecast", "field", "CheckResult", "MachineResult", "SweepResult",
           "MachineSweepResult", "ComparisonResult", "MachineComparisonResult", "SettingResult",
           "BriefResult", "LogsResult", "ForecastResult", "FieldResult", "is_machine_file",
           "as_study"]
