import { describe, expect, it } from 'vitest'
import { chooseWindow, MAIN_LOBE_BINS } from '../../../../shared/analysis/index'
import { dropHeldInPairZones, heldBy, inPairZone, PAIR_HELD_WITHIN_DB } from '../../../../shared/analysis/pairZones'
import { planBands } from '../../../../shared/analysis/planBands'

describe('pair zones of the fast bands', () => {
  const settings = { shortestWindowS: 0.008, bandWindowRatio: 4, fastBandFrames: 100 }
  const long = chooseWindow({ spacingHz: 50, lowestHz: 200, spanS: 3 }, 48000)

  it('keeps the fast bands below a close pair high up (a vibrato family at 18 kHz)', () => {
    // A family 10 Hz apart at 18 kHz, as the rough pass finds on a freepats glockenspiel C7.
    const bands = planBands(long, [[2093, 5682, 5692, 10778, 10793, 18047, 18063]], 48000, { startIndex: 0, endIndex: 144000 }, { minHz: 20, maxHz: 20000 }, settings)
    expect(bands.length).toBeGreaterThan(1)
    for (const band of bands.slice(1)) {
      // Owned from 1.25 main lobes over DC (a whole lobe between a partial and its mirror image).
      expect(band.ownFromHz).toBeCloseTo(Math.max(bands[1]!.ownFromHz, (1.25 * MAIN_LOBE_BINS) / band.windowS), 6)
      expect(inPairZone(18055, band.pairZonesHz)).toBe(true)
      expect(inPairZone(5687, band.pairZonesHz)).toBe(true)
      // 2093 Hz has no neighbour within 1.25 main lobes of any fast window but the shortest.
      if ((1.25 * MAIN_LOBE_BINS) / band.windowS < 5682 - 2093) expect(inPairZone(2093, band.pairZonesHz)).toBe(false)
    }
  })

  it('joins overlapping zones', () => {
    const bands = planBands(long, [[1000, 1010, 1020, 1030]], 48000, { startIndex: 0, endIndex: 144000 }, { minHz: 20, maxHz: 20000 }, settings)
    for (const band of bands.slice(1)) expect(band.pairZonesHz).toHaveLength(1)
  })

  it('lets a fast band add a partial no slower band holds, never re-read a held one inside a zone', () => {
    const zones: [number, number][] = [[5600, 5800]]
    const fast = [{ frequencyHz: 5683, amplitudeDb: -30 }, { frequencyHz: 5750, amplitudeDb: -30 }, { frequencyHz: 3000, amplitudeDb: -30 }]
    const held = [{ frequencyHz: 5751, amplitudeDb: -32 }, { frequencyHz: 3000.5, amplitudeDb: -30 }]
    // 5683: in a zone, nothing held near → added; 5750: in a zone, held → left to the slow band;
    // 3000: outside every zone → merged as before (mergeBands decides).
    expect(dropHeldInPairZones(fast, held, zones, 8).map(p => p.frequencyHz)).toEqual([5683, 3000])
    expect(dropHeldInPairZones(fast, held, [], 8)).toHaveLength(3)
  })

  it('a slower partial far weaker than the fast reading does not hold it (a room\'s comb resonances beside a xylophone\'s ×3)', () => {
    // Readings of tests/support/recordingConditions.ts' xylophone C5 in a 1 s room, tail −15 dB:
    // the 0.5 s window read two comb resonances at 1563 and 1579 Hz, −46 and −39 dB; the 8 ms
    // window read the bar's ×3 at 1571.6 Hz, −14 dB.
    const zones: [number, number][] = [[1540, 1600]]
    const resonances = [{ frequencyHz: 1563.16, amplitudeDb: -46.1 }, { frequencyHz: 1578.84, amplitudeDb: -39.4 }]
    const third = { frequencyHz: 1571.58, amplitudeDb: -14.3 }
    expect(heldBy(resonances, third.frequencyHz, third.amplitudeDb, 64)).toBe(false)
    expect(dropHeldInPairZones([third], resonances, zones, 64)).toEqual([third])
    // Within PAIR_HELD_WITHIN_DB (an unresolved pair reads at most 6 dB over its stronger member) it is held.
    expect(heldBy(resonances, third.frequencyHz, -39.4 + PAIR_HELD_WITHIN_DB, 64)).toBe(true)
    expect(heldBy(resonances, third.frequencyHz, -39.4 + PAIR_HELD_WITHIN_DB + 0.1, 64)).toBe(false)
  })

  it('a lone slower reading whose window the fast reading falls more than 6 dB within does not hold it; a resolved pair does', () => {
    // A xylophone ×3 (280 dB/s) in a room: the 0.104 s window read it at −33.9 dB, the 26 ms
    // window at −28.2 dB; 280 dB/s × 0.104 s = 29 dB within the slower window (> 6 dB).
    const smeared = [{ frequencyHz: 1683.2, amplitudeDb: -33.9, windowS: 0.104 }]
    const fall = { decayDbPerS: 280, maxDropPerWindowDb: 6 }
    expect(heldBy(smeared, 1683.5, -28.2, 153, fall)).toBe(false)
    expect(heldBy(smeared, 1683.5, -28.2, 153)).toBe(true)
    expect(heldBy(smeared, 1683.5, -28.2, 153, { decayDbPerS: 50, maxDropPerWindowDb: 6 })).toBe(true) // 5.2 dB: read whole
    expect(dropHeldInPairZones([{ frequencyHz: 1683.5, amplitudeDb: -28.2, decayDbPerS: 280 }], smeared, [[1557, 1798]], 153, 6)).toHaveLength(1)
    // Two slower readings of like level there (a tabla's ringing modes 20 Hz apart) hold it, however it falls.
    const pair = [{ frequencyHz: 818.1, amplitudeDb: -50, windowS: 0.1 }, { frequencyHz: 837.9, amplitudeDb: -51, windowS: 0.1 }]
    expect(heldBy(pair, 828, -45, 153, fall)).toBe(true)
  })
})
