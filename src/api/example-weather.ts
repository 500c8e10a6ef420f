/**
 * @module api/example-weather
 * An invented weather file for the API's documented examples (run by test/api/openapi.test.ts): hourly
 * UTC rows from 1 July 2024 with a smooth day (dry bulb 14–34 °C, RH 25–65 %, sunshine from 06:00 to
 * 18:00 peaking at 900 W/m², a steady 2.5 m/s wind). Invented data, for demonstration only.
 */

/** The example as CSV text with a header line: `days` days of hourly rows. */
export function exampleWeatherCsv(days = 4): string {
  const rows = Array.from({ length: days * 24 }, (_, h) => {
    const hour = h % 24
    const day = Math.sin(((hour - 9) / 24) * 2 * Math.PI)
    const t = 24 + 10 * day
    const rh = 45 - 20 * day
    const ghi = hour >= 6 && hour <= 18 ? Math.round(900 * Math.sin(((hour - 6) / 12) * Math.PI)) : 0
    const stamp = new Date(Date.UTC(2024, 6, 1, h)).toISOString().slice(0, 16)
    return `${stamp}Z,${t.toFixed(1)},${rh.toFixed(0)},${ghi},2.5`
  })
  return ['time,temp_c,rh_pct,ghi_wm2,wind_ms', ...rows].join('\n')
}

/** Boundary of the multipart examples. */
export const EXAMPLE_BOUNDARY = 'dryhours-example-boundary'

/** A multipart/form-data body (RFC 7578) of text parts, file parts with a file name. */
export function multipartExample(parts: { name: string; value: string; fileName?: string }[]): string {
  const lines: string[] = []
  for (const p of parts) {
    lines.push(`--${EXAMPLE_BOUNDARY}`)
    lines.push(
      `Content-Disposition: form-data; name="${p.name}"${p.fileName ? `; filename="${p.fileName}"` : ''}`,
    )
    if (p.fileName) lines.push('Content-Type: text/csv')
    lines.push('', p.value)
  }
  lines.push(`--${EXAMPLE_BOUNDARY}--`, '')
  return lines.join('\r\n')
}
