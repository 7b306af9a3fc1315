"""The report page's style sheet: readable on screen, compact and unclipped in print."""

STYLE = """
:root { --ink: #1d1d1f; --muted: #5f6368; --line: #d8dbe0; --pass: #1e7b34; --fail: #b3261e;
        --warn-bg: #fff7e0; --warn-line: #e0b000; }
* { box-sizing: border-box; }
body { margin: 0; color: var(--ink); background: #fff;
       font: 15px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif; }
main { max-width: 1100px; margin: 0 auto; padding: 24px 28px 48px; }
h1 { font-size: 1.7em; margin: 0 0 4px; }
h2 { font-size: 1.25em; margin: 32px 0 10px; padding-bottom: 4px;
     border-bottom: 2px solid var(--line); }
.source { color: var(--muted); margin: 0 0 16px; }
.caution { background: var(--warn-bg); border-left: 5px solid var(--warn-line);
           padding: 10px 14px; margin: 12px 0; }
.verdict { font-size: 1.15em; padding: 10px 14px; border-radius: 4px; }
.verdict.pass { background: #e6f4ea; color: var(--pass); }
.verdict.fail { background: #fce8e6; color: var(--fail); }
.verdict.none { background: #f1f3f4; }
.scroll { overflow-x: auto; margin: 10px 0 18px; }
table { border-collapse: collapse; font-size: 0.88em; font-variant-numeric: tabular-nums; }
caption { text-align: left; font-weight: 600; padding: 4px 0; }
th, td { border-bottom: 1px solid var(--line); padding: 4px 10px; text-align: right;
         vertical-align: top; }
thead th { background: #f1f3f4; position: sticky; top: 0; }
tbody th, thead th:first-child { text-align: left; font-weight: 600; }
tbody tr:nth-child(even) { background: #fafbfc; }
dl { display: grid; grid-template-columns: max-content auto; gap: 2px 16px; }
dt { color: var(--muted); } dd { margin: 0; }
table.document td, table.document th { text-align: left; }
td.alert, th.alert { color: var(--fail); font-weight: 600; }
p.note { color: var(--muted); font-size: 0.85em; margin: -12px 0 14px; }
details { margin: 8px 0 18px; } summary { cursor: pointer; color: var(--muted); }
figure.chart { margin: 12px 0 24px; }
figure.chart svg { width: 100%; max-width: 820px; height: auto; }
footer { margin-top: 40px; color: var(--muted); }
@media print {
  @page { size: A4; margin: 14mm 12mm; }
  body { font-size: 10pt; }
  main { max-width: none; padding: 0; }
  h2 { break-after: avoid; margin-top: 18px; }
  .scroll { overflow: visible; }
  table { font-size: 8pt; max-width: 100%; }
  thead th { position: static; }
  tr, figure.chart, .caution, .verdict { break-inside: avoid; }
  .verdict, .caution, thead th { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
"""
