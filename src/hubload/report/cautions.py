"""The cautions every output carries: these numbers can hurt someone if trusted blindly."""

CAUTIONS = (
    "Estimates only, by published rating methods with idealised assumptions. "
    "Confirm loads, ratings and lives with the bearing and motor supplier, and follow local "
    "codes and licensed engineering practice: a failed wheel bearing or shaft can drop a wheel."
)
