/**
 * @module product/moisture-basis
 * Wet basis (wb: kg water per kg wet product) and dry basis (db: kg water per kg dry matter).
 * Every function says which basis it takes and returns; percentages end in `Pct`, fractions in `Db`/`Wb`.
 * Definitions: M_db = M_wb / (1 − M_wb); M_wb = M_db / (1 + M_db) (any drying text, e.g. Brooker,
 * Bakker-Arkema & Hall 1992, *Drying and Storage of Grains and Oilseeds*, ch. 1).
 */

function checkWbPct(name: string, wbPct: number): void {
  if (!(wbPct >= 0 && wbPct < 100)) {
    throw new RangeError(`${name} (wet basis) must be at least 0 % and below 100 %, got ${wbPct}`)
  }
}

function checkDb(name: string, db: number): void {
  if (!(db >= 0 && Number.isFinite(db))) {
    throw new RangeError(`${name} (dry basis) must be a finite number ≥ 0 kg/kg, got ${db}`)
  }
}

/** Dry-basis moisture [kg water/kg dry matter] from wet-basis moisture [%]. Example: 20 % wb → 0.25. */
export function moistureDbFromWbPct(moistureWbPct: number): number {
  checkWbPct('moisture', moistureWbPct)
  const wb = moistureWbPct / 100
  return wb / (1 - wb)
}

/** Wet-basis moisture [%] from dry-basis moisture [kg/kg]. Example: 0.25 → 20 % wb. */
export function moistureWbPctFromDb(moistureDb: number): number {
  checkDb('moisture', moistureDb)
  return (100 * moistureDb) / (1 + moistureDb)
}

/** Dry matter [kg] in `freshMassKg` of product at `moistureWbPct` (wet basis). */
export function dryMatterKg(freshMassKg: number, moistureWbPct: number): number {
  if (!(freshMassKg >= 0 && Number.isFinite(freshMassKg))) {
    throw new RangeError(`mass must be a finite number ≥ 0 kg, got ${freshMassKg}`)
  }
  checkWbPct('moisture', moistureWbPct)
  return freshMassKg * (1 - moistureWbPct / 100)
}

/** Mass [kg] of product holding `dryMatter` kg of dry matter at `moistureWbPct` (wet basis). */
export function massAtMoistureKg(dryMatter: number, moistureWbPct: number): number {
  checkWbPct('moisture', moistureWbPct)
  return dryMatter / (1 - moistureWbPct / 100)
}

/**
 * Water [kg] to remove from `freshMassKg` at `initialWbPct` to reach `targetWbPct` (both wet basis):
 * m·(w0 − w1)/(1 − w1). Example: 1000 kg from 25 % to 15 % → 117.6 kg.
 */
export function waterToRemoveKg(freshMassKg: number, initialWbPct: number, targetWbPct: number): number {
  const dm = dryMatterKg(freshMassKg, initialWbPct)
  checkWbPct('target moisture', targetWbPct)
  if (targetWbPct > initialWbPct) {
    throw new RangeError(
      `target moisture ${targetWbPct} % wb is above the initial moisture ${initialWbPct} % wb: nothing to remove`,
    )
  }
  return freshMassKg - massAtMoistureKg(dm, targetWbPct)
}

/** Moisture ratio MR = (M − Me)/(M0 − Me), all dry basis [kg/kg]. */
export function moistureRatio(moistureDb: number, initialDb: number, equilibriumDb: number): number {
  if (!(initialDb > equilibriumDb)) {
    throw new RangeError(
      `initial moisture ${initialDb} kg/kg db must be above the equilibrium moisture ${equilibriumDb} kg/kg db`,
    )
  }
  return (moistureDb - equilibriumDb) / (initialDb - equilibriumDb)
}
