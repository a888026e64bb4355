import { defineStore } from 'pinia'
import { computed, markRaw, ref, shallowRef, watch } from 'vue'
import type { AnalysisResult } from '#shared/analysis/types'

export type CaptureState = 'off' | 'listening' | 'armed' | 'recording' | 'uploading'

/** Audio of the strike on screen, for the spectrum and decay charts (not reactive inside). */
export interface StrikeAudio { samples: Float32Array, sampleRate: number }

export interface ShownStrike {
  id: string
  createdAt: string
  analysis: AnalysisResult
  audio: StrikeAudio | null
}

const KEY = 'tonewright.bench'

interface Remembered { setId: string | null, temperatureC: number | null, humidityPct: number | null, maxS: number, stayArmed: boolean, conditionsEnteredAt: number | null }

function recall(): Partial<Remembered> {
  if (typeof localStorage === 'undefined') return {}
  try {
    return JSON.parse(localStorage.getItem(KEY) ?? '{}') as Partial<Remembered>
  }
  catch {
    return {}
  }
}

/**
 * The Bench workflow: the chosen piece, the bench conditions (kept between strikes and
 * across reloads, in localStorage), the capture state and the strike on screen.
 */
export const useBenchStore = defineStore('bench', () => {
  const pieceId = ref<string | null>(null)
  const setId = ref<string | null>(null)
  const temperatureC = ref<number | null>(null)
  const humidityPct = ref<number | null>(null)
  const maxS = ref(3)
  /** Re-arm by itself after each measured strike (on unless this device turned it off). */
  const stayArmed = ref(true)
  /** When the bench conditions were last entered or confirmed, in ms since the epoch. */
  const conditionsEnteredAt = ref<number | null>(null)
  const capture = ref<CaptureState>('off')
  const uploadProgress = ref<number | null>(null)
  const problem = ref<string | null>(null)
  const shown = shallowRef<ShownStrike | null>(null)
  const recordedS = ref(0)

  let restored = false
  /** Reads the remembered values once, on the client (the server has no localStorage). */
  function restore() {
    if (restored || typeof localStorage === 'undefined') return
    restored = true
    const r = recall()
    if (r.setId !== undefined) setId.value = r.setId
    if (r.temperatureC !== undefined) temperatureC.value = r.temperatureC
    if (r.humidityPct !== undefined) humidityPct.value = r.humidityPct
    if (typeof r.maxS === 'number' && r.maxS >= 1 && r.maxS <= 15) maxS.value = r.maxS
    if (typeof r.stayArmed === 'boolean') stayArmed.value = r.stayArmed
    if (typeof r.conditionsEnteredAt === 'number' && Number.isFinite(r.conditionsEnteredAt)) conditionsEnteredAt.value = r.conditionsEnteredAt
  }

  function persist() {
    if (typeof localStorage === 'undefined') return
    const value: Remembered = { setId: setId.value, temperatureC: temperatureC.value, humidityPct: humidityPct.value, maxS: maxS.value, stayArmed: stayArmed.value, conditionsEnteredAt: conditionsEnteredAt.value }
    localStorage.setItem(KEY, JSON.stringify(value))
  }
  watch([setId, temperatureC, humidityPct, maxS, stayArmed, conditionsEnteredAt], persist)

  /** The conditions were typed or confirmed now. */
  function confirmConditions(now = Date.now()) {
    conditionsEnteredAt.value = now
  }

  function choosePiece(id: string | null, set?: string | null) {
    if (id !== pieceId.value) {
      shown.value = null
      problem.value = null
    }
    pieceId.value = id
    if (set) setId.value = set
  }

  function show(strike: ShownStrike | null) {
    // The audio is large: freeze it so Vue does not walk it.
    shown.value = strike ? { ...strike, audio: strike.audio ? markRaw(strike.audio) : null } : null
  }

  const conditions = computed(() => ({ temperatureC: temperatureC.value, humidityPct: humidityPct.value }))

  return { pieceId, setId, temperatureC, humidityPct, maxS, stayArmed, conditionsEnteredAt, confirmConditions, capture, uploadProgress, problem, shown, recordedS, conditions, restore, choosePiece, show }
})
