"""Everything generated from the format definition: JSON Schema, template, reference page."""

from __future__ import annotations

from typing import Any

from hubload.schema.spec import Choice, Field, Table

JSON_TYPES = {"number": "number", "integer": "integer", "string": "string", "boolean": "boolean"}


def field_schema(spec: Field) -> dict[str, Any]:
    if spec.kind == "number-list":
        node: dict[str, Any] = {"type": "array", "items": {"type": "number"}, "minItems": 1}
        target = node["items"]
    else:
        node = {"type": JSON_TYPES[spec.kind]}
        target = node
    node["description"] = spec.doc
    for name, bound in (("minimum", spec.minimum), ("exclusiveMinimum", spec.exclusive_minimum),
                        ("maximum", spec.maximum), ("exclusiveMaximum", spec.exclusive_maximum)):
        if bound is not None:
            target[name] = bound
    if spec.choices:
        node["enum"] = list(spec.choices)
    if spec.default is not None:
        node["default"] = spec.default
    return node


def table_schema(table: Table) -> dict[str, Any]:
    properties = {spec.key: field_schema(spec) for spec in table.fields}
    properties.update({sub.name: table_schema(sub) for sub in table.tables})
    node: dict[str, Any] = {"type": "object", "description": table.doc,
                            "properties": properties, "additionalProperties": False}
    required = [f.key for f in table.fields if f.required]
    required += [t.name for t in table.tables if t.required]
    if required:
        node["required"] = required
    rules = [rule for choice in table.choices for rule in choice_rules(choice)]
    if rules:
        node["allOf"] = rules
    if table.array:
        return {"type": "array", "items": node, "minItems": table.min_items,
                "description": table.doc}
    return node


def choice_rules(choice: Choice) -> list[dict[str, Any]]:
    """JSON Schema rules of one Choice (none for an optional group that only goes together)."""
    groups = [{"required": list(group)} for group in choice.groups]
    if choice.required:
        return [{"oneOf" if choice.exclusive else "anyOf": groups}]
    if choice.exclusive and len(choice.groups) > 1:
        return [{"not": {"anyOf": [{"required": [a[0], b[0]]}
                                   for i, a in enumerate(choice.groups)
                                   for b in choice.groups[i + 1:]]}}]
    return []


def json_schema(table: Table, title: str = "hubload load-case file") -> dict[str, Any]:
    """JSON Schema (draft 2020-12) of the load-case file (or, by ``table``, the machine file)."""
    return {"$schema": "https://json-schema.org/draft/2020-12/schema",
            "title": title, **table_schema(table)}


def toml_value(value: Any) -> str:
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, str):
        return f'"{value}"'
    if isinstance(value, (list, tuple)):
        return "[" + ", ".join(toml_value(v) for v in value) + "]"
    return f"{value:g}" if isinstance(value, float) else str(value)


def template_lines(table: Table, path: str, values: dict | None = None) -> list[str]:
    """The commented block of ``table``: each key with its example (or default), or with
    ``values[key]`` where given (None: written commented out)."""
    header = f"[[{path}]]" if table.array else f"[{path}]"
    lines = [f"# {table.doc}" + ("" if table.required else " (optional table)"), header]
    lines += [f"# {choice.doc}" for choice in table.choices]
    values = values or {}
    for spec in table.fields:
        value = values[spec.key] if spec.key in values else \
            spec.example if spec.example is not None else spec.default
        limits = spec.describe_limits()
        comment = f"  # {'required' if spec.required else 'optional'}. {spec.doc}" + (
            f" ({limits})" if limits else "")
        if value is None:
            lines.append(f"# {spec.key} = ...{comment}")
        else:
            lines.append(f"{spec.key} = {toml_value(value)}{comment}")
    lines.append("")
    for sub in table.tables:
        sub_lines = template_lines(sub, f"{path}.{sub.name}" if path else sub.name)
        if sub.name in alternative_tables(table):   # given instead of keys written above
            sub_lines = [f"# {line}" if line else line for line in sub_lines]
        lines += sub_lines
    return lines


def alternative_tables(table: Table) -> set[str]:
    """Sub-tables that a choice of ``table`` offers instead of its keys: the template writes
    them commented out, so that it stays a valid file."""
    return {group[0] for choice in table.choices for group in choice.groups[1:]
            if len(group) == 1 and table.table_named(group[0]) is not None}


def template_text(table: Table) -> str:
    """A commented starting file with every key of the format."""
    body = []
    for sub in table.tables:
        sub_lines = template_lines(sub, sub.name)
        if sub.name in alternative_tables(table):
            sub_lines = [f"# {line}" if line else line for line in sub_lines]
        body += sub_lines
    return "# hubload load-case file. Units are part of every key name.\n\n" + "\n".join(body)


def reference_lines(table: Table, path: str) -> list[str]:
    header = f"[[{path}]]" if table.array else f"[{path}]"
    lines = [f"### `{header}`" + ("" if table.required else " (optional)"), "", table.doc, ""]
    lines += [f"- {choice.doc}" for choice in table.choices]
    if table.choices:
        lines.append("")
    if table.fields:
        lines += ["| key | type | required | default | limits | meaning |",
                  "| --- | --- | --- | --- | --- | --- |"]
        for spec in table.fields:
            default = "" if spec.default is None else toml_value(spec.default)
            lines.append(f"| `{spec.key}` | {spec.kind} | {'yes' if spec.required else 'no'} | "
                         f"{default} | {spec.describe_limits()} | {spec.doc} |")
        lines.append("")
    for sub in table.tables:
        lines += reference_lines(sub, f"{path}.{sub.name}" if path else sub.name)
    return lines


LOAD_CASE_INTRO = (
    "# Load-case file reference", "",
    "Generated from `src/hubload/schema/fileformat.py` by "
    "`python -m hubload.schema.export > docs/file-format.md`; do not edit by hand.",
    "Positions are along the shaft axis from the motor's mounting face (x = 0), positive "
    "outboard (towards the wheel); see conventions.md. Unknown keys are errors.", "")
MACHINE_INTRO = (
    "# Machine file reference", "",
    "Generated from `src/hubload/schema/machineformat.py` by "
    "`python -m hubload.schema.export machine > docs/machine-file-format.md`; do not edit by "
    "hand. Machine axes: X forward, Y to the left, Z up; see machine.md. Unknown keys are "
    "errors.", "")


def reference_markdown(table: Table, intro: tuple[str, ...] = LOAD_CASE_INTRO) -> str:
    """The file-format reference page (docs/file-format.md is generated from this)."""
    body = []
    for sub in table.tables:
        body += reference_lines(sub, sub.name)
    return "\n".join(list(intro) + body)


if __name__ == "__main__":
    import sys

    if sys.argv[1:] == ["machine"]:
        from hubload.schema.machineformat import MACHINE_FORMAT

        print(reference_markdown(MACHINE_FORMAT, MACHINE_INTRO), end="")
    else:
        from hubload.schema.fileformat import FORMAT

        print(reference_markdown(FORMAT), end="")
