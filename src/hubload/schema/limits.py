"""Plausibility limits of the file formats, each with the reason for its value."""

# Plausibility limits (common practice): generous bounds beyond anything a wheel driven by a
# hydraulic hub motor meets, so that no real machine is refused while a unit slip (m for mm,
# N for kN) or a hostile value is, before it can overflow in a unit conversion.
# Positions along the shaft and the wheel offset: hub motors carry the wheel within a few
# hundred mm of their mounting face; 2 m is beyond any of them.
MAX_POSITION_MM = 2000.0
# Tyre radii: the smallest wheels on such drives are about 200 mm across, the largest
# earthmover tyres about 4 m (radius 2 m, from memory).
MIN_RADIUS_MM, MAX_RADIUS_MM = 50.0, 2500.0
# Wheel forces: the heaviest off-road tyres carry about 1,000 kN (100 t, from memory); the
# limit doubles it. Side and tractive forces stay below adhesion x load (adhesion <= 2).
MAX_WHEEL_FORCE_KN = 2000.0
# Speeds: low-speed high-torque motors run up to a few hundred r/min; a road wheel at
# 300 km/h with a 0.3 m radius turns about 2,650 r/min.
MAX_SPEED_RPM, MAX_SPEED_KMH = 5000.0, 300.0
# Hydraulics: wheel motors are rated up to about 450-500 bar; 2,000 bar is beyond any pump.
MAX_PRESSURE_BAR, MAX_FLOW_LPM, MAX_DISPLACEMENT_CC = 2000.0, 10000.0, 100000.0
# The smallest hydraulic motors displace a few cm3 per revolution; their efficiencies lie
# between about 0.8 and 0.98: below 10 % no motor drives a wheel (and a tiny one overflowed
# the braking speed, flow / efficiency).
MIN_DISPLACEMENT_CC, MIN_EFFICIENCY = 1.0, 0.1
# Lateral acceleration: friction-limited by the adhesion coefficient (<= 2).
MAX_LATERAL_G = 3.0
# Bearings: catalogue tapered roller bearings span about C = 10 kN (10 mm bore) to tens of MN
# (metre-size, from memory).
MIN_RATING_KN, MAX_RATING_KN = 0.1, 100000.0
MIN_DIAMETER_MM, MAX_DIAMETER_MM = 5.0, 5000.0
MAX_ROLLER_MM, MAX_ROLLERS, MAX_CROWN_DROP_UM = 500.0, 500, 1000.0
# Load factors: e = 1.5 tan a and Y = 0.4 cot a for angles of 1 to 60 deg stay below these.
MAX_E, MAX_Y = 5.0, 50.0
# Y = 0.4 cot a is 0.23 at 60 deg, the steepest angle allowed; 0.1 is below any bearing (a
# tiny Y overflowed the induced axial force 0.5 Fr / Y).
MIN_Y = 0.1
# Rollers: under a millimetre no tapered roller is made; notch radii under 10 um are cracks
# (Neuber's sqrt(a / r) overflowed at a radius of 5e-324 mm).
MIN_ROLLER_MM, MIN_NOTCH_RADIUS_MM = 0.5, 0.01
# A required safety factor below 1 would accept a computed failure.
MIN_REQUIRED_SAFETY = 1.0
MIN_CONTACT_ANGLE_DEG = 1.0
MAX_VISCOSITY_CST = 100000.0   # ISO VG 3200, the top grade, is 3,200 mm2/s at 40 C
MAX_AXLE_LOAD_KN, MIN_TRACK_MM, MAX_VEHICLE_MM = 2 * MAX_WHEEL_FORCE_KN, 100.0, 10000.0
# Shaft steels: from about 300 MPa (mild steel) to about 2,500 MPa (maraging, from memory).
MIN_STRENGTH_MPA, MAX_STRENGTH_MPA = 100.0, 5000.0
MAX_KT, MAX_NOTCH_RADIUS_MM, MAX_REQUIRED_SAFETY = 10.0, 100.0, 10.0
# A life target (and a warranty) of a million hours is over a century of continuous running;
# below an hour no drive is designed (and a target of 1e-308 h overflowed the load margin,
# life / target).
MIN_TARGET_LIFE_H, MAX_TARGET_LIFE_H = 1.0, 1e6
