"""Shaft check of the wheel shaft: fatigue strength, section stresses, S-N life.

Method of R. G. Budynas, J. K. Nisbett, Shigley's Mechanical Engineering Design,
10th ed., McGraw-Hill 2015 (chapters 6 and 7); see docs/shaft.md.

- :mod:`.strength`: endurance limit, Marin factors, notch sensitivity, Kf.
- :mod:`.stress`: loads at a section (from hubload.model.statics), von Mises
  stresses, DE-Goodman / DE-ASME elliptic safety, first-cycle yield.
- :mod:`.fatigue`: Goodman equivalent stress, S-N line, Palmgren-Miner life.
"""
