// The page's only styling: plain, legible on a laptop, printable on A4 or Letter. Colours are from the
// Okabe–Ito set (darkened where text sits on them), and every colour is paired with a word or a shape.

export const CSS = `
:root { --ink: #1b1b1b; --muted: #5a5a5a; --rule: #d4d4d4; --paper: #ffffff; --tint: #f4f6f8;
  --error: #a63f00; --error-bg: #fbe9df; --warning: #7a5200; --warning-bg: #fdf1d6; --info: #005a8c; --info-bg: #e3f0f8;
  --pass: #00684a; --pass-bg: #ddf2ea; }
* { box-sizing: border-box; }
html { font-size: 15px; }
body { margin: 0; color: var(--ink); background: var(--paper); line-height: 1.45;
  font-family: system-ui, -apple-system, "Segoe UI", "DejaVu Sans", Arial, sans-serif; }
.page { max-width: 1080px; margin: 0 auto; padding: 1.5rem 1.5rem 3rem; }
h1 { font-size: 1.6rem; margin: 0.2rem 0 0.8rem; font-weight: 600; }
h2 { font-size: 1.25rem; margin: 2.2rem 0 0.6rem; padding-bottom: 0.25rem; border-bottom: 2px solid var(--ink); font-weight: 600; }
h3 { font-size: 1.05rem; margin: 1.4rem 0 0.4rem; font-weight: 600; }
p { margin: 0.4rem 0; }
a { color: var(--info); }
code, .mono { font-family: ui-monospace, "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 0.9em; overflow-wrap: anywhere; }
.meta { color: var(--muted); font-size: 0.9rem; margin: 0; }
.verdict { display: flex; gap: 1rem; align-items: baseline; flex-wrap: wrap; padding: 0.8rem 1rem; border-left: 6px solid; margin: 0.6rem 0; }
.verdict strong { font-size: 1.35rem; letter-spacing: 0.04em; }
.verdict.reject { border-color: var(--error); background: var(--error-bg); }
.verdict.pass { border-color: var(--pass); background: var(--pass-bg); }
.verdict.open { border-color: var(--muted); background: var(--tint); }
.counts { display: grid; grid-template-columns: repeat(auto-fit, minmax(7.5rem, 1fr)); gap: 0.5rem; margin: 0.8rem 0; padding: 0; }
.counts div { border: 1px solid var(--rule); padding: 0.4rem 0.6rem; }
.counts dt { font-size: 0.8rem; color: var(--muted); }
.counts dd { margin: 0; font-size: 1.3rem; font-variant-numeric: tabular-nums; }
.counts .error dd { color: var(--error); } .counts .warning dd { color: var(--warning); }
.caution { border: 1px solid var(--ink); padding: 0.7rem 1rem; margin: 1rem 0; background: var(--tint); }
.caution p { margin: 0.2rem 0; }
nav.toc { font-size: 0.95rem; margin: 1rem 0; }
nav.toc ol { margin: 0.3rem 0; padding-left: 1.4rem; }
table { border-collapse: collapse; width: 100%; margin: 0.4rem 0 0.8rem; font-size: 0.92rem; }
th, td { text-align: left; vertical-align: top; padding: 0.3rem 0.5rem; border-bottom: 1px solid var(--rule); }
th { font-weight: 600; border-bottom: 1.5px solid var(--ink); }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.sev { display: inline-block; min-width: 5.6rem; padding: 0.05rem 0.4rem; font-size: 0.82rem; font-weight: 600; border-radius: 3px; white-space: nowrap; }
.sev.error { color: var(--error); background: var(--error-bg); }
.sev.warning { color: var(--warning); background: var(--warning-bg); }
.sev.info { color: var(--info); background: var(--info-bg); }
.where { white-space: nowrap; }
td.rule code { white-space: nowrap; overflow: hidden; text-overflow: ellipsis; display: block; }
.diag, .impact, .waiver { display: block; margin-top: 0.2rem; font-size: 0.88rem; }
.diag { color: var(--ink); }
.diag::before { content: "Diagnosis: "; font-weight: 600; }
.impact { color: var(--muted); }
tr.waived td { color: var(--muted); }
tr.waived .sev { background: transparent; border: 1px dashed currentColor; }
.waiver::before { content: "Waived: "; font-weight: 600; }
.group { margin: 1rem 0 1.4rem; }
.group h3 .phase { color: var(--muted); font-weight: normal; }
.group h3 a { font-size: 0.85rem; font-weight: normal; margin-left: 0.6rem; }
figure.chart { margin: 0.6rem 0 1.6rem; break-inside: avoid; page-break-inside: avoid; }
figure.chart svg { display: block; max-width: 100%; height: auto; }
ul.key { list-style: none; display: flex; flex-wrap: wrap; gap: 0.3rem 1.2rem; margin: 0.3rem 0 0; padding: 0; font-size: 0.86rem; }
ul.key li { display: flex; align-items: center; gap: 0.35rem; }
figcaption { font-size: 0.88rem; color: var(--muted); margin-top: 0.3rem; max-width: 46rem; }
.note { color: var(--muted); font-size: 0.9rem; }
pre { background: var(--tint); padding: 0.6rem 0.8rem; overflow-x: auto; font-size: 0.82rem; white-space: pre-wrap; overflow-wrap: anywhere; }
footer { margin-top: 3rem; padding-top: 0.8rem; border-top: 1px solid var(--rule); font-size: 0.88rem; color: var(--muted); }
table.findings { table-layout: fixed; }
table.findings col.c-sev { width: 8rem; } table.findings col.c-where { width: 16.5rem; } table.findings col.c-rule { width: 11.5rem; }
table.findings td.where { white-space: normal; } td.where code { overflow-wrap: break-word; } .nowrap { white-space: nowrap; }
@media (max-width: 800px) { table.findings { table-layout: auto; } }
@media print {
  @page { margin: 14mm; }
  html { font-size: 10pt; }
  .page { max-width: none; padding: 0; }
  nav.toc, .group h3 a { display: none; }
  a { color: inherit; text-decoration: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
  tr { break-inside: avoid; page-break-inside: avoid; }
  .verdict, .caution, .sev { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
`;
