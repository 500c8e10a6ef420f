/**
 * @module web/page-html
 * The page: one form per job, each on its own address so it works as a plain multipart post without
 * JavaScript (POST /report answers with the page and the result above the form) and /app.js enhances it
 * (upload progress, the result inline, downloads):
 * - `/` assess a site (one method for the full report, several side by side), with "check the file first";
 * - `/compare` sites side by side, each site with its own file, location and clock;
 * - `/inspect` how a weather file is understood; `/fit` drying speed from weighings; `/energy` energy charts.
 * Questions about the file (time zone, site, column mapping) sit in a section that opens when the reader
 * needs them; the time zones are a searchable list of IANA names. Every value echoed back is escaped.
 */

import { escapeHtml } from '../report/escape.ts'
import type { DemoFile } from './demo-files.ts'
import { MAX_SITES } from './form-input.ts'
import { timeZoneList } from './page-fields.ts'
import { assessForm, compareForm, energyForm, fitForm, inspectForm } from './page-forms.ts'

export { FIELD_LABELS, fieldLabel, timeZoneNames } from './page-fields.ts'

export type PageTask = 'assess' | 'compare' | 'inspect' | 'fit' | 'energy'

export interface TaskInfo {
  path: string
  /** The link text in the navigation. */
  nav: string
  /** The page's heading. */
  title: string
  /** Who it is for and what it answers, in one sentence. */
  intro: string
}

export const PAGE_TASKS: Record<PageTask, TaskInfo> = {
  assess: {
    path: '/',
    nav: 'Assess a site',
    title: 'Can this weather dry this crop?',
    intro:
      'One weather file and one product: choose one drying method for the full report, or several to see them side by side. The report starts with a two-page summary to print and hand out.',
  },
  compare: {
    path: '/compare',
    nav: 'Compare sites',
    title: 'Which site dries best?',
    intro:
      'One weather file per candidate site, each with its own location and clock, assessed for the same product, method and season and ranked by a stated rule.',
  },
  inspect: {
    path: '/inspect',
    nav: 'Check a weather file',
    title: 'How does dryhours read this weather file?',
    intro:
      'Before you assess: which columns and units were taken, the clock of the time stamps, each variable at a glance, months with little data, and every problem with its line.',
  },
  fit: {
    path: '/fit',
    nav: 'Fit from weighings',
    title: 'How fast does your product dry?',
    intro:
      'Weigh a tray as it dries and upload the weighings: dryhours fits the drying curve (Lewis, Page, diffusion) and says which fits best.',
  },
  energy: {
    path: '/energy',
    nav: 'Energy charts',
    title: 'Is the dryer using more energy than it should?',
    intro:
      'A log of batches (fuel used, water removed) on control charts that allow for the weather, with the batch where a change most likely began.',
  },
}

export const TASK_IDS = Object.keys(PAGE_TASKS) as PageTask[]

export interface PageState {
  /** Which job the page shows (default: assess). */
  task?: PageTask
  demo?: readonly DemoFile[]
  /** The server's limit of files per comparison (default {@link MAX_SITES}). */
  maxSites?: number
  /** Form values to show again (after an error or with a result). */
  values?: Record<string, string>
  /** Values given several times (the methods chosen). */
  multi?: Record<string, string[]>
  /** A message for the user, the field it concerns, and whether the file questions should be open. */
  error?: { message: string; askFileQuestions: boolean; field?: string }
  /** The result article to show above the form (no-JavaScript result). */
  result?: string
}

export function renderPage(state: PageState = {}): string {
  const task = state.task ?? 'assess'
  const info = PAGE_TASKS[task]
  const v = state.values ?? {}
  const formHtml =
    task === 'compare'
      ? compareForm(state, v)
      : task === 'inspect'
        ? inspectForm(state, v)
        : task === 'fit'
          ? fitForm(state, v)
          : task === 'energy'
            ? energyForm(state, v)
            : assessForm(state, v)
  // the field a message is about: marked for screen readers (and outlined) where the form has it
  const bad = state.error?.field
  const form =
    bad && /^[A-Za-z0-9.]+$/.test(bad)
      ? formHtml.replace(
          new RegExp(`( name="${bad.replace('.', '\\.')}")(?![^>]*aria-invalid)`),
          '$1 aria-invalid="true"',
        )
      : formHtml
  const nav = TASK_IDS.map(
    (t) =>
      `<li><a href="${PAGE_TASKS[t].path}"${t === task ? ' aria-current="page"' : ''}>${escapeHtml(PAGE_TASKS[t].nav)}</a></li>`,
  ).join('')
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<title>dryhours – ${escapeHtml(info.nav.toLowerCase())}</title>
<link rel="icon" href="data:,">
<link rel="stylesheet" href="/app.css">
<script src="/app.js" defer></script>
</head>
<body data-task="${task}">
<a class="skip" href="#main">Skip to the form</a>
<header class="masthead"><div class="wrap"><p class="brand">dryhours</p><p class="tagline">Can this site’s weather dry this crop, when, how fast, and with how much heat?</p>
<nav aria-label="What to do"><ul>${nav}<li><a href="/docs">API</a></li></ul></nav></div></header>
<main id="main" class="wrap" tabindex="-1">
<h1 id="page-title" class="page-title">${escapeHtml(info.title)}</h1>
<p class="intro">${escapeHtml(info.intro)}</p>
${state.result ? `<div id="result-first" class="result">${state.result}<p class="again no-print"><a href="#${task === 'assess' ? 'assess' : task}-form">Change the inputs and send again ↓</a></p></div>` : ''}
${form}
<div id="downloads" class="downloads" hidden></div>
<div id="result" class="result" tabindex="-1" aria-label="Result"></div>
${timeZoneList()}
</main>
<footer class="wrap page-foot">dryhours: open methods, named sources. Results are estimates from the weather file; see the cautions in each report.</footer>
</body>
</html>
`
}
