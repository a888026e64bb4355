import { createError } from 'h3'
import type { BlankFigures } from '../../shared/barModel/gradeBlank'
import { gradeFromThresholds, type BlankGrade } from '../../shared/barModel/gradeFromThresholds'
import type { BarModelTask } from '../../shared/barModel/runBarModelTask'
import type { BlankGradeInput } from '../../shared/schemas/blankGrade'
import type { BlankThresholds } from '../../shared/schemas/blankThresholds'
import type { CutPlan, CutPlanInput } from '../../shared/schemas/cutPlan'
import { BarModelBusyError, useBarModelPool } from './bar-model-pool'
import { fail } from './http-errors'

/**
 * Runs a bar-model task off the request thread. A full queue answers 503 with Retry-After
 * (set from `data.retryAfterS`, see server/plugins/05.analysis-pool.ts); a bar the model
 * refuses answers 422 with a plain sentence.
 */
async function offThread(task: BarModelTask) {
  try {
    return await useBarModelPool().run(task)
  }
  catch (error) {
    if (error instanceof BarModelBusyError) {
      throw createError({ statusCode: 503, statusMessage: 'Service Unavailable', message: error.message, data: { retryAfterS: error.retryAfterS } })
    }
    if (error instanceof Error && error.name === 'RangeError') fail(422, 'The bar model cannot work with these figures; check the dimensions and material.')
    throw error
  }
}

/** POST /api/cut-plan's work: where to cut and how deep. */
export async function planCutsOffThread(input: CutPlanInput, handFactor?: number): Promise<CutPlan> {
  return await offThread({ kind: 'plan', input, handFactor }) as CutPlan
}

/**
 * POST /api/blanks/grade's work: what a blank's strike says about its material, graded when its
 * species is given (by the workshop's own thresholds for that species when it stored some).
 */
export async function gradeBlankOffThread(input: BlankGradeInput, workshopThresholds: BlankThresholds = {}): Promise<BlankFigures & { grade: BlankGrade | null }> {
  const figures = await offThread({ kind: 'grade', input }) as BlankFigures
  return { ...figures, grade: input.species ? gradeFromThresholds(figures, input.species, workshopThresholds) : null }
}
