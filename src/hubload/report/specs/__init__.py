"""Table specifications of each command (shared by terminal, HTML and spreadsheets)."""
