/**
 * `npm run isotherms:fit`: fits the isotherm forms to the published grain tables (test/product/isotherm-tables.ts)
 * and prints the constants, the residuals per table and whether the catalogue adopted them.
 */
import { emcFitQuality } from '../../src/product/fit-isotherm.ts'
import { ISOTHERM_FITS, runFit, tablePoints } from './isotherm-tables.ts'

for (const c of ISOTHERM_FITS) {
  const f = runFit(c)
  const e = f.equation
  console.log(
    `${c.product}: ${e.model} a ${e.a.toPrecision(6)}, b ${e.b.toPrecision(6)}, c ${e.c.toPrecision(6)}; ` +
      `${f.n} points, RMSE ${f.rmseWbPct.toFixed(3)} pt wb, largest ${f.maxAbsWbPct.toFixed(3)} pt; ` +
      `${f.converged ? 'converged' : 'NOT converged'}; ${c.adopted ? 'adopted' : 'not adopted'}`,
  )
  for (const t of [...c.tables, ...c.validation]) {
    const q = emcFitQuality(e, tablePoints(t))
    const role = c.tables.includes(t) ? 'fitted' : 'check'
    console.log(`  ${role} ${t}: RMSE ${q.rmseWbPct.toFixed(3)}, largest ${q.maxAbsWbPct.toFixed(3)} pt wb`)
  }
}
