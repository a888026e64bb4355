import type { H3Event } from 'h3'
import { getValidatedRouterParams, readValidatedBody } from 'h3'
import { IdParams } from '../../shared/schemas/params'
import { ReanalyzeSchema } from '../../shared/schemas/reanalysis'
import { parseWith } from '../../shared/validation'
import { requireMember } from './auth'
import { useDatabase } from './db'
import { answerQueued } from './queued-answer'
import { requestReanalysis } from './reanalysis'
import { kickReanalysisQueue } from './reanalysis-queue'

/** The reanalyze routes of a piece and of a set: queue a re-measurement of the strikes under the id in the path (202, poll statusUrl). */
export async function reanalyzeFromRoute(event: H3Event, scope: 'piece' | 'set') {
  const member = await requireMember(event, 'strikes:reanalyze')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(ReanalyzeSchema))
  const run = await requestReanalysis(useDatabase(), member, scope === 'piece' ? { pieceId: id } : { setId: id }, body.reason)
  return answerQueued(event, 202, run, kickReanalysisQueue)
}
