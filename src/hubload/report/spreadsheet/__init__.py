"""Spreadsheets written from typed results (and the case table of ``hubload cases``)."""
