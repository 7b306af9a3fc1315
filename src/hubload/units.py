"""Unit factors: the value of one file or display unit in SI (multiply to get SI, divide to show).

Files carry their units in the key names (``offset_mm``, ``C_kN``); everything inside hubload is
SI (m, N, Pa, m^2/s, s, K) except speeds, which stay in r/min, the unit of ISO 281's equations.
This module is the one place the factors are written; it imports nothing, so every layer,
the model included, may use it.
"""

from __future__ import annotations

MM = 1e-3                       # millimetre [m]
UM = 1e-6                       # micrometre [m]
KN = 1e3                        # kilonewton [N]
MPA = 1e6                       # megapascal [Pa]
GPA = 1e9                       # gigapascal [Pa]
BAR = 1e5                       # bar [Pa]
CM3 = 1e-6                      # cubic centimetre [m^3]
LPM = 1e-3 / 60.0               # litre per minute [m^3/s]
CST = 1e-6                      # centistokes = mm^2/s [m^2/s]
MRAD = 1e-3                     # milliradian [rad]
KMH = 1.0 / 3.6                 # kilometre per hour [m/s]
KW = 1e3                        # kilowatt [W]
SECONDS_PER_HOUR = 3600.0
SECONDS_PER_MINUTE = 60.0
CELSIUS_ZERO_K = 273.15         # 0 degC [K]
STANDARD_GRAVITY = 9.80665      # [m/s^2], ISO 80000-3 (the conventional value of g)
