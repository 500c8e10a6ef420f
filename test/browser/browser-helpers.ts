/**
 * Shared pieces of the browser tests: the printed page count of a PDF that Chromium made, the sideways
 * overflow of a page, and a check that every form control has a name a screen reader can read.
 */
import type { Page } from 'playwright-core'

/**
 * Pages of a PDF written by Chromium's `page.pdf`: its page objects (`/Type /Page`, not `/Pages`). The PDF
 * is uncompressed at that level (page objects are plain dictionaries), so counting them is exact.
 */
export function pdfPageCount(pdf: Buffer): number {
  const text = pdf.toString('latin1')
  let n = 0
  let at = text.indexOf('/Type')
  while (at >= 0) {
    let k = at + 5
    while (text[k] === ' ' || text[k] === '\n' || text[k] === '\r') k++
    if (text.startsWith('/Page', k) && text[k + 5] !== 's') n++
    at = text.indexOf('/Type', k)
  }
  return n
}

/** How far the page reaches past the viewport's width [CSS px] (0 when nothing scrolls sideways). */
export async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(
    () => Math.max(document.documentElement.scrollWidth, document.body.scrollWidth) - window.innerWidth,
  )
}

/** Visible form controls without an accessible name (no label, no aria-label or aria-labelledby). */
export async function unlabelledControls(page: Page): Promise<string[]> {
  return page.$$eval('input, select, textarea, button', (els) =>
    els
      .filter((e) => {
        const el = e as HTMLInputElement
        if (el.type === 'hidden' || el.closest('[hidden]')) return false
        const labelled =
          (el.labels && el.labels.length > 0) ||
          el.getAttribute('aria-label') ||
          el.getAttribute('aria-labelledby') ||
          (el.tagName === 'BUTTON' && (el.textContent ?? '').trim() !== '')
        return !labelled
      })
      .map((e) => `${e.tagName.toLowerCase()}#${e.id}[name=${(e as HTMLInputElement).name}]`),
  )
}

/** The deepest elements that reach past the viewport's right edge (for the message of a failed check). */
export async function overflowingElements(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const w = window.innerWidth
    const out: string[] = []
    for (const el of document.querySelectorAll('body *')) {
      const r = el.getBoundingClientRect()
      if (r.right <= w + 0.5 || r.width === 0) continue
      if ([...el.children].some((c) => c.getBoundingClientRect().right > w + 0.5)) continue
      out.push(
        `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}.${String(el.getAttribute('class') ?? '').replace(/ /g, '.')} right=${Math.round(r.right)}`,
      )
    }
    return out.slice(0, 12)
  })
}
