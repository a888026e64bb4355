import { AT_BENCH_STAGES, COMPOSITE_MOVES, isPieceStage, stagePath } from '#shared/records/stages'
import type { Role } from '#shared/auth/roles'
import type { BenchPiece, BenchSet } from '~/composables/useBenchPiece'

interface PieceInSet { id: string, position: number, stage: string }

/** The next piece to strike after this one: the next strikeable position, else any other strikeable piece. */
export function nextPieceAfter<P extends PieceInSet>(pieces: readonly P[], currentId: string | null): P | null {
  const list = pieces.filter(p => isPieceStage(p.stage) && AT_BENCH_STAGES.includes(p.stage))
  const here = pieces.find(p => p.id === currentId)?.position ?? -1
  return list.find(p => p.position > here) ?? list.find(p => p.id !== currentId) ?? null
}

/**
 * A struck piece can be sent to review when this role may make the move, through tuning
 * where it is not there yet (a composite move of the stage table: one request).
 */
export function canSendToReview(piece: { strikeCount: number, stage: string } | null | undefined, role: Role | null | undefined) {
  if (!piece || piece.strikeCount === 0 || !role || !isPieceStage(piece.stage)) return false
  return stagePath(role, piece.stage, 'review', COMPOSITE_MOVES.review).steps !== null
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

  const { role } = useMember()
  // The workshop may ask for three strikes of the piece's final form before review: say how many are left.
  const readiness = ref<{ missing: number, advice: string | null } | null>(null)
  watch(() => [piece.value?.id, piece.value?.strikeCount] as const, async ([id]) => {
    readiness.value = id ? await api<{ missing: number, advice: string | null }>(`/api/pieces/${id}/review-readiness`).catch(() => null) : null
  }, { immediate: true })
  const strikesAdvice = computed(() => {
    const advice = readiness.value?.advice
    return advice && canSendToReview(piece.value, role.value) ? `${advice.charAt(0).toUpperCase()}${advice.slice(1)}.` : null
  })
  const canReview = computed(() => canSendToReview(piece.value, role.value) && !readiness.value?.missing)
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
      // One request, one transaction: through tuning when the piece is not there yet.
      await api(`/api/pieces/${piece.value.id}/stage`, { method: 'POST', body: { to: 'review', via: COMPOSITE_MOVES.review } })
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

  return { message, problem, busy, canReview, strikesAdvice, nextPiece, goTo, sendToReview }
}
