/**
 * @module climate-demo/typical-year
 * Choosing the months of a typical year from several generated years: for each calendar month, the year
 * whose monthly mean dry bulb and mean dew point are closest (sum of absolute differences [K]) to the
 * all-years mean of that month. A much simplified form of the idea behind typical meteorological years
 * (Hall et al. 1978, Sandia SAND78-1096, which weights many more statistics; from memory).
 */
import type { DemoSite } from './sites.ts'
import type { DemoHours } from './weather-model.ts'

const HOUR_MS = 3_600_000

/** Month means in local standard time: means[yearIndex][month] of dry bulb and dew point. */
function monthMeans(site: DemoSite, hours: DemoHours, years: readonly number[]) {
  return years.map((y) =>
    Array.from({ length: 12 }, (_, m) => {
      const from = Date.UTC(y, m, 1) - site.utcOffsetHours * HOUR_MS
      const to = Date.UTC(y, m + 1, 1) - site.utcOffsetHours * HOUR_MS
      let t = 0
      let d = 0
      let n = 0
      for (let ms = from; ms < to; ms += HOUR_MS) {
        const k = (ms - hours.firstStartUtcMs) / HOUR_MS
        if (k < 0 || k >= hours.hours)
          throw new RangeError(`month ${m + 1}/${y} is outside the generated hours`)
        t += hours.dryBulbC[k]
        d += hours.dewPointC[k]
        n++
      }
      return { dryBulbC: t / n, dewPointC: d / n }
    }),
  )
}

/** The source year of each month (January first) chosen from `years`. */
export function chooseTypicalMonths(site: DemoSite, hours: DemoHours, years: readonly number[]): number[] {
  if (years.length < 2)
    throw new RangeError(`a typical year needs at least 2 candidate years, got ${years.length}`)
  const means = monthMeans(site, hours, years)
  const choice: number[] = []
  for (let m = 0; m < 12; m++) {
    let meanT = 0
    let meanD = 0
    for (const row of means) {
      meanT += row[m].dryBulbC / years.length
      meanD += row[m].dewPointC / years.length
    }
    let best = 0
    let bestScore = Number.POSITIVE_INFINITY
    means.forEach((row, i) => {
      const score = Math.abs(row[m].dryBulbC - meanT) + Math.abs(row[m].dewPointC - meanD)
      if (score < bestScore) {
        bestScore = score
        best = i
      }
    })
    choice.push(years[best])
  }
  return choice
}
