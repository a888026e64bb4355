import { and, desc, eq } from 'drizzle-orm'
import type { Transaction } from '../client'
import { calibrations } from '../schema'
import { measureClockOffset } from '../../../shared/calibration/measureClockOffset'
import { synthStrike } from '../../../shared/synthesis/synthStrike'

/** The demo's two invented inputs: the bench interface (slowly drifting, current) and a field recorder (its calibration expired). */
export const DEMO_INPUTS = {
  bench: 'Bench 1 audio interface, input 1',
  field: 'Field recorder for site visits',
} as const

/** Days ago and the offset the input really had then (ppm): the bench interface ages by about −1.8 ppm a year, the recorder by +5. */
const HISTORY: { device: string, daysAgo: number, offsetPpm: number }[] = [
  { device: DEMO_INPUTS.bench, daysAgo: 196, offsetPpm: 42.2 },
  { device: DEMO_INPUTS.bench, daysAgo: 133, offsetPpm: 41.9 },
  { device: DEMO_INPUTS.bench, daysAgo: 77, offsetPpm: 41.6 },
  { device: DEMO_INPUTS.bench, daysAgo: 21, offsetPpm: 41.3 },
  { device: DEMO_INPUTS.field, daysAgo: 262, offsetPpm: -19.6 },
  { device: DEMO_INPUTS.field, daysAgo: 188, offsetPpm: -18.5 },
  { device: DEMO_INPUTS.field, daysAgo: 104, offsetPpm: -17.4 },
]
const SAMPLE_RATE = 48000
/** The workshop's reference: a 1 kHz generator with an oven crystal, stated ± 0.4 ppm (invented). */
const REFERENCE_HZ = 1000
const REFERENCE_UNCERTAINTY_PPM = 0.4
const REFERENCE_DESCRIPTION = 'Bench signal generator locked to the workshop\'s GPS-disciplined 10 MHz clock'

/**
 * Each input's calibrations over the past months, measured from synthetic reference tones
 * the way the route measures an uploaded one (measureClockOffset), so the drift chart and
 * the stored uncertainties are the engine's own readings.
 */
export async function seedDemoCalibrations(db: Transaction, workshopId: string, operatorId: string) {
  const now = Date.now()
  for (const [i, h] of HISTORY.entries()) {
    const tone = synthStrike([{ frequencyHz: REFERENCE_HZ * (1 + h.offsetPpm * 1e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: SAMPLE_RATE, durationS: 4, noiseDb: -45, seed: 71 + i })
    const offset = measureClockOffset(tone, SAMPLE_RATE, REFERENCE_HZ, { referenceUncertaintyPpm: REFERENCE_UNCERTAINTY_PPM })
    await db.insert(calibrations).values({
      workshopId, device: h.device, referenceHz: REFERENCE_HZ, referenceUncertaintyPpm: REFERENCE_UNCERTAINTY_PPM, referenceDescription: REFERENCE_DESCRIPTION,
      measuredHz: offset.measuredHz, offsetPpm: offset.offsetPpm, uncertaintyPpm: offset.uncertaintyPpm, operatorId,
      createdAt: new Date(now - h.daysAgo * 86_400_000),
    })
  }
}

/** The bench interface's current calibration, which the demo's strikes were recorded under. */
export async function benchInputCalibration(db: Transaction, workshopId: string): Promise<{ id: string, offsetPpm: number }> {
  const [row] = await db.select({ id: calibrations.id, offsetPpm: calibrations.offsetPpm }).from(calibrations)
    .where(and(eq(calibrations.workshopId, workshopId), eq(calibrations.device, DEMO_INPUTS.bench))).orderBy(desc(calibrations.createdAt)).limit(1)
  if (!row) throw new Error('The demo bench input has no calibration.')
  return row
}
