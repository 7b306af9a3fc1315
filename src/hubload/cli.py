"""Command-line interface: a thin click layer that parses options and hands them on.

Bad input raises :class:`hubload.errors.InputError`; it is printed as one line
and the command exits with status 2, never with a traceback. Click's usage errors
(an unknown option, a missing argument) are one line and status 2 as well. A numpy
warning never reaches the terminal: the model suppresses the expected ones where
they arise, so any other is a number that went wrong and ends the run with one line.
Anything else that escapes is a bug: one line naming it, status 1 (set
HUBLOAD_TRACEBACK=1 to see the traceback).
"""

from __future__ import annotations

import functools
import os
import signal
import sys
import warnings

import click

from hubload.errors import InputError

INPUT_ERROR_STATUS = 2
BUG_STATUS = 1
TRACEBACK_VARIABLE = "HUBLOAD_TRACEBACK"
# The API's argument names as the command line spells them (errors name the option).
OPTION_NAMES = {"required_s0": "--s0", "start_um": "--from", "stop_um": "--to",
                "step_um": "--step"}


def one_line(text: str) -> str:
    """``text`` as one terminal line: line breaks become spaces, control characters go."""
    from hubload.report.usertext import plain

    return plain(" ".join(str(text).split("\n")))


def fail(message: str, status: int) -> None:
    click.echo(f"error: {one_line(message)}", err=True)
    sys.exit(status)


def reports_input_errors(command):
    """Turn InputError into one line on stderr and exit status 2 (numpy warnings too: a
    warning means a number went wrong); anything else into one line and status 1."""
    @functools.wraps(command)
    def wrapper(*args, **kwargs):
        try:
            with warnings.catch_warnings():
                warnings.simplefilter("error", RuntimeWarning)
                command(*args, **kwargs)
        except InputError as error:
            if error.key_path in OPTION_NAMES:
                error = InputError(error.message, error.file, OPTION_NAMES[error.key_path])
            fail(str(error), INPUT_ERROR_STATUS)
        except RuntimeWarning as warning:
            fail(f"the calculation met a non-finite number ({warning}); check the inputs' "
                 "magnitudes", INPUT_ERROR_STATUS)
        except MemoryError:
            fail("not enough memory for this input; use a smaller file, grid or log",
                 INPUT_ERROR_STATUS)
        except BrokenPipeError:      # the reader (head, less) has what it wanted
            from hubload.commands import quiet_standard_output

            quiet_standard_output()
            sys.exit(0)
        except Exception as error:  # a bug: one line, never a traceback (unless asked)
            if os.environ.get(TRACEBACK_VARIABLE):
                raise
            fail(f"internal error ({type(error).__name__}: {error}); please report it with "
                 f"the input (set {TRACEBACK_VARIABLE}=1 for the traceback)", BUG_STATUS)
    return wrapper


class OneLineGroup(click.Group):
    """Click's usage errors as one line (``error: ...``) and status 2, like every other."""

    def main(self, *args, **kwargs):
        kwargs.pop("standalone_mode", None)
        for stream in (sys.stdout, sys.stderr):   # a terminal that cannot show a character
            if hasattr(stream, "reconfigure"):    # (a legacy code page) gets a '?' for it
                stream.reconfigure(errors="replace")
        previous = signal.signal(signal.SIGTERM, stopped)
        try:
            return super().main(*args, standalone_mode=False, **kwargs)
        except click.exceptions.Exit as done:
            sys.exit(done.exit_code)
        except click.UsageError as error:
            if type(error).__name__ == "NoArgsIsHelpError":  # bare `hubload`: the help
                click.echo(error.ctx.get_help(), err=True)
                sys.exit(INPUT_ERROR_STATUS)
            where = f" (see '{error.ctx.command_path} --help')" if error.ctx else ""
            fail(error.format_message() + where, INPUT_ERROR_STATUS)
        except click.ClickException as error:
            fail(error.format_message(), error.exit_code)
        except click.Abort:
            fail("interrupted", BUG_STATUS)
        finally:
            signal.signal(signal.SIGTERM, previous)


def stopped(signum, _frame) -> None:
    """SIGTERM as an exit that unwinds: temporary output files are removed on the way."""
    sys.exit(128 + signum)


json_option = click.option("--json", "as_json", is_flag=True,
                           help="Print machine-readable JSON only.")


def method_option():
    """--method of every command that evaluates a file."""
    return click.option(
        "--method", type=click.Choice(["iso281", "refined"]), default=None,
        help="iso281: the ISO 281 rule for the pair; refined: internal load distribution with "
             "the bearing setting (needs the internal geometry). Default: the file's "
             "[project] method, else iso281.")


def table_option():
    """--table of every command whose results go into a spreadsheet."""
    return click.option(
        "--table", type=click.Path(dir_okay=False),
        help="Also write the results as a spreadsheet: an .xlsx workbook with one sheet per "
             "table, or for .csv one CSV file per sheet (out.csv: out-cases.csv, ...).")


@click.group(cls=OneLineGroup)
@click.version_option(package_name="hubload")
def main():
    """Bearing and shaft life of hydraulic wheel-hub motors from load-case files."""


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@json_option
@click.option("--report", type=click.Path(dir_okay=False),
              help="Also write a self-contained HTML report (inputs, results, charts, cautions).")
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Also write the damage-share chart (.png or .svg).")
@table_option()
@click.option("--force", is_flag=True, help="Overwrite existing --report/--plot/--table files.")
@method_option()
@click.option("--all", "show_all", is_flag=True,
              help="List every case and every warning (default: the 25 most damaging cases).")
@reports_input_errors
def check(file, as_json, report, plot, table, force, method, show_all):
    """Loads, lives, damage shares and static safety for FILE."""
    from hubload import commands
    commands.check(file, as_json=as_json, report=report, plot=plot, force=force, method=method,
                   show_all=show_all, table=table)


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@json_option
@click.option("--cases", "show_cases", is_flag=True,
              help="Also list each wheel end's derived spectrum.")
@click.option("--write-wheel-files", metavar="DIR", type=click.Path(file_okay=False),
              help="Write each wheel end as a load-case file into DIR (check, sweep, compare, "
                   "setting and brief run on them).")
@click.option("--report", type=click.Path(dir_okay=False),
              help="Also write a self-contained HTML report of the machine.")
@table_option()
@click.option("--force", is_flag=True,
              help="Overwrite existing wheel end files, --report and --table files.")
@click.option("--all", "show_all", is_flag=True,
              help="List every case of --cases and every warning (default: the 25 most "
                   "damaging cases, warnings summarised).")
@reports_input_errors
def machine(file, as_json, show_cases, write_wheel_files, report, table, force, show_all):
    """Every wheel end of the machine FILE and the machine's life (operations -> wheel forces)."""
    from hubload.commands.machine import machine as run_machine
    run_machine(file, as_json=as_json, show_cases=show_cases,
                write_wheel_files=write_wheel_files, force=force, report=report,
                show_all=show_all, table=table)


@main.command()
@click.option("--machine", "machine_file", is_flag=True,
              help="The machine file's format instead (hubload machine).")
def schema(machine_file):
    """Print the load-case file format as a JSON Schema (for editors)."""
    from hubload import commands
    commands.schema(machine=machine_file)


@main.command()
@click.option("--machine", "machine_file", is_flag=True,
              help="A machine file instead (hubload machine; it names a wheel end file).")
def template(machine_file):
    """Print a commented starting load-case file (or machine file)."""
    from hubload import commands
    commands.template(machine_file)


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@click.option("--vary", "specs", multiple=True, metavar="KEY=START:STOP:COUNT",
              help="Key path of FILE and its evenly spaced values, e.g. "
                   "wheel.offset_mm=60:160:11 or case[3].side_force_kN=0:8:9 (repeatable: grid).")
@json_option
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Write a chart (.png or .svg): lines for one key, a life map for two.")
@method_option()
@table_option()
@click.option("--force", is_flag=True, help="Overwrite an existing plot or table file.")
@reports_input_errors
def sweep(file, specs, as_json, plot, force, method, table):
    """Lives and safeties of FILE over a range (or grid) of values of its numeric keys."""
    from hubload.commands import studies
    studies.sweep(file, specs, as_json=as_json, plot=plot, force=force, method=method,
                   table=table)


@main.command()
@click.argument("files", nargs=-1, required=True, type=click.Path(dir_okay=False))
@json_option
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Write a chart of lives and damage shares (.png or .svg).")
@method_option()
@table_option()
@click.option("--force", is_flag=True, help="Overwrite an existing plot or table file.")
@reports_input_errors
def compare(files, as_json, plot, force, method, table):
    """Several load-case FILES side by side: lives, ratios to the first, dominant cases."""
    from hubload.commands import studies
    studies.compare(files, as_json=as_json, plot=plot, force=force, method=method,
                     table=table)


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@click.option("--out", type=click.Path(dir_okay=False),
              help="Write the sheet to this file: Markdown (.md) or a printable HTML page "
                   "(.html), by the extension (default: print the Markdown).")
@click.option("--force", is_flag=True, help="Overwrite an existing --out file.")
@click.option("--s0", "required_s0", type=float, default=None,
              help="Static safety s0 the required static ratings must reach "
                   "(default 2, the check's warning level).")
@method_option()
@reports_input_errors
def brief(file, out, force, required_s0, method):
    """A supplier brief for FILE: cases, demands, required ratings, shaft, open questions."""
    from hubload.commands import studies
    studies.brief(file, out=out, force=force, required_s0=required_s0, method=method)


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@click.option("--to", "to", required=True, type=click.Path(dir_okay=False),
              help="The table to write: an .xlsx workbook or a .csv file; a load-case file "
                   "reads it back with [cases] table = \"...\".")
@click.option("--force", is_flag=True, help="Overwrite an existing --to file.")
@reports_input_errors
def cases(file, to, force):
    """Write the load cases of FILE as a spreadsheet table (one row per case)."""
    from hubload import commands
    commands.cases(file, to, force=force)


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@click.option("--from", "start_um", type=float, default=-60.0, show_default=True,
              help="First axial setting [um] (< 0 preload, > 0 end play).")
@click.option("--to", "stop_um", type=float, default=120.0, show_default=True,
              help="Last axial setting [um].")
@click.option("--step", "step_um", type=float, default=5.0, show_default=True,
              help="Step between settings [um].")
@json_option
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Write the lives against the setting as a chart (.png or .svg).")
@click.option("--force", is_flag=True, help="Overwrite an existing plot file.")
@reports_input_errors
def setting(file, start_um, stop_um, step_um, as_json, plot, force):
    """Lives of each bearing and of the pair of FILE against the axial setting (refined method)."""
    from hubload.commands import studies
    studies.setting(file, start_um, stop_um, step_um, as_json=as_json, plot=plot, force=force)


@main.command()
@click.argument("log", type=click.Path())
@click.option("--case-file", required=True, type=click.Path(dir_okay=False),
              help="Load-case file describing the wheel and pair (its [[case]] blocks are ignored).")
@click.option("--out", type=click.Path(), help="Write the classed spectrum as a load-case file "
              "(for a folder of logs: a folder with one file per log and combined.toml).")
@table_option()
@click.option("--force", is_flag=True, help="Overwrite existing output files.")
@json_option
@click.option("--column", "columns", multiple=True, metavar="KEY=HEADER",
              help="Read channel KEY from column HEADER (repeatable).")
@click.option("--classes", multiple=True, metavar="N|CHANNEL=N",
              help="Classes per channel: N for all, or e.g. side_force_kN=48 (repeatable).")
@click.option("--gaps", type=click.Choice(["error", "drop", "interpolate"]), default="error",
              show_default=True, help="What to do with empty samples and gaps in the time stamps.")
@click.option("--max-gap-s", type=float, help="Longest regular step between time stamps [s] "
              "(default: 10 x the median step).")
@click.option("--jobs", type=click.IntRange(min=1), help="Worker processes for a folder of logs "
              "(default: all cores).")
@click.option("--cluster", metavar="ADDRESS", help="Run the logs on a Dask distributed "
              "scheduler, e.g. tcp://scheduler-host:8786.")
@click.option("--skip-bad", is_flag=True, help="In a folder, leave out logs that cannot be used.")
@method_option()
@click.option("--weights", type=click.Path(dir_okay=False), help="A folder's fleet mix: CSV with "
              "columns log,share (share of machines working like each log); the logs are "
              "combined in those proportions instead of by their logged hours.")
@reports_input_errors
def spectrum(**options):
    """Duty spectrum and direct damage of a measured LOG (CSV/Parquet file or folder)."""
    from hubload import commands
    commands.spectrum(**options)


def fleet_options(command):
    """The keys of [fleet] and [reliability] as options of the same names (they override)."""
    options = (
        click.option("--distribution", type=click.Choice(["iso281", "weibull"]), default=None,
                     help="Life distribution (default: the file's [reliability], else iso281)."),
        click.option("--weibull-slope", type=float, default=None,
                     help="Slope of the two-parameter Weibull (implies --distribution weibull)."),
        click.option("--machines", type=int, default=None, help="Machines in the fleet."),
        click.option("--wheel-ends-per-machine", type=int, default=None,
                     help="Wheel ends like FILE's on each machine (not for a machine file)."),
        click.option("--hours-per-year-median", type=float, default=None,
                     help="Median operating hours per machine and year [h]."),
        click.option("--hours-per-year-spread", type=float, default=None,
                     help="Lognormal sigma of the hours per year over the fleet (>= 0)."),
        click.option("--years", type=int, default=None, help="Years of the forecast."),
        click.option("--warranty-years", type=float, default=None, help="Warranty [years]."),
        click.option("--warranty-hours", type=float, default=None,
                     help="Operating hours that end the warranty earlier [h]."),
        click.option("--calibration-factor", type=float, default=None,
                     help="Multiplies every predicted life (from 'hubload field --against')."),
    )
    for option in reversed(options):
        command = option(command)
    return command


@main.command()
@click.argument("file", type=click.Path(dir_okay=False))
@json_option
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Write F(t) of the units and the failures per year (.png or .svg).")
@click.option("--force", is_flag=True, help="Overwrite an existing plot file.")
@method_option()
@fleet_options
@reports_input_errors
def forecast(file, as_json, plot, force, method, **options):
    """Failure probability over time of FILE's wheel end (or a machine file's wheel ends and
    machine) and failures of its [fleet]."""
    from hubload.commands import reliability
    reliability.forecast(file, as_json=as_json, plot=plot, force=force, method=method, **options)


@main.command()
@click.argument("data", type=click.Path(dir_okay=False))
@click.option("--against", type=click.Path(dir_okay=False),
              help="Load-case or machine FILE whose predicted wheel end is compared with the "
                   "data (a machine's: by the rows' positions).")
@json_option
@click.option("--plot", type=click.Path(dir_okay=False),
              help="Write the Weibull probability plot (.png or .svg).")
@click.option("--force", is_flag=True, help="Overwrite an existing plot file.")
@click.option("--weibayes-slope", type=float, default=None,
              help="With fewer than two failures: the Weibull slope assumed for a Weibayes "
                   "estimate (e.g. 1.5).")
@method_option()
@reports_input_errors
def field(data, against, as_json, plot, force, weibayes_slope, method):
    """Weibull fits of field DATA (CSV or XLSX: hours, status failed/suspended per unit)."""
    from hubload.commands import reliability
    reliability.field(data, against=against, as_json=as_json, plot=plot, force=force,
                   weibayes_slope=weibayes_slope, method=method)
