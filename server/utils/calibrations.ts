import { calibrations } from '../database/schema'
import type { Database } from '../database/client'
import type { ClockOffset } from '../../shared/calibration/measureClockOffset'
import { CalibrationFieldsSchema, type CalibrationAnswer } from '../../shared/schemas/calibrations'
import { throwPoolError } from './analysis'
import { useAnalysisPool } from './analysis-pool'
import { audit } from './audit'
import { validateInput } from './http-errors'

/** The pool's measurement of a reference tone; refusals become HTTP errors with the engine's sentence. */
async function measureTone(bytes: Uint8Array, referenceHz: number, referenceUncertaintyPpm: number | undefined): Promise<ClockOffset> {
  try {
    return await useAnalysisPool().calibrate({ bytes, referenceHz, referenceUncertaintyPpm })
  }
  catch (error) {
    throwPoolError(error)
  }
}

/**
 * Calibrates one input device from a recorded reference tone: the fields are checked
 * before any decoding, the tone is measured in the analysis pool, and the calibration is
 * stored with its audit row in one transaction (nothing is stored when the tone is refused).
 */
export async function createCalibration(db: Database, workshopId: string, actorId: string, bytes: Uint8Array, fields: Record<string, string>): Promise<CalibrationAnswer> {
  const input = validateInput(CalibrationFieldsSchema, fields)
  const offset = await measureTone(bytes, input.referenceHz, input.referenceUncertaintyPpm)
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(calibrations).values({
      workshopId,
      device: input.device,
      referenceHz: input.referenceHz,
      referenceUncertaintyPpm: input.referenceUncertaintyPpm ?? 0,
      referenceDescription: input.reference,
      measuredHz: offset.measuredHz,
      offsetPpm: offset.offsetPpm,
      uncertaintyPpm: offset.uncertaintyPpm,
      operatorId: actorId,
    }).returning({ id: calibrations.id })
    await audit(tx, { workshopId, actorId, action: 'calibration.create', subjectType: 'calibration', subjectId: row!.id, details: { device: input.device, offsetPpm: offset.offsetPpm } })
    return { id: row!.id, offsetPpm: offset.offsetPpm, uncertaintyPpm: offset.uncertaintyPpm }
  })
}
