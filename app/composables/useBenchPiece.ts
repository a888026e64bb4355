import type { InternalApi } from 'nitropack/types'
import { useBenchStore } from '~/stores/bench'

export type BenchPiece = InternalApi['/api/pieces/:id']['get']
export type BenchSet = InternalApi['/api/sets/:id']['get']

/** The `?piece=` query as a piece id, or null when the Bench has no piece chosen. */
export function pieceIdFromQuery(value: unknown): string | null {
  return typeof value === 'string' && value ? value : null
}

/**
 * The piece on the Bench (from `?piece=`) and its set, fetched on the server for the
 * first paint and again after each strike or move. Awaited by the page, so the set
 * is fetched once the piece has named it.
 */
export async function useBenchPiece() {
  const route = useRoute()
  const bench = useBenchStore()
  const api = useApiFetch()

  const pieceId = computed(() => pieceIdFromQuery(route.query.piece))
  watch(pieceId, id => bench.choosePiece(id), { immediate: true })
  onMounted(() => bench.restore())

  const { data: piece, error: pieceError, refresh: refreshPiece } = await useAsyncData(
    () => `bench-piece-${pieceId.value ?? 'none'}`,
    () => (pieceId.value ? api<BenchPiece>(`/api/pieces/${pieceId.value}`) : Promise.resolve(null)),
    { watch: [pieceId] },
  )
  return { pieceId, piece, pieceError, refreshPiece }
}

/** The set of the piece on the Bench (for the next piece and the upload's file matching). */
export async function useBenchSet(piece: Ref<BenchPiece | null | undefined>) {
  const bench = useBenchStore()
  const api = useApiFetch()
  const setIdOfPiece = computed(() => piece.value?.set.id ?? null)
  // Before the await: after it the component instance is no longer current, and a watcher made then would outlive the page.
  watch(setIdOfPiece, (id) => {
    if (id) bench.setId = id
  })
  const { data: set, refresh: refreshSet } = await useAsyncData(
    () => `bench-piece-set-${setIdOfPiece.value ?? 'none'}`,
    () => (setIdOfPiece.value ? api<BenchSet>(`/api/sets/${setIdOfPiece.value}`) : Promise.resolve(null)),
    { watch: [setIdOfPiece] },
  )
  return { set, refreshSet }
}
