import { describe, expect, it } from 'vitest'
import {
  CERTIFICATE_MEANING, CERTIFICATE_PDF_MEANING, lookClassNames, lookHex, lookTones, MAIL_MEANING, MEANINGS,
  decisionMeaning, MESSAGE_MEANING, MESSAGE_TONES, NEUTRAL_FAMILIES, PARTIAL_MEANING, REANALYSIS_MEANING, STAGE_MEANING, verdictMeaning, type Look, type Meaning,
} from '../../../../shared/look/meanings'
import { familyOf, hex, PALETTE, SERIES_TONES } from '../../../../shared/look/palette'
import {
  CERTIFICATE_PDF_STATUSES, CERTIFICATE_STATUSES, MAIL_STATUSES, PARTIAL_STATES, PIECE_VERDICTS, REANALYSIS_STATUSES,
} from '../../../../shared/records/lists'
import { PIECE_STAGES, STAGE_LABELS } from '../../../../shared/records/stages'

const entries = Object.entries(MEANINGS) as [Meaning, Look][]

/** Relative luminance of an sRGB colour. source: WCAG 2.1, definition of "relative luminance". */
function luminance(colour: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = Number.parseInt(colour.slice(i, i + 2), 16) / 255
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
  }) as [number, number, number]
  return 0.2126 * r + 0.7152 * g + 0.0722 * b
}

/** source: WCAG 2.1, definition of "contrast ratio": (L1 + 0.05) / (L2 + 0.05). */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number]
  return (hi + 0.05) / (lo + 0.05)
}

describe('the meaning map', () => {
  it('gives no two meanings the same colour', () => {
    const byColour = new Map<string, Meaning[]>()
    for (const [meaning, look] of entries) byColour.set(hex(look.colour), [...byColour.get(hex(look.colour)) ?? [], meaning])
    const shared = [...byColour.entries()].filter(([, meanings]) => meanings.length > 1)
    expect(shared).toEqual([])
  })

  it('keeps the verdict and message colour families to their own group', () => {
    // A verdict colour is not an error, notice, stage or status colour, and the other way round.
    for (const owner of ['verdict', 'message'] as const) {
      const families = new Set(entries.filter(([, l]) => l.group === owner).flatMap(([, l]) => lookTones(l).map(t => t.family)))
      for (const family of NEUTRAL_FAMILIES) families.delete(family)
      const intruders = entries.filter(([, l]) => l.group !== owner)
        .flatMap(([m, l]) => lookTones(l).filter(t => families.has(t.family)).map(t => `${m}: ${t.tone}`))
      expect(intruders, owner).toEqual([])
    }
  })

  it('splits the colours that used to stand for two things', () => {
    expect(MEANINGS.error.colour).not.toBe(MEANINGS.sharp.colour)
    expect(MEANINGS.rework.colour).not.toBe(MEANINGS.sharp.colour)
    expect(MEANINGS.info.colour).not.toBe(MEANINGS.flat.colour)
    expect(MEANINGS.approved.colour).not.toBe(MEANINGS.within.colour)
    expect(MEANINGS.scrapped.colour).not.toBe(MEANINGS.missing.colour)
    // A set in service is a status, drawn unlike the shipped and rework stages it sits between.
    expect(MEANINGS.inService.group).toBe('status')
    expect([MEANINGS.shipped.colour, MEANINGS.rework.colour, MEANINGS.revoked.colour]).not.toContain(MEANINGS.inService.colour)
    expect(entries.filter(([m, l]) => m !== 'inService' && l.shape === MEANINGS.inService.shape)).toEqual([])
    // Advice (where to remove material) has marks of its own, never the sharp or flat ones.
    expect([MEANINGS.sharp.colour, MEANINGS.flat.colour]).not.toContain(MEANINGS.advice.colour)
  })

  it('gives error, warning, info, success, within, sharp, flat, each stage and each mail status a look of its own colour', () => {
    const named: Record<string, Meaning> = {
      ...Object.fromEntries(MESSAGE_TONES.map(t => [`message ${t}`, MESSAGE_MEANING[t]])),
      within: PARTIAL_MEANING.within, sharp: PARTIAL_MEANING.sharp, flat: PARTIAL_MEANING.flat,
      ...Object.fromEntries(PIECE_STAGES.map(s => [`stage ${s}`, STAGE_MEANING[s]])),
    }
    const colours = Object.entries(named).map(([name, m]) => [name, hex(MEANINGS[m].colour)] as const)
    const clashes = colours.filter(([name, c]) => colours.some(([other, d]) => other !== name && d === c))
    expect(clashes).toEqual([])
    // The mail statuses look unlike each other; a failed send is an error and looks like one (one meaning, one look).
    expect(new Set(MAIL_STATUSES.map(s => hex(MEANINGS[MAIL_MEANING[s]].colour))).size).toBe(MAIL_STATUSES.length)
    expect(MAIL_MEANING.failed).toBe(MESSAGE_MEANING.error)
    expect(MAIL_MEANING.sent).toBe(MESSAGE_MEANING.success)
    // A warning is not the sharp orange nor the advice brass; success is not the within green.
    expect(MEANINGS[MESSAGE_MEANING.warning].group).toBe('message')
    expect(MEANINGS[MESSAGE_MEANING.success].colour).not.toBe(MEANINGS.within.colour)
    expect([MEANINGS.sharp.colour, MEANINGS.advice.colour, MEANINGS.tuning.colour]).not.toContain(MEANINGS.warning.colour)
  })

  it('has a look for every partial state, piece verdict, stage and status', () => {
    for (const s of PARTIAL_STATES) expect(MEANINGS[PARTIAL_MEANING[s]].word).toBe(s)
    for (const v of PIECE_VERDICTS) {
      for (const cents of [12, -12, null]) expect(MEANINGS[verdictMeaning(v, cents)].group).toBe('verdict')
    }
    expect([verdictMeaning('outside', 12), verdictMeaning('outside', -12), verdictMeaning('incomplete', 3)]).toEqual(['sharp', 'flat', 'missing'])
    for (const s of PIECE_STAGES) {
      expect(MEANINGS[STAGE_MEANING[s]].group).toBe('stage')
      expect(MEANINGS[STAGE_MEANING[s]].word).toBe(STAGE_LABELS[s])
    }
    const statuses: [readonly string[], Record<string, Meaning>][] = [
      [CERTIFICATE_STATUSES, CERTIFICATE_MEANING], [CERTIFICATE_PDF_STATUSES, CERTIFICATE_PDF_MEANING],
      [MAIL_STATUSES, MAIL_MEANING], [REANALYSIS_STATUSES, REANALYSIS_MEANING],
    ]
    for (const [list, map] of statuses) {
      expect(Object.keys(map).sort()).toEqual([...list].sort())
      for (const s of list) expect(MEANINGS[map[s]!], s).toBeDefined()
    }
    // Each stage has a meaning of its own.
    expect(new Set(PIECE_STAGES.map(s => STAGE_MEANING[s])).size).toBe(PIECE_STAGES.length)
  })

  it('gives a conditional verdict a look of its own: colour, shape and word', () => {
    const others = entries.filter(([m]) => m !== 'conditional')
    expect(MEANINGS.conditional.group).toBe('verdict')
    expect(others.map(([, l]) => l.shape)).not.toContain(MEANINGS.conditional.shape)
    expect(others.map(([, l]) => hex(l.colour))).not.toContain(hex(MEANINGS.conditional.colour))
    expect(MEANINGS.conditional.word).toBe('conditional')
    expect([decisionMeaning('pass', 4), decisionMeaning('conditional', 4.6), decisionMeaning('fail', 6), decisionMeaning('fail', -6), decisionMeaning(null, null)])
      .toEqual(['within', 'conditional', 'sharp', 'flat', 'missing'])
  })

  it('writes text that reads on paper and on each stage colour', () => {
    // source: WCAG 2.1 success criterion 1.4.3 (contrast minimum): 4.5:1 for text.
    for (const [meaning, look] of entries) {
      expect(contrast(hex(look.text), PALETTE.paper.DEFAULT), meaning).toBeGreaterThanOrEqual(4.5)
      // ...and on its own tint (a message box writes its text on the tint).
      expect(contrast(hex(look.text), hex(look.tint)), meaning).toBeGreaterThanOrEqual(4.5)
      if (look.group === 'stage') expect(contrast(hex(look.onColour), hex(look.colour)), meaning).toBeGreaterThanOrEqual(4.5)
    }
  })

  it('draws marks that stand out from the paper', () => {
    // source: WCAG 2.1 success criterion 1.4.11 (non-text contrast): 3:1 for graphical objects.
    // A mark too light on its own (the yellow warning sign) is drawn with an edge that carries the contrast.
    for (const [meaning, look] of entries.filter(([, l]) => l.group !== 'stage')) {
      expect(contrast(hex(look.outline ?? look.colour), PALETTE.paper.DEFAULT), meaning).toBeGreaterThanOrEqual(3)
    }
  })

  it('resolves every tone to a palette colour and names every class it hands out', () => {
    for (const [meaning] of entries) {
      for (const value of Object.values(lookHex(meaning))) expect(value, meaning).toMatch(/^#[0-9a-f]{6}$/)
    }
    expect(lookClassNames()).toContain('fill-spruce-500')
    expect(lookClassNames()).toContain('text-madder-700')
  })
})

describe('the palette', () => {
  it('declares each colour once', () => {
    const values = Object.values(PALETTE).flatMap(f => Object.values(f) as string[])
    expect(values.every(v => /^#[0-9a-f]{6}$/.test(v))).toBe(true)
    expect(new Set(values).size).toBe(values.length)
  })

  it('draws chart series in colours of their own, apart from every meaning', () => {
    // A decay curve is not a verdict: no series may take a family a meaning uses (ink and paper are neutral).
    const meaningFamilies = new Set(entries.flatMap(([, l]) => lookTones(l).map(t => t.family)))
    for (const family of NEUTRAL_FAMILIES) meaningFamilies.delete(family)
    expect(SERIES_TONES.filter(t => meaningFamilies.has(familyOf(t)))).toEqual([])
    expect(new Set(SERIES_TONES.map(hex)).size).toBe(SERIES_TONES.length)
    // source: WCAG 2.1 success criterion 1.4.11 (non-text contrast): 3:1 for graphical objects.
    for (const tone of SERIES_TONES) expect(contrast(hex(tone), PALETTE.paper.DEFAULT), tone).toBeGreaterThanOrEqual(3)
  })

  it('reads tones as Tailwind spells them', () => {
    expect(hex('ink')).toBe(PALETTE.ink.DEFAULT)
    expect(hex('ink-soft')).toBe(PALETTE.ink.soft)
    expect(hex('spruce-500')).toBe(PALETTE.spruce[500])
  })
})
