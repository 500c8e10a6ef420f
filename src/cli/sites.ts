/**
 * @module cli/sites
 * `--sites sites.csv` of `assess` and `compare`: one site per row (`name,file,lat,lon,elevation,tz,…`, any
 * weather option as a further column, analysis/compare-sites.ts), files relative to the sites file. Each
 * site's file is read with that site's options only; messages name the site and its file.
 */
import { dirname, isAbsolute, join } from 'node:path'
import { parseSitesCsv, type SiteSpec, SiteTableError } from '../analysis/compare-sites.ts'
import { WEATHER_OPTION_SPECS } from '../weather/option-spec.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import { type CliIo, UsageError } from './command.ts'
import { readSeriesWith } from './engine-options.ts'

export const SITES_HELP = `Sites with their own settings:
  --sites <sites.csv>   one site per row: name,file and any weather option as a further column
                        (lat, lon, elevation, tz, siteTz, utcOffset, map, labels, …: the API's parameter
                        names); files relative to the sites file; several map or labels values
                        separated by ';'. Weather flags are not taken with --sites: each site has its own.`

/** A site with its file resolved against the sites file's folder. */
export interface CliSite extends SiteSpec {
  /** The path to read. */
  path: string
}

/** Read and check the sites file `path` (through io); files are resolved relative to it. */
export async function readSitesFile(path: string, io: CliIo): Promise<CliSite[]> {
  const text = new TextDecoder().decode(await io.readFile(path))
  let sites: SiteSpec[]
  try {
    sites = parseSitesCsv(text, path)
  } catch (e) {
    if (e instanceof SiteTableError) throw new UsageError(e.message)
    throw e
  }
  const folder = dirname(path)
  return sites.map((s) => ({ ...s, path: isAbsolute(s.file) ? s.file : join(folder, s.file) }))
}

/** With --sites, the weather flags are refused: each site's settings are in its row. */
export function refuseWeatherFlags(values: Record<string, unknown>): void {
  const given = WEATHER_OPTION_SPECS.filter((s) => values[s.flag] !== undefined).map((s) => `--${s.flag}`)
  if (given.length > 0) {
    throw new UsageError(
      `${given.join(', ')} cannot be given with --sites: write ${given.length === 1 ? 'it' : 'them'} as a column of the sites file, per site`,
    )
  }
}

/** Read one site's weather file with its own options; messages name the site and its file. */
export async function readSite(site: CliSite, io: CliIo): Promise<WeatherReadResult> {
  const label = `site '${site.name}' (${site.where.split(' (')[0]}, file ${site.path})`
  let read: WeatherReadResult
  try {
    read = await readSeriesWith(site.path, site.weather, io, label)
  } catch (e) {
    // a file that cannot be opened: the site and the path
    if (e instanceof UsageError && !e.message.startsWith(label))
      throw new UsageError(`${label}: ${e.message}`)
    throw e
  }
  return read
}
