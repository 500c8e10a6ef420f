/** Writes a minimal EPW (8 header lines + 35-field rows) for tests; fields per the EPW data dictionary. */

export interface EpwHour {
  year: number
  month: number
  day: number
  /** 1–24, labelling the end of the hour (local standard time). */
  hour: number
  dryBulbC: number
  dewPointC: number
  rhPct: number
  pressurePa: number
  ghiWh: number
  windMs: number
  skyTenths: number
  rainMm: number
}

export function epwText(
  site: { lat: number; lon: number; tz: number; elevation: number },
  hours: EpwHour[],
): string {
  const header = [
    `LOCATION,Invented Test Town,XX,Nowhere,test builder,000000,${site.lat},${site.lon},${site.tz},${site.elevation}`,
    'DESIGN CONDITIONS,0',
    'TYPICAL/EXTREME PERIODS,0',
    'GROUND TEMPERATURES,0',
    'HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0',
    'COMMENTS 1,built by test/weather/epw-builder.ts',
    'COMMENTS 2,invented values',
    'DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31',
  ]
  const rows = hours.map((h) =>
    [
      h.year,
      h.month,
      h.day,
      h.hour,
      60,
      '?9?9?9?9E0?9?9?9?9?9?9?9?9?9?9?9?9?9?9?9*9*9?9?9?9',
      h.dryBulbC,
      h.dewPointC,
      h.rhPct,
      h.pressurePa,
      9999,
      9999,
      300,
      h.ghiWh,
      0,
      0,
      999999,
      999999,
      999999,
      9999,
      180,
      h.windMs,
      h.skyTenths,
      h.skyTenths,
      9999,
      99999,
      9,
      999999999,
      999,
      0.999,
      999,
      99,
      999,
      h.rainMm,
      99,
    ].join(','),
  )
  return [...header, ...rows].join('\r\n') + '\r\n'
}
