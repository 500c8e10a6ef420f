import { Hono } from 'hono'
import { escapeHtml } from '../../report/escape.ts'
import { type ApiConfig, limitsTable } from '../config.ts'
import { buildOpenApiDocument } from '../openapi.ts'
import { listOperations } from '../operations.ts'
import { PROBLEM_TYPE_BASE, PROBLEM_TYPES } from '../problem.ts'

/** The limits in force and the problem types, as two tables of the docs page. */
function limitsAndProblems(config: ApiConfig): string {
  const limits = limitsTable(config)
    .map(
      (l) =>
        `<tr><td><code>${escapeHtml(l.variable)}</code></td><td>${l.value.toLocaleString('en')} ${escapeHtml(l.unit)}</td><td>${escapeHtml(l.answer)}</td><td>${escapeHtml(l.applies)}</td></tr>`,
    )
    .join('')
  const problems = Object.entries(PROBLEM_TYPES)
    .map(
      ([kind, t]) =>
        `<tr id="problem-${kind}"><td><code>${escapeHtml(PROBLEM_TYPE_BASE + kind)}</code></td><td>${t.status}</td><td>${escapeHtml(t.description)}</td></tr>`,
    )
    .join('')
  return `<section id="limits"><h2>Limits of this server</h2>
<table><thead><tr><th>setting</th><th>value</th><th>answer above it</th><th>applies to</th></tr></thead><tbody>${limits}</tbody></table></section>
<section id="problems"><h2>Problem types</h2><p>Every error answer is <code>application/problem+json</code> with one of these <code>type</code>s; branch on the type, not on the wording of <code>detail</code>.</p>
<table><thead><tr><th>type</th><th>status</th><th>meaning</th></tr></thead><tbody>${problems}</tbody></table></section>`
}

function docsPage(config: ApiConfig): string {
  const doc = buildOpenApiDocument(config) as {
    paths: Record<
      string,
      Record<string, { parameters?: { name: string; description: string; required: boolean }[] }>
    >
  }
  const sections = listOperations()
    .map((op) => {
      const apiPath = op.path.replace(/:([a-zA-Z]+)/g, '{$1}')
      const params = doc.paths[apiPath]?.[op.method]?.parameters ?? []
      const paramRows = params
        .map(
          (p) =>
            `<tr><td><code>${escapeHtml(p.name)}</code></td><td>${p.required ? 'required' : 'optional'}</td><td>${escapeHtml(p.description)}</td></tr>`,
        )
        .join('')
      const examples = op.examples
        .map((ex) => {
          const curl =
            op.method === 'get'
              ? `curl 'http://127.0.0.1:8787${ex.url}'`
              : `curl -X POST 'http://127.0.0.1:8787${ex.url}'${ex.contentType ? ` -H 'content-type: ${ex.contentType}'` : ''}${ex.body ? ` --data-binary '${ex.body}'` : ''}`
          return `<li>${escapeHtml(ex.name)}: <code>${escapeHtml(curl)}</code></li>`
        })
        .join('')
      return `<section><h2><span class="m">${op.method.toUpperCase()}</span> <code>${escapeHtml(apiPath)}</code></h2>
<p><strong>${escapeHtml(op.summary)}.</strong> ${escapeHtml(op.description)}</p>
${paramRows ? `<table><thead><tr><th>parameter</th><th></th><th>meaning and unit</th></tr></thead><tbody>${paramRows}</tbody></table>` : ''}
${op.errors.length ? `<p>Errors (RFC 9457 problem details): ${op.errors.join(', ')}</p>` : ''}
${examples ? `<ul>${examples}</ul>` : ''}</section>`
    })
    .join('\n')
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>dryhours API</title><style>
body{font:16px/1.5 system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;color:#1b1b1b}
code{font:14px ui-monospace,monospace;background:#f1efe8;padding:0 .2em}
h2{border-top:2px solid #2b4c7e;padding-top:.6rem;font-size:1.15rem}.m{color:#fff;background:#2b4c7e;padding:0 .4em;border-radius:3px;font-size:.9rem}
table{border-collapse:collapse;margin:.5rem 0}td,th{border-bottom:1px solid #ccc;padding:.2rem .6rem;text-align:left;vertical-align:top}
</style></head><body><h1>dryhours API</h1>
<p>Every field states its unit; SI throughout. Errors are <code>application/problem+json</code> (RFC 9457). The machine-readable description is at <a href="/openapi.json">/openapi.json</a>.</p>
${sections}
${limitsAndProblems(config)}</body></html>`
}

/** GET /docs: a readable page of the API, generated from the same operations as /openapi.json. */
export const docsRouter = (config: ApiConfig) => new Hono().get('/', (c) => c.html(docsPage(config)))
