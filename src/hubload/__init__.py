"""hubload: bearing and shaft life of hydraulic wheel-hub motors.

The Python API (``hubload.check``, ``load``, ``sweep``, ``compare``, ``setting``,
``brief``, ``spectrum``, ``cases``, ``forecast``, ``field``, ``machine``) is imported on first
use, so that the command line starts fast.
Layers: ``model`` (pure physics) <- ``domain`` (typed study) <- ``casefile``
(files -> study) and ``engine`` (study -> typed results) <- ``studies`` <-
``report`` (terminal, JSON, HTML, plots) <- ``commands`` <- ``cli``.
"""

__version__ = "0.1.0"
__all__ = ["load", "check", "sweep", "compare", "setting", "brief", "spectrum", "cases",
           "forecast", "field", "machine"]


def __getattr__(name: str):
    if name in __all__:
        from hubload import api

        return getattr(api, name)
    raise AttributeError(f"module 'hubload' has no attribute {name!r}")
