"""Pure physics functions: numpy-vectorised over load cases, SI units inside, no I/O.

Every function names its units in parameter names or its docstring and cites the
source of its formula. Inputs are validated once, in ``hubload.casefile``.
"""
