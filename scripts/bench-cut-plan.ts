/**
 * Cut planner timing: median of five plans for a uniform bar, an undercut bar and the
 * largest request the API takes (64 profile stations, 4 partials), one thread, in this
 * process. Run: npx tsx scripts/bench-cut-plan.ts
 */
import { planCutsForInput } from '../shared/barModel/planCutsForInput'
import { CUT_PLAN_LIMITS, type CutPlanInput } from '../shared/schemas/cutPlan'

const material = { densityKgM3: 1000, youngsModulusGPa: 20 }
const partials = [{ ratio: 1, cents: 12, toleranceCents: 3 }, { ratio: 4, cents: -8, toleranceCents: 5 }, { ratio: 10, cents: 6, toleranceCents: 10 }]
const arch = (stations: number) => Array.from({ length: stations }, (_, i) => {
  const u = i / (stations - 1)
  return { xMm: 380 * u, thicknessMm: 22 - 12 * Math.max(0, 1 - ((u - 0.5) / 0.3) ** 2) }
})
const cases: [string, CutPlanInput][] = [
  ['uniform bar, 3 partials', { lengthMm: 380, widthMm: 55, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }], ...material, partials }],
  ['undercut bar (17 stations), 3 partials', { lengthMm: 380, widthMm: 55, profile: arch(17), ...material, partials }],
  [`largest request (${CUT_PLAN_LIMITS.profileStations} stations, ${CUT_PLAN_LIMITS.partials} partials)`, { lengthMm: 380, widthMm: 55, profile: arch(CUT_PLAN_LIMITS.profileStations), ...material, partials: [...partials, { ratio: 18, cents: -5, toleranceCents: 15 }] }],
]
for (const [name, input] of cases) {
  planCutsForInput(input)
  const times: number[] = []
  let plan = planCutsForInput(input)
  for (let run = 0; run < 5; run++) {
    const start = performance.now()
    plan = planCutsForInput(input)
    times.push(performance.now() - start)
  }
  const cuts = plan.stations.filter(s => s.depthMm > 0).map(s => `${s.xMm.toFixed(0)}:${s.depthMm.toFixed(2)}`).join(' ')
  const after = plan.predicted.map(p => p.centsAfter.toFixed(1)).join(', ')
  console.log(`${name}: median ${times.sort((a, b) => a - b)[2]!.toFixed(0)} ms; feasible ${plan.feasible}; cuts (mm: depth) ${cuts}; cents after ${after}`)
}
