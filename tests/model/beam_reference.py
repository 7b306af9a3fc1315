"""Independent reference for the shaft statics: sympy.physics.continuum_mechanics.beam."""

from sympy import Symbol, symbols
from sympy.physics.continuum_mechanics.beam import Beam


def sympy_two_support_beam(force_n, couple_nm, load_x_m, outboard_x_m, inboard_x_m,
                           section_x_m):
    """Reactions of the outboard and inboard supports, and bending moment and shear at a section.

    A two-support shaft carries one force and one couple (counter-clockwise positive, as in
    hubload.model.statics). sympy's beam starts at 0, so every position is shifted by the
    leftmost point; its applied couples are clockwise-positive.
    """
    r_out, r_in = symbols("r_out r_in")
    origin = min(load_x_m, outboard_x_m, inboard_x_m, section_x_m) - 0.1
    length = max(load_x_m, outboard_x_m, inboard_x_m, section_x_m) - origin + 0.1
    beam = Beam(length, Symbol("E"), Symbol("I"))
    beam.apply_load(r_out, outboard_x_m - origin, -1)
    beam.apply_load(r_in, inboard_x_m - origin, -1)
    beam.apply_load(force_n, load_x_m - origin, -1)
    beam.apply_load(-couple_nm, load_x_m - origin, -2)
    beam.bc_deflection = [(outboard_x_m - origin, 0), (inboard_x_m - origin, 0)]
    beam.solve_for_reaction_loads(r_out, r_in)
    at = {Symbol("x"): section_x_m - origin}
    return (float(beam.reaction_loads[r_out]), float(beam.reaction_loads[r_in]),
            float(beam.bending_moment().subs(at)), float(beam.shear_force().subs(at)))
