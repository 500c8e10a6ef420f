/**
 * @module report/report-css
 * The report's stylesheet (inline in the document: no external assets). Screen: one readable column that
 * reflows down to a 360 px phone without sideways scrolling (wide tables stack their cells under labels).
 * Print: 15 mm margins, which leave 180 mm × 267 mm on A4 and 186 mm × 249 mm on US Letter, so the same
 * layout fits both; 9 pt text; headings kept with what follows them; charts, table rows and list items not
 * split; no section starts a page except the appendix after the two-page handout; table views print only
 * when opened.
 */
import { calendarCss } from './sections/calendar.ts'

export type Paper = 'auto' | 'a4' | 'letter'

export function reportCss(paper: Paper = 'auto'): string {
  const size = paper === 'a4' ? 'A4' : paper === 'letter' ? 'letter' : 'auto'
  return `
.dryhours-report{--ink:#1a1a1a;--muted:#555;--rule:#d0d0d0;--accent:#004488;--warn:#bb5566;--bg-soft:#f4f6f8;
  color:var(--ink);font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",Arial,sans-serif;max-width:46rem;margin:0 auto;padding:1.2rem 1rem 3rem;overflow-wrap:break-word}
.dryhours-report h1{font-size:1.7rem;line-height:1.2;margin:.1rem 0 .8rem}
.dryhours-report h2{font-size:1.2rem;margin:1.8rem 0 .6rem;padding-bottom:.2rem;border-bottom:2px solid var(--accent)}
.dryhours-report h3{font-size:1rem;margin:1rem 0 .3rem}
.dryhours-report .kicker{text-transform:uppercase;letter-spacing:.08em;font-size:.75rem;color:var(--accent);margin:0;font-weight:600}
.dryhours-report .facts{display:grid;grid-template-columns:repeat(auto-fill,minmax(min(16rem,100%),1fr));gap:.15rem 1.2rem;margin:0;padding:.6rem .8rem;background:var(--bg-soft);border-radius:6px}
.dryhours-report .kv{display:flex;gap:.6rem;min-width:0}
.dryhours-report dt{font-weight:600;min-width:5.2rem;color:var(--muted)}
.dryhours-report dd{margin:0;overflow-wrap:anywhere;min-width:0}
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
.dryhours-report table.data td.num,.dryhours-report table.data th[scope=row]{white-space:nowrap}
.dryhours-report table.data td.num{text-align:right}
.dryhours-report table.compact td,.dryhours-report table.compact th{padding:.1rem .35rem}
.dryhours-report .cautions li,.dryhours-report .limits li{margin:.25rem 0}
.dryhours-report .cautions{border:1px solid var(--rule);border-left:4px solid #ddaa33;padding:0 1rem .5rem;border-radius:4px;margin-top:1.4rem}
.dryhours-report .cautions h2{border-bottom:none}
.dryhours-report .appendix-title{margin:2.4rem 0 0;padding:.4rem .8rem;background:var(--bg-soft);border-left:4px solid var(--accent);font-weight:700;font-size:1.05rem}
.dryhours-report dl.assumptions div{margin:.2rem 0}
.dryhours-report dl.assumptions dt{display:inline;color:var(--ink)}
.dryhours-report dl.assumptions dd{display:inline;margin-left:.4rem}
.dryhours-report .source{color:var(--muted)}
.dryhours-report footer{margin-top:2rem;font-size:.8rem;color:var(--muted);border-top:1px solid var(--rule);padding-top:.5rem}
${calendarCss()}
@media (max-width:40rem){
  .dryhours-report{font-size:14px;padding:.8rem .6rem}
  .dryhours-report h1{font-size:1.4rem}
  .dryhours-report .kv{flex-direction:column;gap:0}
  /* wide tables: each row a block, each cell under its column's name (no sideways scrolling) */
  .dryhours-report table.stack thead{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0)}
  .dryhours-report table.stack,.dryhours-report table.stack tbody,.dryhours-report table.stack tr,.dryhours-report table.stack th,.dryhours-report table.stack td{display:block;width:100%}
  .dryhours-report table.stack caption{display:block;width:100%}
  .dryhours-report table.stack tr{border-bottom:2px solid var(--rule);padding:.25rem 0}
  .dryhours-report table.stack th[scope=row]{font-weight:700;border:0;white-space:normal;overflow-wrap:anywhere}
  .dryhours-report table.stack td,.dryhours-report table.stack td.num{border:0;text-align:right;white-space:normal;overflow-wrap:anywhere}
  .dryhours-report table.stack td::after{content:"";display:block;clear:both}
  .dryhours-report table.stack td::before{content:attr(data-label);float:left;max-width:62%;margin-right:.6rem;text-align:left;color:var(--muted);font-weight:600}
  .dryhours-report table.data{table-layout:fixed}
  .dryhours-report table.data th,.dryhours-report table.data td,.dryhours-report table.data th[scope=row],.dryhours-report table.data td.num{white-space:normal;overflow-wrap:anywhere}
  .dryhours-report .facts{padding:.5rem .6rem}
  .dryhours-report svg.chart{max-width:100%}
}
@page{size:${size};margin:15mm}
@media print{
  .dryhours-report{max-width:none;padding:0;font-size:9pt;line-height:1.3}
  .dryhours-report h1{font-size:15pt;margin-bottom:2.5mm}
  .dryhours-report h2{font-size:11.5pt;margin:3.5mm 0 1.5mm;break-after:avoid;page-break-after:avoid}
  .dryhours-report h3{break-after:avoid;page-break-after:avoid}
  .dryhours-report figcaption,.dryhours-report table.data caption,.dryhours-report thead{break-after:avoid}
  .dryhours-report figure,.dryhours-report tr,.dryhours-report li,.dryhours-report .kv,.dryhours-report .cal-row,.dryhours-report .warnings{break-inside:avoid}
  .dryhours-report .sentences li{margin:.8mm 0}
  .dryhours-report figure{margin:2mm 0 3mm}
  .dryhours-report svg.chart{max-height:72mm;width:auto;max-width:100%;margin:0 auto}
  .dryhours-report svg.chart[data-chart=heat-map]{max-height:92mm}
  .dryhours-report svg.chart[data-chart=psychrometric]{max-height:88mm}
  .dryhours-report figure.compact svg.chart{height:52mm;width:auto;max-width:100%}
  .dryhours-report.comparison svg.chart{max-height:60mm}
  .dryhours-report .handout .alt,.dryhours-report .handout figure .note{display:none}
  .dryhours-report details.table-view:not([open]){display:none}
  .dryhours-report .no-print{display:none}
  .dryhours-report .facts{background:none;border:1px solid var(--rule);padding:1.5mm 2.5mm;gap:0 4mm;font-size:8.5pt}
  .dryhours-report .warnings{margin:2mm 0;padding:.5mm 3mm}
  .dryhours-report .cautions{margin-top:3mm;padding:0 3mm 1mm}
  .dryhours-report .cautions li{margin:.6mm 0}
  .dryhours-report table.data{font-size:8pt;margin:1mm 0}
  .dryhours-report .note,.dryhours-report .alt{font-size:8pt;margin:1mm 0}
  .dryhours-report .appendix{break-before:page;page-break-before:always}
  .dryhours-report .appendix-title{margin:0 0 1mm;padding:1mm 3mm}
  .dryhours-report footer{margin-top:4mm;padding-top:1mm;break-before:avoid;page-break-before:avoid;break-inside:avoid}
  .dryhours-report a{color:inherit;text-decoration:none}
}
`
}
