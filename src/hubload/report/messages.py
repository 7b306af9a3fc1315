"""The words of every warning and flag: one writer per kind of finding.

The engine decides what is worth a warning (``hubload.engine.findings``); this module
writes it, once, for every output: the JSON ``warnings`` list, the terminal, the HTML
report and the brief all take their text from here.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence

from hubload.engine.findings import Finding
from hubload.units import BAR, CST, KN, MM, UM


def quoted(names: Sequence[str], index: int | None) -> str:
    return f"'{names[index]}'" if index is not None else ""


def slip(finding: Finding) -> str:
    values = finding.values
    return (f"wheel would slip: force capped at {values['force_n'] / KN:.2f} kN (adhesion_mu x "
            f"wheel load); the case asks for {values['demand_n'] / KN:.2f} kN")


def tyre_slides(finding: Finding) -> str:
    values = finding.values
    return (f"tyre would slide: side and tractive force together {values['combined_n'] / KN:.2f} "
            f"kN exceed adhesion_mu x wheel load = {values['limit_n'] / KN:.2f} kN (friction "
            f"circle); the side force is kept as given")


def pressure_above_rating(finding: Finding) -> str:
    values = finding.values
    verb = "" if values["given"] else " needed"
    return (f"pressure{verb} {values['pressure_pa'] / BAR:.0f} bar above the motor rating "
            f"max_pressure_bar = {values['rating_pa'] / BAR:g}")


def speed_above_rating(finding: Finding) -> str:
    values = finding.values
    return (f"speed {values['speed_rpm']:.1f} r/min above the motor rating max_speed_rpm = "
            f"{values['rating_rpm']:g}")


FLAG_TEXTS: dict[str, Callable[[Finding], str]] = {
    "slip": slip, "tyre_slides": tyre_slides, "pressure_above_rating": pressure_above_rating,
    "speed_above_rating": speed_above_rating}
FLAG_SHORT = {"slip": "slip", "tyre_slides": "slide", "pressure_above_rating": "p>max",
              "speed_above_rating": "n>max"}


def flag_text(finding: Finding) -> str:
    """A per-case operating flag as the case's ``flags`` list carries it."""
    return FLAG_TEXTS[finding.kind](finding)


def static_safety_low(found: list[Finding], names) -> list[str]:
    texts = []
    for finding in found:
        s0, limit = finding.values["s0"], finding.values["limit"]
        worse = "; below 1 the raceways deform permanently" if s0 < 1 else ""
        texts.append(f"Static safety s0 = {s0:.2f} of the {finding.subject} bearing under case "
                     f"{quoted(names, finding.case)} is below {limit:g} (common practice "
                     f"minimum for roller bearings with shock loads{worse}).")
    return texts


def kappa_outside_scope(found: list[Finding], names) -> list[str]:
    where = "; ".join(f"{quoted(names, f.case)}: "
                      + ", ".join(f"{label} {kappa:.3g}" for label, kappa in f.values.items())
                      for f in found)
    return [f"kappa < 0.1, outside the scope of ISO 281's aISO, in {where}. aISO and eC are "
            f"evaluated at kappa = 0.1 as a bounding estimate. At such a low viscosity ratio no "
            f"separating oil film forms: surface distress and wear, rather than the subsurface "
            f"fatigue that the rating life describes, may limit the bearing's life. Ask the "
            f"bearing and motor supplier about operation at these low speeds."]


def thin_oil(found: list[Finding], names) -> list[str]:
    return [f"The oil's viscosity at the operating temperature is below "
            f"{found[0].values['limit_m2_s'] / CST:g} mm2/s, where the Walther (ASTM D341) form "
            f"with the 0.7 constant loses accuracy: check the viscosity with the oil supplier."]


def rating_deviation(found: list[Finding], names) -> list[str]:
    texts = []
    for finding in found:
        v = finding.values
        texts.append(f"{v['symbol']} of the {finding.subject} bearing from its internal geometry "
                     f"({v['geometry_n'] / KN:.1f} kN, {v['standard']}) differs by "
                     f"{v['deviation']:+.0%} from the typed {v['symbol']}_kN "
                     f"({v['typed_n'] / KN:.1f} kN): check the geometry and the rating with the "
                     f"bearing's data.")
    return texts


def no_equilibrium(found: list[Finding], names) -> list[str]:
    return [f"No equilibrium of the shaft was found for case {quoted(names, f.case)}: the "
            f"bearings cannot carry its loads in the refined model (or the solver failed). Its "
            f"life is counted as zero; check the loads, the setting and the geometry."
            for f in found]


def contact_pressure_high(found: list[Finding], names) -> list[str]:
    return [f"Peak contact pressure {f.values['pressure_pa'] / 1e6:,.0f} MPa in the {f.subject} "
            f"bearing under case {quoted(names, f.case)} exceeds "
            f"{f.values['limit_pa'] / 1e6:.0f} MPa, the level on which ISO 76 bases C0: "
            f"permanent raceway deformation is to be expected." for f in found]


def shaft_section_inboard(found: list[Finding], names) -> list[str]:
    return [f"Shaft section '{f.subject}' lies inboard of both bearings: only the drive torque "
            f"acts there, no bending. Check its position_mm (positive outboard)." for f in found]


def offset_outside_curve(found: list[Finding], names) -> list[str]:
    v = found[0].values
    return [f"The wheel offset ({v['offset_m'] / MM:g} mm) lies outside the supplier's "
            f"permissible-load curve ({v['first_m'] / MM:g} to {v['last_m'] / MM:g} mm). The "
            f"curve is not extrapolated: the permissible load is not assessed. Ask the supplier "
            f"for this position."]


def permissible_exceeded(found: list[Finding], names) -> list[str]:
    over = ", ".join(f"{quoted(names, f.case)} ({100 * f.values['utilisation']:.0f} %)"
                     for f in found)
    return [f"The radial wheel force exceeds the supplier's permissible load in case(s) {over}."]


def all_standstill(found: list[Finding], names) -> list[str]:
    return ["Every case is at standstill: no fatigue life can be computed; only the static "
            "safety applies."]


def methods_disagree(found: list[Finding], names) -> list[str]:
    v = found[0].values
    iso_passes = v["iso281_life_h"] >= v["target_h"]
    return [f"The two methods disagree on the target of {v['target_h']:,.0f} h: the ISO 281 rule "
            f"gives {v['iso281_symbol']} = {v['iso281_life_h']:,.0f} h "
            f"({'pass' if iso_passes else 'fail'}), the refined load distribution "
            f"{v['refined_symbol']} = {v['refined_life_h']:,.0f} h "
            f"({'fail' if iso_passes else 'pass'}). The refined (ISO/TS 16281) life sums the "
            f"laminae with the line-contact exponent 4 where ISO 281 uses 10/3, so at light loads "
            f"it is longer whatever the setting; the verdict uses {v['governing_symbol']} "
            f"({RULE_WORDS[v['rule']]}; [project] verdict_basis)."]


RULE_WORDS = {"shorter": "the shorter of the two", "iso281": "the ISO 281 rule, as chosen",
              "refined": "the refined method, as chosen"}

def grouped(findings: Sequence[Finding]) -> list[tuple[str, list[Finding]]]:
    """Findings by kind, kinds in the order they first appear."""
    kinds: dict[str, list[Finding]] = {}
    for finding in findings:
        kinds.setdefault(finding.kind, []).append(finding)
    return list(kinds.items())


def warning_texts(findings: Sequence[Finding], names: Sequence[str]) -> list[str]:
    """Every warning as the JSON ``warnings`` list carries it: one line per flagged case for
    the operating flags (in case order), then one text per group of the other kinds."""
    texts = [f"Case {quoted(names, f.case)}: {flag_text(f)}." for f in findings
             if f.kind in FLAG_TEXTS]
    for kind, found in grouped([f for f in findings if f.kind not in FLAG_TEXTS]):
        texts += STUDY_TEXTS[kind](found, names)
    return texts


# How bad one finding of a kind is (larger: worse), to name the worst cases of a long list.
SEVERITY: dict[str, Callable[[Finding], float]] = {
    "slip": lambda f: f.values["demand_n"] - f.values["force_n"],
    "tyre_slides": lambda f: f.values["combined_n"] / f.values["limit_n"],
    "pressure_above_rating": lambda f: f.values["pressure_pa"],
    "speed_above_rating": lambda f: f.values["speed_rpm"],
    "kappa_outside_scope": lambda f: -min(f.values.values()),
    "permissible_exceeded": lambda f: f.values["utilisation"],
}
KIND_NAMES = {
    "slip": "wheel would slip (tractive force capped at adhesion_mu x wheel load)",
    "tyre_slides": "tyre would slide (friction circle exceeded)",
    "pressure_above_rating": "pressure above the motor's max_pressure_bar",
    "speed_above_rating": "speed above the motor's max_speed_rpm",
    "kappa_outside_scope": "kappa < 0.1, outside ISO 281's scope (aISO, eC at kappa = 0.1; no "
                           "separating oil film: ask the supplier about these low speeds)",
    "no_equilibrium": "no equilibrium in the refined model (life counted as zero)",
    "permissible_exceeded": "radial wheel force above the supplier's permissible load",
    "setting_becomes_preload": "assembly end play turned into preload in operation",
    "setting_loses_preload": "assembly preload turned into end play in operation",
}
WORST_SHOWN = 3
LISTED_CASES = 5      # a kind concerning more cases is summarised on the terminal


def summary_lines(findings: Sequence[Finding], names: Sequence[str],
                  detail_limit: int = LISTED_CASES) -> list[str]:
    """The warnings for a terminal: in full while a kind concerns few cases, else one line per
    kind with its number of cases and the worst few (the JSON keeps every record)."""
    lines = []
    kinds = grouped(findings)
    for kind, found in kinds:
        per_case = [f for f in found if f.case is not None]
        if kind not in KIND_NAMES or len(per_case) <= detail_limit:
            lines += warning_texts(found, names)
            continue
        severity = SEVERITY.get(kind, lambda f: 0.0)
        worst = sorted(per_case, key=severity, reverse=True)[:WORST_SHOWN]
        lines.append(f"{KIND_NAMES[kind]}: {len(per_case):,} cases, the worst "
                     + ", ".join(f"#{f.case}" for f in worst)
                     + " (case numbers of the tables); --all or --json lists every case.")
    return lines


def setting_warnings(unsolved_um) -> list[str]:
    """Settings [um] of a setting sweep at which some case found no equilibrium."""
    if len(unsolved_um) == 0:
        return []
    return [f"No equilibrium for some cases at settings "
            f"{', '.join(f'{v:g}' for v in unsolved_um)} um: their lives count as zero."]


LOG_FLAG_TEXT = {
    "slips": "the tractive or braking force exceeded adhesion_mu x wheel load and was capped "
             "there (the wheel would slip; check adhesion_mu or the force channel)",
    "tyre_slides": "side and tractive force together exceeded adhesion_mu x wheel load "
                   "(friction circle: the tyre would slide)",
    "pressure_above_rating": "the pressure was above the motor's max_pressure_bar",
    "speed_above_rating": "the speed was above the motor's max_speed_rpm",
    "kappa_outside_scope": "a bearing ran at kappa < 0.1, outside the scope of ISO 281's aISO "
                           "(no separating oil film: aISO is evaluated at kappa = 0.1 as a "
                           "bounding estimate; wear and surface distress may limit the life; "
                           "ask the supplier about these low speeds)",
}


def log_static_safety_low(found: list[Finding], names) -> list[str]:
    texts = []
    for f in found:
        s0, limit = f.values["s0"], f.values["limit"]
        worse = "; below 1 the raceways deform permanently" if s0 < 1 else ""
        texts.append(f"Static safety s0 = {s0:.2f} of the {f.subject} bearing at the log's peak "
                     f"load is below {limit:g} (common practice minimum for roller bearings "
                     f"with shock loads{worse}).")
    return texts


def log_flag_time(found: list[Finding], names) -> list[str]:
    return [f"In {100 * f.values['time_fraction']:.2g} % of the log's time "
            f"{LOG_FLAG_TEXT[f.subject]}." for f in found]


def log_shaft_safety_low(found: list[Finding], names) -> list[str]:
    return [f"Shaft section '{f.subject}': lowest fatigue safety {f.values['safety']:.2f} in the "
            f"log, below the required {f.values['required']:g}." for f in found]


def log_permissible_exceeded(found: list[Finding], names) -> list[str]:
    return [f"The radial wheel force reaches {100 * found[0].values['utilisation']:.0f} % of "
            f"the supplier's permissible load in the log."]


def operating_settings(found: list[Finding], names) -> str:
    """The cases of a setting finding with their operating settings: 'a' (+12 um), ..."""
    return ", ".join(f"{quoted(names, f.case)} ({f.values['operating_m'] / UM:+.0f} um)"
                     for f in found)


def setting_becomes_preload(found: list[Finding], names) -> list[str]:
    return [f"The assembly end play of {found[0].values['assembly_m'] / UM:g} um turns into a "
            f"preload in operation in {operating_settings(found, names)}: shaft and cones run "
            f"warmer than housing and cups (docs/operating-setting.md). Check the temperatures "
            f"and the setting with the bearing supplier."]


def setting_loses_preload(found: list[Finding], names) -> list[str]:
    return [f"The assembly preload of {-found[0].values['assembly_m'] / UM:g} um turns into end "
            f"play in operation in {operating_settings(found, names)}: housing and cups grow "
            f"more than shaft and cones (a light-alloy housing, or a housing warmer than the "
            f"shaft; docs/operating-setting.md). The pair then runs with a narrower load zone "
            f"and less stiffness than it was set for. Check the temperatures and the setting "
            f"with the bearing supplier."]


def setting_outside_the_rule(found: list[Finding], names) -> list[str]:
    low, high = (f"{found[0].values[key] / UM:+.0f}" for key in ("low_m", "high_m"))
    span = low if low == high else f"{low} to {high}"
    return [f"The lives follow the ISO 281 rule, which takes the pair at zero clearance: the "
            f"operating setting of {span} um (docs/operating-setting.md) does not enter them. "
            f"A preload or a wide end play shortens the lives; run --method refined for them "
            f"at each case's setting."]


def cup_fit_lost(found: list[Finding], names) -> list[str]:
    return [f"The {f.subject} cup's interference fit is lost in {f.values['cases']:.0f} "
            f"case(s), first in {quoted(names, f.case)}: the housing expands more than the cup "
            f"(light alloy); a loose cup can creep in its seat." for f in found]


def preload_raises_friction(found: list[Finding], names) -> list[str]:
    return [f"Preload drives the {f.subject} bearing's load friction to {f.values['ratio']:.1f} "
            f"times that of the external load alone (case {quoted(names, f.case)}): friction "
            f"and heat grow steeply with preload." for f in found]


def one_sided_side_force(found: list[Finding], names) -> list[str]:
    side = "inboard" if found[0].values["inboard"] else "outboard"
    return [f"Every case with a side force ({found[0].values['cases']:.0f}) has it {side}: a "
            f"wheel end sees both sides (turns both ways, slopes both ways), and the inside "
            f"wheel of a turn often loads the outboard bearing harder. Add the mirrored cases "
            f"(side force of the other sign, the other wheel's load), or describe the machine "
            f"in a machine file (hubload machine, docs/machine.md), which derives every wheel "
            f"end's cases both ways."]


STUDY_TEXTS: dict[str, Callable[[list[Finding], Sequence[str]], list[str]]] = {
    "all_standstill": all_standstill, "static_safety_low": static_safety_low,
    "kappa_outside_scope": kappa_outside_scope, "thin_oil": thin_oil,
    "rating_deviation": rating_deviation, "no_equilibrium": no_equilibrium,
    "contact_pressure_high": contact_pressure_high,
    "shaft_section_inboard": shaft_section_inboard, "offset_outside_curve": offset_outside_curve,
    "permissible_exceeded": permissible_exceeded, "methods_disagree": methods_disagree,
    "log_static_safety_low": log_static_safety_low, "log_flag_time": log_flag_time,
    "log_shaft_safety_low": log_shaft_safety_low,
    "log_permissible_exceeded": log_permissible_exceeded,
    "setting_becomes_preload": setting_becomes_preload,
    "setting_loses_preload": setting_loses_preload,
    "setting_outside_the_rule": setting_outside_the_rule, "cup_fit_lost": cup_fit_lost,
    "preload_raises_friction": preload_raises_friction,
    "one_sided_side_force": one_sided_side_force}
