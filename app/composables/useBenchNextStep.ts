import { STRIKEABLE_STAGES, type PieceStage } from '#shared/records/stages'
import type { BenchPiece, BenchSet } from '~/composables/useBenchPiece'

interface PieceInSet { id: string, position: number, stage: string }

/** The next piece to strike after this one: the next strikeable position, else any other strikeable piece. */
export function nextPieceAfter<P extends PieceInSet>(pieces: readonly P[], currentId: string | null): P | null {
  const list = pieces.filter(p => STRIKEABLE_STAGES.includes(p.stage as PieceStage) && p.stage !== 'review')
  const here = pieces.find(p => p.id === currentId)?.position ?? -1
  return list.find(p => p.position > here) ?? list.find(p => p.id !== currentId) ?? null
}

/** A struck piece before review can be sent there. */
export function canSendToReview(piece: { strikeCount: number, stage: string } | null | undefined) {
  return Boolean(piece && piece.strikeCount > 0 && ['blank', 'roughed', 'tuning', 'rework'].includes(piece.stage))
}

/** The stage moves that take a piece to review: review is reached from tuning, so a blank, roughed or reworked piece passes through it. */
export function movesToReview(stage: string): PieceStage[] {
  return stage === 'blank' || stage === 'roughed' || stage === 'rework' ? ['tuning', 'review'] : ['review']
}

export interface BenchNextStepDeps {
  pieceId: Ref<string | null>
  piece: Ref<BenchPiece | null | undefined>
  set: Ref<BenchSet | null | undefined>
  refreshPiece: () => Promise<unknown>
  refreshSet: () => Promise<unknown>
  /** Called before leaving the piece (the microphone must not stay armed for another one). */
  beforeLeave: () => void
}

/** The Bench's next steps: send this piece to review, or go to the next piece of the set. */
export function useBenchNextStep({ pieceId, piece, set, refreshPiece, refreshSet, beforeLeave }: BenchNextStepDeps) {
  const router = useRouter()
  const api = useApiFetch()
  const message = ref<string | null>(null)
  const problem = ref<string | null>(null)
  const busy = ref(false)

  const canReview = computed(() => canSendToReview(piece.value))
  const nextPiece = computed(() => nextPieceAfter(set.value?.pieces ?? [], pieceId.value))

  function goTo(id: string) {
    beforeLeave()
    void router.push({ path: '/bench', query: { piece: id } })
  }

  async function sendToReview() {
    if (!piece.value || !canReview.value) return
    busy.value = true
    problem.value = null
    message.value = null
    try {
      for (const to of movesToReview(piece.value.stage)) {
        await api(`/api/pieces/${piece.value.id}/stage`, { method: 'POST', body: { to } })
      }
      message.value = `${piece.value.note} is in review.`
      await Promise.all([refreshPiece(), refreshSet()])
    }
    catch (error) {
      problem.value = apiErrorMessage(error)
    }
    finally {
      busy.value = false
    }
  }

  return { message, problem, busy, canReview, nextPiece, goTo, sendToReview }
}
