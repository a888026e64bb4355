/**
 * The bar model's finite-element convergence: βL of a uniform free–free bar's first four
 * bending modes against the roots of cos βL cosh βL = 1, for growing element counts,
 * with the error in % and the median solve time of five runs. Run: npx tsx scripts/bar-model-convergence.ts
 */
import { solveBarModes } from '../shared/barModel/solveBarModes'
import { freeFreeBetaL } from '../shared/bench/freeFreeBeam'

// Roots of cos βL cosh βL = 1 (free–free beam; Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1), by bisection.
const EXACT_BETA_L = [1, 2, 3, 4].map(freeFreeBetaL)
const bar = { lengthMm: 400, widthMm: 50, profile: [{ xMm: 0, thicknessMm: 20 }, { xMm: 400, thicknessMm: 20 }], densityKgM3: 1000, youngsModulusGPa: 10 }
const wave = Math.sqrt((bar.youngsModulusGPa * 1e9 * 0.02 ** 2) / (12 * bar.densityKgM3))

console.log('elements | βL₁ err %   | βL₂ err %   | βL₃ err %   | βL₄ err %   | solve ms')
for (const elements of [4, 8, 16, 24, 40, 60, 100]) {
  const times: number[] = []
  let modes = solveBarModes(bar, { elements })
  for (let run = 0; run < 5; run++) {
    const start = performance.now()
    modes = solveBarModes(bar, { elements })
    times.push(performance.now() - start)
  }
  const ms = times.sort((a, b) => a - b)[2]!
  const errors = Array.from(modes.frequenciesHz, (f, i) => {
    const betaL = 0.4 * Math.sqrt((2 * Math.PI * f) / wave)
    return (100 * (betaL / EXACT_BETA_L[i]! - 1)).toExponential(2).padStart(11)
  })
  console.log(`${String(elements).padStart(8)} | ${errors.join(' | ')} | ${ms.toFixed(1).padStart(7)}`)
}
