"""Measured logs to duty spectra.

A log (CSV or Parquet, millions of rows) is read in chunks (``reader``), checked
and repaired (``clean``), turned into per-sample wheel forces and speeds
(``samples``), and integrated by the same engine as a load-case file: the direct
Palmgren-Miner damage of every sample, and a time-at-level classed spectrum
(``pipeline``, ``spectrum``). Folders of logs run in parallel (``fleet``).
"""
