import { describe, expect, it } from 'vitest'
import { findMainsHum, mainsHumWarning } from '../../../../shared/analysis/findMainsHum'

// source: IEC 60038:2009 — supplies run at 50 Hz or 60 Hz; hum is the supply's fundamental and harmonics.
const line = (frequencyHz: number, decayDbPerS = 0) => ({ frequencyHz, decayDbPerS })

describe('findMainsHum', () => {
  it('finds two or more steady lines on multiples of one mains frequency', () => {
    expect(findMainsHum([line(120.01), line(174.6, 3), line(60.0), line(698.5, 12)])).toEqual({ mainsHz: 60, linesHz: [60.0, 120.01] })
    // A grid running 0.1 Hz fast puts its 3rd harmonic 0.3 Hz high.
    expect(findMainsHum([line(50.1), line(150.3), line(261.6, 20)])).toEqual({ mainsHz: 50, linesHz: [50.1, 150.3] })
  })

  it('takes no decaying partial for hum, and no single steady line', () => {
    // A marimba's 100 Hz and 400 Hz (ratio 1 : 4) decay; a vibraphone's fundamental alone at 180 Hz is one line.
    expect(findMainsHum([line(100, 4), line(400, 15)])).toBeNull()
    expect(findMainsHum([line(180, 0.2), line(721.3, 9)])).toBeNull()
    expect(findMainsHum([])).toBeNull()
  })

  it('takes no line off the grid: 1 Hz from 120 Hz is 0.8 % away', () => {
    expect(findMainsHum([line(60), line(121)])).toBeNull()
  })

  it('says which lines are hum, and what to do', () => {
    expect(mainsHumWarning(null)).toBeNull()
    const text = mainsHumWarning({ mainsHz: 50, linesHz: [50, 100, 150] })!
    expect(text).toMatch(/^50\.00 Hz, 100\.00 Hz and 150\.00 Hz are mains hum, not the piece: they sit on multiples of 50 Hz/)
  })
})
