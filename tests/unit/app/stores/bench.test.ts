import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import { useBenchStore, type ShownStrike } from '../../../../app/stores/bench'

// localStorage as the browser has it, for the conditions the Bench remembers across reloads.
function fakeLocalStorage(initial: Record<string, string> = {}) {
  const items = new Map(Object.entries(initial))
  const storage = {
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => void items.set(key, value),
  }
  Object.assign(globalThis, { localStorage: storage })
  return items
}

const strike = (id: string): ShownStrike => ({ id, createdAt: '2026-01-01T00:00:00Z', analysis: {} as ShownStrike['analysis'], audio: null })

describe('useBenchStore', () => {
  beforeEach(() => setActivePinia(createPinia()))
  afterEach(() => Reflect.deleteProperty(globalThis, 'localStorage'))

  it('clears the strike on screen and its problem when another piece is chosen, not when the same one is', () => {
    const bench = useBenchStore()
    bench.choosePiece('p1', 's1')
    bench.show(strike('k1'))
    bench.problem = 'refused'
    bench.choosePiece('p1')
    expect(bench.shown?.id).toBe('k1')
    bench.choosePiece('p2')
    expect(bench.shown).toBeNull()
    expect(bench.problem).toBeNull()
    expect(bench.setId).toBe('s1')
  })

  it('restores the remembered set and conditions once, and refuses a longest take outside 1 to 15 s', () => {
    fakeLocalStorage({ 'tonewright.bench': JSON.stringify({ setId: 's9', temperatureC: 21.5, humidityPct: 40, maxS: 60 }) })
    const bench = useBenchStore()
    bench.restore()
    expect(bench.conditions).toEqual({ temperatureC: 21.5, humidityPct: 40 })
    expect(bench.setId).toBe('s9')
    expect(bench.maxS).toBe(3)
  })

  it('survives a remembered value that is not JSON', () => {
    fakeLocalStorage({ 'tonewright.bench': '{not json' })
    const bench = useBenchStore()
    bench.restore()
    expect(bench.setId).toBeNull()
  })

  it('remembers the conditions when they change', async () => {
    const items = fakeLocalStorage()
    const bench = useBenchStore()
    bench.temperatureC = 19
    bench.maxS = 8
    await nextTick()
    expect(JSON.parse(items.get('tonewright.bench') ?? '{}')).toEqual({ setId: null, temperatureC: 19, humidityPct: null, maxS: 8, stayArmed: true, conditionsEnteredAt: null })
  })

  it('stays armed by default and remembers turning it off on this device, with when the conditions were entered', async () => {
    const items = fakeLocalStorage()
    const bench = useBenchStore()
    expect(bench.stayArmed).toBe(true)
    bench.stayArmed = false
    bench.confirmConditions(1_700_000_000_000)
    await nextTick()
    setActivePinia(createPinia())
    const again = useBenchStore()
    again.restore()
    expect(again.stayArmed).toBe(false)
    expect(again.conditionsEnteredAt).toBe(1_700_000_000_000)
    expect(JSON.parse(items.get('tonewright.bench') ?? '{}')).toMatchObject({ stayArmed: false, conditionsEnteredAt: 1_700_000_000_000 })
  })

  it('ignores a remembered stay-armed or entry time of the wrong type', () => {
    fakeLocalStorage({ 'tonewright.bench': JSON.stringify({ stayArmed: 'no', conditionsEnteredAt: 'today' }) })
    const bench = useBenchStore()
    bench.restore()
    expect(bench.stayArmed).toBe(true)
    expect(bench.conditionsEnteredAt).toBeNull()
  })
})
