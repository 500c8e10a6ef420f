/**
 * @module web/demo-files
 * Demo weather files for the page. The core reads no files and the demo climates (about 10 MB of text)
 * are too large to bundle into a Worker, so an entry point that can read them (the Node server) passes
 * a provider; without one the page offers upload only.
 */

export interface DemoFile {
  /** File name in climate-demo/ (also the form value). */
  file: string
  /** What the page shows, e.g. "Ardentine Ridge (dry upland), 2021–2024, CSV". */
  label: string
  /** Reader options the file needs (e.g. the IANA zone of a local-time file), as the demo catalogue says. */
  readOptions?: Record<string, unknown>
}

export interface DemoProvider {
  list(): readonly DemoFile[]
  /** The file's bytes, or null when it is not a demo file. */
  read(file: string): Promise<Uint8Array | null>
}

/** The parts of climate-demo/sites.json that the page uses. */
export interface DemoCatalogue {
  sites: {
    id: string
    name: string
    climateType: string
    latitudeDeg: number
    longitudeDeg: number
    elevationM: number
    timeZone: string
    utcOffsetHours: number
    files: { file: string; format: string; timeBasis: string }[]
  }[]
}

/**
 * The page's demo list from the demo catalogue, with the reader options each file needs: CSV files with
 * UTC time stamps are read as UTC (`utcOffsetHours` 0: the offset of the file's own time stamps) with the
 * site's coordinates and IANA zone (`siteTimeZone`, for local months, hours and start times); local-clock
 * CSV files get the IANA zone of their time stamps when their time basis names one; files whose header
 * states the site and clock (EPW, or an offset in the header) get nothing but the site name.
 */
export function demoFilesFromCatalogue(catalogue: DemoCatalogue): DemoFile[] {
  const out: DemoFile[] = []
  for (const s of catalogue.sites) {
    for (const f of s.files) {
      const readOptions: Record<string, unknown> = {}
      if (f.format === 'csv') {
        readOptions.siteName = s.name
        readOptions.latitudeDeg = s.latitudeDeg
        readOptions.longitudeDeg = s.longitudeDeg
        readOptions.elevationM = s.elevationM
        if (/^UTC\b/.test(f.timeBasis)) {
          readOptions.utcOffsetHours = 0
          readOptions.siteTimeZone = s.timeZone
        } else if (f.timeBasis.includes(s.timeZone)) readOptions.timeZone = s.timeZone
      }
      out.push({ file: f.file, label: `${s.name}, ${s.climateType}: ${f.file}`, readOptions })
    }
  }
  return out
}
