/**
 * Load-test targets that post a one-year demo file: /v1/inspect and a coarse /v1/assess (a 30-day season,
 * a start every 5 days), so each request stays in the tens of milliseconds; `npm run load` drives the assess.
 */
import { readFileSync } from 'node:fs'

export interface LoadTarget {
  name: string
  method: 'GET' | 'POST'
  path: string
  body?: string
  contentType?: string
}

export async function loadTargets(): Promise<LoadTarget[]> {
  // One year of the invented dry-upland weather (8,760 hours), cut from the multi-year demo file.
  const lines = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv', 'utf8').split('\n')
  const header = lines.findIndex((l) => /^time/i.test(l))
  const oneYear = [...lines.slice(0, header + 1), ...lines.slice(header + 1, header + 1 + 8760)].join('\n')
  return [
    {
      name: 'POST /v1/inspect',
      method: 'POST',
      path: '/v1/inspect?lat=38.3&lon=-2.6&elevation=1050',
      body: oneYear,
      contentType: 'text/csv',
    },
    {
      name: 'POST /v1/assess',
      method: 'POST',
      path: '/v1/assess?product=apricot-halves&method=open-air&start=07-01&end=07-30&stepDays=5&lat=38.3&lon=-2.6&elevation=1050&utcOffset=1',
      body: oneYear,
      contentType: 'text/csv',
    },
  ]
}
