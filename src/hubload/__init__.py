"""hubload: bearing and shaft life of hydraulic wheel-hub motors.

Layers: ``model`` (pure physics), ``casefile`` (TOML -> typed study),
``engine`` (study -> results), ``report`` (terminal, JSON, files), ``cli``.
"""

__version__ = "0.1.0"
