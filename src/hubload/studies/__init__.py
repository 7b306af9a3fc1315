"""Studies on top of the engine: parameter sweeps, comparisons of files, supplier requirements.

Each builds engine Results (batched where the studies share their structure)
and the check's JSON documents of them; ``hubload.report`` renders them.
"""
