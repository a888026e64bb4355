import type { InternalApi } from 'nitropack/types'
import type { BarMaterial } from '#shared/records/barMaterials'

export type RecordedBlank = InternalApi['/api/blanks']['post']

/** What the grading form holds: the blank's figures, and either its first mode or a recording of its strike. */
export interface BlankGradeEntry {
  species: BarMaterial
  lotId: string
  lengthMm: number | null
  widthMm: number | null
  thicknessMm: number | null
  massG: number | null
  source: 'figures' | 'recording'
  f1Hz: number | null
  decayDbPerS: number | null
  file: File | null
}

const present = (v: number | null) => (v === null || Number.isNaN(v) ? undefined : v)

/**
 * Grades and records a blank. From figures it is one request; from a recording the server
 * measures the strike first (POST /api/blanks/grade, multipart) and the blank is recorded with
 * the first mode and decay it found. The server checks every figure.
 */
export function useBlankGrade() {
  const api = useApiFetch()
  const { problem, busy, attempt } = useProblem()
  const result = ref<RecordedBlank | null>(null)

  async function measured(entry: BlankGradeEntry): Promise<{ f1Hz?: number, decayDbPerS?: number }> {
    if (entry.source === 'figures') return { f1Hz: present(entry.f1Hz), decayDbPerS: present(entry.decayDbPerS) }
    if (!entry.file) throw Object.assign(new Error('no file'), { data: { message: 'Choose a recording of the blank\'s strike.' } })
    const form = new FormData()
    for (const key of ['lengthMm', 'widthMm', 'thicknessMm', 'massG'] as const) form.set(key, String(entry[key] ?? ''))
    form.set('species', entry.species)
    form.set('file', entry.file)
    const graded = await api<{ f1Hz: number, decayDbPerS: number | null }>('/api/blanks/grade', { method: 'POST', body: form })
    return { f1Hz: graded.f1Hz, decayDbPerS: graded.decayDbPerS ?? undefined }
  }

  async function grade(entry: BlankGradeEntry) {
    const recorded = await attempt(async () => {
      const mode = await measured(entry)
      return await api<RecordedBlank>('/api/blanks', {
        method: 'POST',
        body: {
          species: entry.species, lotId: entry.lotId || undefined,
          lengthMm: present(entry.lengthMm), widthMm: present(entry.widthMm), thicknessMm: present(entry.thicknessMm), massG: present(entry.massG),
          ...mode,
        },
      })
    })
    if (recorded) result.value = recorded
    return recorded
  }

  return { grade, result, problem, busy }
}
