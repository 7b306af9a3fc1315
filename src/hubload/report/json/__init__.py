"""JSON documents of every command (the contracts of docs/json-output.md), built from typed
results only when JSON is asked for."""
