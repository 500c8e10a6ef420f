/**
 * @module report/sections/cautions
 * Cautions (food safety, mycotoxins, combustion heaters, licensed trades, local codes), the model's
 * limits, and the assessment's own assumptions. Safety text follows the project conventions: say it
 * plainly and defer to local codes and licensed practice.
 */
import type { Assessment } from '../assessment-view.ts'
import { escapeHtml } from '../escape.ts'
import type { SectionContext } from './context.ts'

export const GENERAL_CAUTIONS: readonly string[] = [
  'Food safety: dried food is safe to store only at a low enough water activity; check the dried product (a water-activity meter or an accredited laboratory) rather than relying on a drying time from this report.',
  'Mycotoxins: slow or stalled drying of grain, nuts, figs, coffee and cocoa lets moulds grow and produce toxins such as aflatoxin; when batches take long or rewet, dry faster (heat, thinner layers) or sort and test.',
  'Combustion heaters: direct-fired heaters put carbon monoxide and other combustion products into the drying air; prefer indirect heaters for food, ventilate, and use a carbon-monoxide alarm wherever people work.',
  'Gas and electrical work on dryers, heaters and fans must be done by licensed trades, following local codes.',
  'Fire: dryers, dust and dry product burn; keep heaters clear of product and dust, and follow local fire codes.',
]

export const MODEL_LIMITS: readonly string[] = [
  'The weather file is taken as the climate: a few years cannot show the rare bad year, and a typical-year file shows no spread at all.',
  'Usable hours and batch times come from isotherm and drying-rate models fitted to other lots of the product, some of whose figures were recalled rather than read in a publication (listed at the top as recalled figures); varieties, pretreatments (dipping, blanching, cutting) and loading change them.',
  'The air at the product is modelled from the weather station; shelter, ground, nearby water and the dryer itself change it.',
  'Rain, dew and night handling follow the method options (covered or not); real handling delays are not modelled.',
  'Supplemental heat assumes the heater raises the intake air at constant humidity ratio with the stated efficiency; losses from the dryer shell are not included.',
]

const list = (xs: readonly string[]) => `<ul>${xs.map((x) => `<li>${escapeHtml(x)}</li>`).join('')}</ul>`

/** The cautions: the product's own, then the general ones (food safety, mycotoxins, heaters, trades, fire). */
export function cautionsSection(a: Assessment, ctx: SectionContext): string {
  // a bin's own cautions (fans, grain entrapment, …) first
  return cautionsHtml([...(a.bin?.cautions ?? []), ...a.product.cautions], ctx.idPrefix)
}

/** Cautions for a list of product cautions (several products in a comparison: each once). */
export function cautionsHtml(productCautions: readonly string[], idPrefix = ''): string {
  const unique = [...new Set(productCautions)]
  return `<section class="report-section cautions" id="${idPrefix}sec-cautions" data-section="cautions"><h2>Cautions</h2>${list([...unique, ...GENERAL_CAUTIONS])}</section>`
}

/** The model's limits and the assessment's assumptions (as the engine records them, in SI units). */
export function limitsSection(a: Assessment, ctx: SectionContext): string {
  const si =
    ctx.units.system === 'us'
      ? '<p class="note">The assumptions are listed as the engine records them, in SI units.</p>'
      : ''
  return `<section class="report-section limits" id="${ctx.idPrefix}sec-limits" data-section="limits"><h2>Limits of the model and assumptions</h2>${list(MODEL_LIMITS)}${a.assumptions.length ? `<h3>Assumptions of this assessment</h3>${si}${assumptionsHtml(a)}` : ''}</section>`
}

/**
 * Warnings (in full) and notes on how the weather file was read (delimiter, header, the layout's conventions,
 * columns left out): notes are not problems, so they stay out of the answer.
 */
export function notesSection(
  warnings: readonly string[],
  notes: readonly string[],
  ctx: SectionContext,
): string {
  if (warnings.length === 0 && notes.length === 0) return ''
  return `<section class="report-section file-notes" id="${ctx.idPrefix}sec-notes" data-section="notes"><h2>Warnings and notes</h2>${warnings.length ? `<h3>Warnings</h3>${list(warnings)}` : '<p>No warnings.</p>'}${notes.length ? `<h3>How the weather file was read</h3>${list(notes)}` : ''}</section>`
}

function assumptionsHtml(a: Assessment): string {
  return `<dl class="assumptions">${a.assumptions
    .map(
      (x) =>
        `<div><dt>${escapeHtml(x.name)}</dt><dd>${escapeHtml(x.value)}${x.source ? ` <span class="source">(${escapeHtml(x.source)})</span>` : ''}</dd></div>`,
    )
    .join('')}</dl>`
}
