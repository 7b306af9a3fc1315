"""Studies on top of the engine: parameter sweeps, comparisons of files, the bearing setting,
supplier requirements.

Each builds typed engine results (batched where the studies share their structure);
``hubload.report`` renders them.
"""
