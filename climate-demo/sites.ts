/**
 * @module climate-demo/sites
 * The invented sites of the demo scenario: the Verrowmark drying co-operative, four member sites in
 * made-up regions. Every name here is invented; the coordinates only set sun geometry and clock. All
 * monthly tables are invented values shaped to look like the named climate type (they are not taken
 * from any station), January first.
 */

/** Twelve monthly values, January first. */
export type MonthlyTable = readonly [
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
]

export interface DemoSite {
  /** Short id used in file names and random-stream names. */
  id: string
  /** Invented station name. */
  name: string
  /** Invented region. */
  region: string
  climateType: string
  /** What the site is meant to show in the demo. */
  shows: string
  latitudeDeg: number
  longitudeDeg: number
  elevationM: number
  /** IANA zone of the site's local clock (a real zone; the place is invented). */
  timeZone: string
  /** Local standard time offset from UTC [h] (used by EPW and local-standard-time files). */
  utcOffsetHours: number
  /** Monthly mean dry bulb [°C]. */
  dryBulbMeanC: MonthlyTable
  /** Monthly mean diurnal range (daily max − min) [K] on a day of average cloudiness. */
  diurnalRangeK: MonthlyTable
  /** Monthly mean dew point [°C]. */
  dewPointMeanC: MonthlyTable
  /** Daily Markov chain: probability that a day is wet after a dry day. */
  wetAfterDryProb: MonthlyTable
  /** Daily Markov chain: probability that a day is wet after a wet day. */
  wetAfterWetProb: MonthlyTable
  /** Typical cloud fraction (0–1) on dry days. */
  cloudFractionDry: MonthlyTable
  /** Mean rain in a rainy hour [mm] (exponentially distributed). */
  rainPerWetHourMm: MonthlyTable
  /** Weibull scale of the 10 m wind [m/s]. */
  windScaleMs: MonthlyTable
  /** Weibull shape of the 10 m wind [-]. */
  windShape: number
  /** Relative amplitude of the diurnal wind cycle (peak mid-afternoon) [-]. */
  windDiurnalAmplitude: number
  /** Daily temperature anomaly: AR(1) lag-one correlation and standard deviation [K]. */
  dryBulbAnomalyPhi: number
  dryBulbAnomalySdK: number
  /** Daily dew-point anomaly: AR(1) correlation and standard deviation [K]. */
  dewPointAnomalyPhi: number
  dewPointAnomalySdK: number
  /** Daily station-pressure anomaly standard deviation [kPa] (synoptic weather). */
  pressureAnomalySdKpa: number
  /** Semi-diurnal pressure tide amplitude [kPa]. */
  pressureTideKpa: number
  /** Mean length of a rain event [h]. */
  rainEventMeanHours: number
  /** Solar hour around which rain tends to start, or null for any hour (frontal rain). */
  rainStartSolarHour: number | null
  /** Cooling of the air during rain [K], moistening of a wet day's dew point [K]. */
  rainCoolingK: number
  wetDayDewPointRiseK: number
}

/** Dry upland: hot dry summers, cold winters, the raisin and apricot case. */
export const ARDENTINE_UPLAND: DemoSite = {
  id: 'ardentine-upland',
  name: 'Ardentine Ridge',
  region: 'Ardentine Upland, Verrowmark (invented)',
  climateType: 'dry upland, hot dry summers',
  shows:
    'sun drying of raisins and apricots works from late June to mid September; winters too cold and damp',
  latitudeDeg: 38.3,
  longitudeDeg: -2.6,
  elevationM: 1050,
  timeZone: 'Europe/Madrid',
  utcOffsetHours: 1,
  dryBulbMeanC: [4.5, 6, 9, 11.5, 15.5, 21.2, 25.5, 25, 20.2, 14, 8.5, 5],
  diurnalRangeK: [10, 11.5, 13, 14, 15, 17, 18, 17.5, 15.5, 13, 11, 10],
  dewPointMeanC: [-0.5, 0, 1.5, 3.5, 6.5, 8.5, 9, 10, 9, 7, 3.5, 1],
  wetAfterDryProb: [0.18, 0.17, 0.17, 0.2, 0.17, 0.09, 0.04, 0.06, 0.12, 0.18, 0.2, 0.18],
  wetAfterWetProb: [0.5, 0.5, 0.5, 0.5, 0.45, 0.35, 0.25, 0.3, 0.4, 0.5, 0.5, 0.5],
  cloudFractionDry: [0.35, 0.33, 0.32, 0.32, 0.28, 0.15, 0.08, 0.1, 0.2, 0.3, 0.35, 0.38],
  rainPerWetHourMm: [1, 1, 1, 1.2, 1.5, 2, 3, 2.5, 2, 1.5, 1.2, 1],
  windScaleMs: [3.6, 3.8, 4, 4, 3.7, 3.5, 3.5, 3.3, 3.2, 3.3, 3.5, 3.6],
  windShape: 1.8,
  windDiurnalAmplitude: 0.35,
  dryBulbAnomalyPhi: 0.75,
  dryBulbAnomalySdK: 2.2,
  dewPointAnomalyPhi: 0.7,
  dewPointAnomalySdK: 2.5,
  pressureAnomalySdKpa: 0.45,
  pressureTideKpa: 0.06,
  rainEventMeanHours: 3,
  rainStartSolarHour: null,
  rainCoolingK: 2,
  wetDayDewPointRiseK: 2.5,
}

/** Humid lake valley: continental, muggy summers, foggy nights, snowy winters. */
export const QUILLOW_VALLEY: DemoSite = {
  id: 'quillow-valley',
  name: 'Quillow Landing',
  region: 'Lake Quillow valley, Verrowmark (invented)',
  climateType: 'humid lake valley, continental',
  shows: 'open-air drying rarely reaches safe moisture; natural-air and heated grain drying, fuel per batch',
  latitudeDeg: 43.6,
  longitudeDeg: -89.4,
  elevationM: 262,
  timeZone: 'America/Chicago',
  utcOffsetHours: -6,
  dryBulbMeanC: [-6.5, -4.5, 1, 8, 14.5, 19.5, 22, 21, 16.5, 10, 2.5, -4],
  diurnalRangeK: [8, 8.5, 9, 10.5, 11, 11, 10.5, 10, 10.5, 10, 8, 7.5],
  dewPointMeanC: [-9.5, -8, -3.5, 2.5, 9, 14.5, 17.5, 17, 12.5, 6, -0.5, -6.5],
  wetAfterDryProb: [0.25, 0.23, 0.27, 0.3, 0.3, 0.3, 0.27, 0.27, 0.27, 0.25, 0.27, 0.27],
  wetAfterWetProb: [0.5, 0.5, 0.5, 0.52, 0.52, 0.5, 0.48, 0.48, 0.5, 0.5, 0.52, 0.52],
  cloudFractionDry: [0.6, 0.55, 0.55, 0.5, 0.45, 0.4, 0.35, 0.35, 0.4, 0.5, 0.62, 0.65],
  rainPerWetHourMm: [0.8, 0.8, 1, 1.3, 1.8, 2.5, 2.8, 2.6, 2.2, 1.5, 1, 0.8],
  windScaleMs: [3.8, 3.8, 4, 4.2, 3.8, 3.3, 3, 2.9, 3.2, 3.6, 3.9, 3.8],
  windShape: 1.7,
  windDiurnalAmplitude: 0.45,
  dryBulbAnomalyPhi: 0.75,
  dryBulbAnomalySdK: 3.5,
  dewPointAnomalyPhi: 0.72,
  dewPointAnomalySdK: 3,
  pressureAnomalySdKpa: 0.8,
  pressureTideKpa: 0.05,
  rainEventMeanHours: 4,
  rainStartSolarHour: null,
  rainCoolingK: 1.5,
  wetDayDewPointRiseK: 1,
}

/** Cool maritime coast: mild, windy, cloudy, wet all year. */
export const GULLHAVEN_COAST: DemoSite = {
  id: 'gullhaven-coast',
  name: 'Gullhaven Point',
  region: 'Brindle Isles, Verrowmark (invented)',
  climateType: 'cool maritime coast',
  shows: 'wind helps but humidity and rain stop open-air drying of fish; sheltered and heated drying needed',
  latitudeDeg: 57.3,
  longitudeDeg: -7.2,
  elevationM: 12,
  timeZone: 'Europe/London',
  utcOffsetHours: 0,
  dryBulbMeanC: [5.5, 5.2, 6, 7.6, 10.2, 13.5, 15.3, 15.5, 13.6, 10.7, 8, 6.3],
  diurnalRangeK: [4, 4.2, 5, 6, 6.8, 7.3, 7.3, 7, 6, 5, 4.3, 4],
  dewPointMeanC: [2.8, 2.5, 3, 4, 6.6, 10, 12, 12.2, 10.5, 7.9, 5, 3.5],
  wetAfterDryProb: [0.55, 0.5, 0.5, 0.42, 0.4, 0.4, 0.42, 0.45, 0.5, 0.55, 0.58, 0.58],
  wetAfterWetProb: [0.78, 0.75, 0.75, 0.7, 0.68, 0.68, 0.7, 0.72, 0.75, 0.78, 0.8, 0.8],
  cloudFractionDry: [0.7, 0.68, 0.65, 0.6, 0.58, 0.6, 0.62, 0.62, 0.64, 0.68, 0.7, 0.72],
  rainPerWetHourMm: [1, 0.9, 0.9, 0.8, 0.8, 0.8, 0.9, 1, 1, 1.1, 1.1, 1.1],
  windScaleMs: [9, 8.8, 8.5, 7.5, 6.8, 6.5, 6.3, 6.5, 7.2, 8, 8.5, 9],
  windShape: 2.1,
  windDiurnalAmplitude: 0.12,
  dryBulbAnomalyPhi: 0.8,
  dryBulbAnomalySdK: 1.3,
  dewPointAnomalyPhi: 0.75,
  dewPointAnomalySdK: 1.5,
  pressureAnomalySdKpa: 1.2,
  pressureTideKpa: 0.03,
  rainEventMeanHours: 5,
  rainStartSolarHour: null,
  rainCoolingK: 1,
  wetDayDewPointRiseK: 0.5,
}

/** Tropical wet-and-dry (savanna-like) lowland: a dry season from November to April, monsoon rains after. */
export const TAMAREL_LOWLAND: DemoSite = {
  id: 'tamarel-lowland',
  name: 'Tamarel Estate',
  region: 'Tamarel lowlands, Verrowmark (invented)',
  climateType: 'tropical wet and dry seasons',
  shows: 'coffee and cocoa sun drying is easy in the dry season and stalls in the wet season (mould risk)',
  latitudeDeg: 11.9,
  longitudeDeg: 104.6,
  elevationM: 95,
  timeZone: 'Asia/Bangkok',
  utcOffsetHours: 7,
  dryBulbMeanC: [26.5, 27.4, 28.7, 29.5, 29, 28.3, 27.8, 27.7, 27.3, 27, 26.7, 26.3],
  diurnalRangeK: [9.5, 9.8, 9.6, 9.2, 8.3, 7.5, 7, 7, 7, 7.5, 8.6, 9.3],
  dewPointMeanC: [20, 20.8, 22, 23.5, 24.5, 24.6, 24.5, 24.5, 24.5, 24.2, 22.5, 20.5],
  wetAfterDryProb: [0.03, 0.04, 0.08, 0.2, 0.45, 0.55, 0.55, 0.6, 0.6, 0.5, 0.25, 0.07],
  wetAfterWetProb: [0.2, 0.25, 0.3, 0.4, 0.6, 0.7, 0.72, 0.75, 0.75, 0.7, 0.5, 0.25],
  cloudFractionDry: [0.15, 0.15, 0.2, 0.3, 0.45, 0.55, 0.6, 0.6, 0.55, 0.5, 0.35, 0.2],
  rainPerWetHourMm: [3, 3, 4, 5, 6, 6, 5.5, 5.5, 6, 6, 5, 3],
  windScaleMs: [3, 3.2, 3.2, 2.8, 2.6, 3.2, 3.4, 3.4, 2.8, 2.4, 2.6, 2.9],
  windShape: 1.8,
  windDiurnalAmplitude: 0.4,
  dryBulbAnomalyPhi: 0.7,
  dryBulbAnomalySdK: 0.7,
  dewPointAnomalyPhi: 0.7,
  dewPointAnomalySdK: 1,
  pressureAnomalySdKpa: 0.25,
  pressureTideKpa: 0.12,
  rainEventMeanHours: 2.5,
  rainStartSolarHour: 15,
  rainCoolingK: 3,
  wetDayDewPointRiseK: 0.5,
}

export const DEMO_SITES: readonly DemoSite[] = [
  ARDENTINE_UPLAND,
  QUILLOW_VALLEY,
  GULLHAVEN_COAST,
  TAMAREL_LOWLAND,
]
