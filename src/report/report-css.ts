/**
 * @module report/report-css
 * The report's stylesheet (inline in the document: no external assets). Screen: one readable column.
 * Print: 15 mm margins, which leave 180 mm × 267 mm on A4 and 186 mm × 249 mm on US Letter, so the same
 * layout fits both; charts and tables do not break across pages; table views print only when opened.
 */

export type Paper = 'auto' | 'a4' | 'letter'

export function reportCss(paper: Paper = 'auto'): string {
  const size = paper === 'a4' ? 'A4' : paper === 'letter' ? 'letter' : 'auto'
  return `
.dryhours-report{--ink:#1a1a1a;--muted:#555;--rule:#d0d0d0;--accent:#004488;--warn:#bb5566;--bg-soft:#f4f6f8;
  color:var(--ink);font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",Arial,sans-serif;max-width:46rem;margin:0 auto;padding:1.2rem 1rem 3rem}
.dryhours-report h1{font-size:1.7rem;line-height:1.2;margin:.1rem 0 .8rem}
.dryhours-report h2{font-size:1.2rem;margin:1.8rem 0 .6rem;padding-bottom:.2rem;border-bottom:2px solid var(--accent)}
.dryhours-report h3{font-size:1rem;margin:1rem 0 .3rem}
.dryhours-report .kicker{text-transform:uppercase;letter-spacing:.08em;font-size:.75rem;color:var(--accent);margin:0;font-weight:600}
.dryhours-report .facts{display:grid;grid-template-columns:repeat(auto-fill,minmax(16rem,1fr));gap:.15rem 1.2rem;margin:0;padding:.6rem .8rem;background:var(--bg-soft);border-radius:6px}
.dryhours-report .kv{display:flex;gap:.6rem;min-width:0}
.dryhours-report dt{font-weight:600;min-width:5.2rem;color:var(--muted)}
.dryhours-report dd{margin:0;overflow-wrap:anywhere}
.dryhours-report .sentences{padding-left:1.1rem;margin:.2rem 0}
.dryhours-report .sentences li{margin:.35rem 0}
.dryhours-report .answer .sentences li::marker{color:var(--accent)}
.dryhours-report .warnings{border-left:4px solid var(--warn);padding:.2rem .8rem;margin:.8rem 0;background:#fbf1f3}
.dryhours-report .warnings h3{margin:.3rem 0;color:#7a2a37}
.dryhours-report figure{margin:1rem 0 1.4rem}
.dryhours-report figcaption{font-weight:600;margin-bottom:.3rem}
.dryhours-report .fig-no{color:var(--accent)}
.dryhours-report svg.chart{width:100%;height:auto;display:block;font-family:inherit}
.dryhours-report .alt{font-size:.88rem;color:var(--muted);margin:.3rem 0}
.dryhours-report .alt-label{font-weight:600}
.dryhours-report .note{font-size:.85rem;color:var(--muted);margin:.3rem 0}
.dryhours-report .missing{font-style:italic;color:var(--muted)}
.dryhours-report details.table-view{margin:.3rem 0;font-size:.85rem}
.dryhours-report details.table-view summary{cursor:pointer;color:var(--accent);font-weight:600}
.dryhours-report table.data{border-collapse:collapse;width:100%;margin:.4rem 0;font-size:.82rem;font-variant-numeric:tabular-nums}
.dryhours-report table.data caption{text-align:left;font-weight:600;padding:.2rem 0}
.dryhours-report table.data th,.dryhours-report table.data td{border-bottom:1px solid var(--rule);padding:.15rem .4rem;text-align:left;vertical-align:top}
.dryhours-report table.data thead th{border-bottom:2px solid var(--ink);font-weight:600}
.dryhours-report table.data td.num{text-align:right;white-space:nowrap}
.dryhours-report .table-scroll{overflow-x:auto}
.dryhours-report .cautions li,.dryhours-report .limits li{margin:.25rem 0}
.dryhours-report .cautions{border:1px solid var(--rule);border-left:4px solid #ddaa33;padding:0 1rem .5rem;border-radius:4px}
.dryhours-report .cautions h2{border-bottom:none}
.dryhours-report footer{margin-top:2rem;font-size:.8rem;color:var(--muted);border-top:1px solid var(--rule);padding-top:.5rem}
@media (max-width:40rem){.dryhours-report{font-size:14px;padding:.8rem .6rem}.dryhours-report h1{font-size:1.4rem}}
@page{size:${size};margin:15mm}
@media print{
  .dryhours-report{max-width:none;padding:0;font-size:9.5pt;line-height:1.35}
  .dryhours-report h1{font-size:16pt}
  .dryhours-report h2{font-size:12pt;margin-top:10pt;break-after:avoid}
  .dryhours-report figure,.dryhours-report table.data,.dryhours-report .kv,.dryhours-report .cautions{break-inside:avoid}
  .dryhours-report svg.chart{max-height:105mm}
  .dryhours-report svg.chart[data-chart=heat-map]{max-height:135mm}
  .dryhours-report details.table-view:not([open]){display:none}
  .dryhours-report .no-print{display:none}
  .dryhours-report .facts{background:none;border:1px solid var(--rule)}
  .dryhours-report a{color:inherit;text-decoration:none}
}
`
}
