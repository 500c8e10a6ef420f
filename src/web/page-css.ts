/**
 * @module web/page-css
 * The page's stylesheet, served at /app.css (the CSP allows same-origin styles): the navigation between the
 * jobs, the forms, the sites table, the progress line, the downloads bar, plus the report's own stylesheet
 * for the result shown inline. Colours from the report palette (Tol high-contrast blue as the accent, the
 * yellow for the focus ring). Everything reflows down to a 360 px phone without sideways scrolling.
 */
import { reportCss } from '../report/report-css.ts'

export function pageCss(): string {
  return `
*{box-sizing:border-box}
html{-webkit-text-size-adjust:100%}
body{margin:0;background:#eef1f4;color:#1a1a1a;font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",Arial,sans-serif;overflow-wrap:break-word}
.wrap{max-width:52rem;margin:0 auto;padding:0 1rem}
.skip{position:absolute;left:-999px}.skip:focus{left:1rem;top:.5rem;background:#fff;padding:.3rem .6rem;z-index:9}
.masthead{background:#004488;color:#fff;padding:1rem 0 .6rem;margin-bottom:1.2rem}
.masthead .wrap{display:flex;flex-wrap:wrap;align-items:baseline;gap:.2rem 1rem}
.brand{font-weight:800;font-size:1.6rem;letter-spacing:-.01em;margin:0}
.brand::before{content:"";display:inline-block;width:.8rem;height:.8rem;margin-right:.45rem;background:#ddaa33;border-radius:50%;box-shadow:.35rem 0 0 #bb5566}
.tagline{margin:0;flex:1 1 20rem;opacity:.92}
.masthead nav{flex:1 1 100%}
.masthead nav ul{list-style:none;margin:.5rem 0 0;padding:0;display:flex;flex-wrap:wrap;gap:.3rem}
.masthead nav a{display:inline-block;color:#fff;text-decoration:none;padding:.3rem .7rem;border-radius:6px;border:1px solid rgba(255,255,255,.35)}
.masthead nav a:hover{background:rgba(255,255,255,.12)}
.masthead nav a[aria-current=page]{background:#fff;color:#004488;font-weight:700;border-color:#fff}
.page-title{font-size:1.45rem;margin:.2rem 0 .2rem}
.intro{margin:0 0 1rem;color:#333;max-width:44rem}
main:focus{outline:none}
.card{background:#fff;border-radius:10px;box-shadow:0 1px 3px rgba(0,0,0,.12);padding:1.1rem 1.3rem 1.3rem;margin-bottom:1.2rem}
fieldset.step{border:0;border-bottom:1px solid #e1e5ea;margin:0;padding:.4rem 0 1rem;min-width:0}
fieldset.step.last{border-bottom:0;padding-bottom:0}
legend{font-weight:700;font-size:1.05rem;padding:0;margin:.4rem 0 .5rem;display:flex;align-items:center;gap:.5rem}
legend .n{display:inline-grid;place-items:center;width:1.6rem;height:1.6rem;border-radius:50%;background:#004488;color:#fff;font-size:.9rem;flex:none}
legend.label{font-size:.9rem;font-weight:600;margin:.2rem 0 .3rem}
.grid{display:grid;grid-template-columns:repeat(auto-fill,minmax(min(14rem,100%),1fr));gap:.2rem 1rem}
.field{display:flex;flex-direction:column;gap:.15rem;margin:.35rem 0;min-width:0}
.field.wide{grid-column:1/-1}
fieldset.field,fieldset.choices-group{border:0;padding:0;margin:.35rem 0;min-width:0}
.field label,.field .label{font-weight:600;font-size:.9rem}
.field small,.hint{color:#555;font-size:.82rem}
input[type=text],input:not([type]),select,textarea{font:inherit;padding:.42rem .5rem;border:1px solid #9aa3ad;border-radius:6px;background:#fff;min-width:0;width:100%}
input[type=file]{font:inherit;font-size:.9rem;padding:.35rem;border:1px dashed #9aa3ad;border-radius:6px;background:#f7f9fb;width:100%;max-width:100%;min-width:0}
[aria-invalid=true]{border-color:#bb5566 !important;box-shadow:0 0 0 2px #f3d6dc}
input:focus-visible,select:focus-visible,textarea:focus-visible,button:focus-visible,summary:focus-visible,a:focus-visible,[tabindex]:focus-visible{outline:3px solid #ddaa33;outline-offset:1px}
label.inline{font-weight:400;display:inline-flex;gap:.35rem;align-items:center;margin-right:1rem}
.radios label.inline{margin:.15rem 1rem .15rem 0}
.choices{display:grid;grid-template-columns:repeat(auto-fill,minmax(min(11.5rem,100%),1fr));gap:.5rem;margin:.2rem 0 .6rem}
.choice{display:flex;gap:.5rem;align-items:flex-start;border:1px solid #c7ced6;border-radius:8px;padding:.5rem .6rem;cursor:pointer;background:#fafbfc}
.choice:has(input:checked){border-color:#004488;background:#eaf1f8;box-shadow:inset 0 0 0 1px #004488}
.choice span{display:flex;flex-direction:column;min-width:0}
.choice small{color:#555;font-size:.8rem;line-height:1.3}
details.questions{margin:.5rem 0;border:1px solid #e1e5ea;border-radius:8px;padding:.4rem .7rem}
details.questions[open]{background:#fbfcfd}
details.questions summary{cursor:pointer;font-weight:600;color:#004488}
.sites{display:flex;flex-direction:column;gap:.6rem}
fieldset.site{border:1px solid #d5dbe2;border-radius:8px;padding:.3rem .8rem .5rem;margin:0;min-width:0}
fieldset.site legend{font-size:.95rem;margin:.2rem 0}
.site-grid{display:grid;grid-template-columns:repeat(auto-fill,minmax(min(12rem,100%),1fr));gap:0 .8rem}
.no-js-hide{display:none}.js .no-js-hide{display:block}
.actions{display:flex;align-items:center;gap:.8rem 1rem;margin-top:.8rem;flex-wrap:wrap}
button{font:inherit;font-weight:700;background:#004488;color:#fff;border:0;border-radius:8px;padding:.6rem 1.6rem;cursor:pointer}
button:hover{background:#003366}
button.secondary{background:#fff;color:#004488;border:1px solid #004488;padding:.5rem 1rem;font-weight:600}
button.secondary:hover{background:#eaf1f8}
button[disabled]{background:#7a8896;color:#fff;cursor:progress}
.status{display:flex;align-items:center;gap:.8rem;margin-top:.8rem;flex-wrap:wrap}
.status[hidden],.downloads[hidden],.error[hidden],.method-only[hidden]{display:none}
progress{width:min(14rem,100%);height:.8rem;accent-color:#004488}
.error{border-left:4px solid #bb5566;background:#fbf1f3;padding:.5rem .8rem;margin:0 0 .6rem;border-radius:4px;overflow-wrap:anywhere}
.downloads{display:flex;flex-wrap:wrap;gap:.6rem;align-items:center;background:#fff;border-radius:10px;padding:.7rem 1rem;margin-bottom:1rem;box-shadow:0 1px 3px rgba(0,0,0,.12)}
.downloads a{display:inline-block;padding:.35rem .9rem;border:1px solid #004488;border-radius:6px;color:#004488;font-weight:600;text-decoration:none}
.downloads a:hover{background:#eaf1f8}
.result:focus{outline:none}
.result .dryhours-report{background:#fff;border-radius:10px;box-shadow:0 1px 3px rgba(0,0,0,.12);margin-bottom:1.2rem;max-width:none;padding:1.2rem 1.5rem 1.5rem}
.result .dryhours-report h1:focus{outline:3px solid #ddaa33;outline-offset:2px}
.again{margin:-.4rem 0 1.2rem;font-weight:600}.again a{color:#004488}
.page-foot{color:#555;font-size:.85rem;padding-bottom:2rem}
@media (max-width:40rem){
  .wrap{padding:0 .6rem}
  .card{padding:.8rem .8rem 1rem}
  .result .dryhours-report{padding:.8rem .7rem 1rem}
  .brand{font-size:1.35rem}
  button{padding:.6rem 1.1rem}
}
@media print{.masthead,.task-form,.downloads,.page-foot,.skip,.page-title,.intro,.again{display:none}body{background:#fff}.result .dryhours-report{box-shadow:none;padding:0}body.print-handout .appendix{display:none}}
${reportCss('auto')}
`
}
