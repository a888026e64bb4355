import type { BlankGradeInput } from '../schemas/blankGrade'
import type { CutPlan, CutPlanInput } from '../schemas/cutPlan'
import { gradeBlank, type BlankFigures } from './gradeBlank'
import { planCutsForInput } from './planCutsForInput'

/** Work for the bar model's worker thread. */
export type BarModelTask = { kind: 'plan', input: CutPlanInput, handFactor?: number } | { kind: 'grade', input: BlankGradeInput }
export type BarModelReply = CutPlan | BlankFigures

/** Runs one task of the bar model (in the worker, or in this thread where there is none). */
export function runBarModelTask(task: BarModelTask): BarModelReply {
  if (task.kind === 'plan') return planCutsForInput(task.input, task.handFactor)
  if (task.kind === 'grade') return gradeBlank(task.input)
  throw new RangeError('unknown bar model task')
}
