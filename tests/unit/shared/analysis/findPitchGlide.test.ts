import { describe, expect, it } from 'vitest'
import { dropPairsOnGlide, findPitchGlide, onGlideCourse, pitchGlideWarning } from '../../../../shared/analysis/findPitchGlide'
import type { SpectrumFrame } from '../../../../shared/analysis/shortTimePeaks'

/** Frames every 20 ms holding one peak per (frequency, level) pair the function gives for the time. */
function frames(count: number, at: (timeS: number) => [number, number][]): SpectrumFrame[] {
  return Array.from({ length: count }, (_, i) => {
    const timeS = 0.04 + 0.02 * i
    return { timeS, peaks: at(timeS).map(([frequencyHz, amplitudeDb]) => ({ frequencyHz, amplitudeDb, noiseFloorDb: -100, phaseRad: 0 })) }
  })
}

describe('findPitchGlide', () => {
  it('follows a drum head\'s falling pitch to where it settles', () => {
    // A tom struck hard: its fundamental falls from 108 Hz to 91 Hz as the head's tension relaxes
    // (a pitch glide of about 300 cents; common practice among drum makers), decaying 25 dB/s.
    const glide = findPitchGlide(frames(30, t => [[91 + 17 * Math.exp(-t / 0.12), -3 - 25 * t], [230, -20 - 30 * t]]))
    expect(glide).not.toBeNull()
    expect(glide!.fromHz).toBeGreaterThan(100)
    expect(glide!.toHz).toBeCloseTo(91, 0)
    expect(glide!.highestHz).toBeGreaterThan(glide!.lowestHz)
  })

  it('takes no steady or beating partial for a glide, nor a jump to a louder neighbour', () => {
    // A bar's fundamental holds its pitch within cents; a tremolo swings its level, not its pitch.
    expect(findPitchGlide(frames(40, t => [[440.02 + 0.05 * Math.sin(40 * t), -6 - 10 * t + 6 * Math.sin(2 * Math.PI * 5 * t)]]))).toBeNull()
    // The loudest partial dies fast and drops out of the frames; its neighbour 117 cents up rings
    // on louder than it last was: a decaying sound does not jump up to it.
    const neighbour = (t: number): [number, number][] => [...(t < 0.15 ? [[200, -3 - 150 * t] as [number, number]] : []), [214, -10]]
    expect(findPitchGlide(frames(30, neighbour))).toBeNull()
    // A glide of 40 ms is a click, not a pitch a benchmaker could hear move.
    expect(findPitchGlide(frames(3, t => [[300 - 400 * t, -3]]))).toBeNull()
  })

  it('says whether the settled pitch is reported', () => {
    const glide = { fromHz: 108.4, toHz: 90.4, highestHz: 108.4, lowestHz: 90.4, startS: 0.04, endS: 0.82 }
    expect(pitchGlideWarning(glide, [91.7, 230])).toMatch(/^The loudest sound of the strike glides in pitch, from 108\.4 Hz to 90\.4 Hz over 0\.78 s .*; it is reported where it settles, at 91\.7 Hz$/)
    expect(pitchGlideWarning(glide, [230])).toMatch(/and is not reported: it holds no single pitch to measure/)
    expect(pitchGlideWarning(glide, [99.5, 230])).toMatch(/the reading at 99\.5 Hz is an average over the glide/)
    // Up and back down (a tabla's bass head pressed while it rings) names the turn.
    expect(pitchGlideWarning({ ...glide, fromHz: 102.6, highestHz: 137.1, lowestHz: 102.6, toHz: 124.5 }, [])).toMatch(/from 102\.6 Hz to 137\.1 Hz to 124\.5 Hz/)
    expect(pitchGlideWarning(null, [])).toBeNull()
  })

  it('keeps of a pair one track gave on the glide\'s course only the reading where it settles', () => {
    // A tom struck hard, as read with a timpani template: its fundamental's track, gliding from
    // 108 Hz to 90 Hz, came back as a "pair" at 91.41 Hz and 97.70 Hz (6.29 Hz apart); the 97.70 Hz
    // component (onset −3.6 dB, decaying 70 dB/s) is the glide's start, not a second mode.
    const glide = { fromHz: 108.4, toHz: 90.0, highestHz: 108.4, lowestHz: 90.0, startS: 0.04, endS: 0.82 }
    const pair = { beatHz: 6.29, modulationHz: 6.29, modulationDepthDb: 17.7, modulationFrom: 'pair' as const }
    const settled = { frequencyHz: 91.41, ...pair }
    const start = { frequencyHz: 97.7, ...pair }
    const mode = { frequencyHz: 133.51, beatHz: null, modulationHz: null, modulationDepthDb: null, modulationFrom: null }
    expect(dropPairsOnGlide([settled, start, mode], glide)).toEqual([{ frequencyHz: 91.41, beatHz: null, modulationHz: null, modulationDepthDb: null, modulationFrom: null }, mode])
    // No glide, or a pair off its course (a bell's doublet up at 880 Hz): left as read.
    expect(dropPairsOnGlide([settled, start, mode], null)).toEqual([settled, start, mode])
    const doublet = [{ ...settled, frequencyHz: 880.2 }, { ...start, frequencyHz: 881.5 }]
    expect(dropPairsOnGlide(doublet, glide)).toEqual(doublet)
    // The course reaches 50 cents past either end (source: 2^(50/1200) = 1.0293).
    expect(onGlideCourse(glide, 111.5)).toBe(true)
    expect(onGlideCourse(glide, 112)).toBe(false)
    expect(onGlideCourse(glide, 87.5)).toBe(true)
    expect(onGlideCourse(null, 100)).toBe(false)
  })
})
