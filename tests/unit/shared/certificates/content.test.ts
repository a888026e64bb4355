import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { canonicalJson } from '../../../../shared/certificates/canonicalJson'
import { buildCertificateContent, type ContentInput } from '../../../../shared/certificates/content'
import { formatDate, formatDateTime } from '../../../../shared/format/dates'

describe('canonicalJson', () => {
  it('sorts keys at every level and drops white space', () => {
    // source: RFC 8785 (JSON Canonicalization Scheme) §3.2.3, members sorted by key, no insignificant white space
    expect(canonicalJson({ b: 1, a: [1, { d: 2, c: 3 }], e: 'x' })).toBe('{"a":[1,{"c":3,"d":2}],"b":1,"e":"x"}')
    expect(canonicalJson({ a: undefined, b: null })).toBe('{"b":null}')
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(/NaN/)
  })

  it('gives the same bytes whatever order the keys came in, so the hash is stable', () => {
    const one = canonicalJson({ number: 'TW-2026-0001', pieces: [{ note: 'C5', cents: -0.4 }] })
    const two = canonicalJson({ pieces: [{ cents: -0.4, note: 'C5' }], number: 'TW-2026-0001' })
    expect(one).toBe(two)
    // source: FIPS 180-4 test vector, SHA-256("abc")
    expect(createHash('sha256').update('abc').digest('hex')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
  })
})

const match = (label: string, ratio: number, f0: number, cents: number, tol: number, required = true) => ({
  label, ratio, targetHz: f0 * ratio, measuredHz: f0 * ratio * 2 ** (cents / 1200), cents, rawCents: cents, normalizedCents: cents,
  toleranceCents: tol, within: Math.abs(cents) <= tol, missing: false, required, direction: cents > 0 ? 'sharp' as const : 'flat' as const, amplitudeDb: -10,
})

function input(overrides: Partial<ContentInput> = {}): ContentInput {
  const template = { name: 'Marimba bar, double (1 : 4)', version: 2, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.9 }
  return {
    number: 'TW-2026-0007', verificationUrl: 'https://certs.example.test/verify/abc', supersedes: null,
    signedAt: new Date('2026-03-14T09:30:00Z'), signer: { name: 'Ines Varga', role: 'Supervisor' },
    workshop: { name: 'Harbourside Bar Works', address: '12 Quay Lane' },
    set: { name: 'Practice marimba', model: 'HM-2', serial: 'HM2-7', fromNote: 'C5', toNote: 'D5', chromatic: false, buyerName: 'R. Okafor', buyerOrganisation: 'Millbrook School', buyerEmail: 'r@example.test', referenceHz: 442, temperament: 'equal' },
    scrappedCount: 0,
    lots: [{ id: 'l1', code: 'RW-7', material: 'rosewood', species: '' }, { id: 'l2', code: 'RW-9', material: 'rosewood', species: '' }],
    pieces: [
      { position: 2, note: 'D5', targetHz: 589.9986, lotId: 'l1', template, overrideReason: null, strike: { temperatureC: 22.04, humidityPct: 48, verdict: 'within', engineVersion: '1.0.0', matches: [match('fundamental', 1, 589.9986, 1.234, 3)] } },
      { position: 1, note: 'C5', targetHz: 525.6295, lotId: 'l1', template, overrideReason: 'customer asked for it', strike: { temperatureC: 19.46, humidityPct: 41, verdict: 'outside', engineVersion: '1.0.0', matches: [match('fundamental', 1, 525.6295, -4.06, 3)] } },
    ],
    ...overrides,
  }
}

describe('buildCertificateContent', () => {
  it('freezes one row per piece in order, rounded as printed, with the override reason', () => {
    const c = buildCertificateContent(input())
    expect(c.pieces.map(p => p.note)).toEqual(['C5', 'D5'])
    expect(c.pieces[0]!.partials[0]!.cents).toBe(-4.1)
    expect(c.pieces[0]!.targetHz).toBe(525.63)
    expect(c.pieces[0]!.verdict).toBe('outside')
    expect(c.pieces[0]!.overrideReason).toBe('customer asked for it')
    expect(c.instrument).toMatchObject({ range: 'C5–D5, naturals', pieceCount: 2, lots: [{ code: 'RW-7' }] })
    expect(c.signedAt).toBe('2026-03-14T09:30:00.000Z')
  })

  it('states the temperature and humidity range over the strikes and the normalisation used', () => {
    const c = buildCertificateContent(input())
    expect(c.conditions.temperatureC).toEqual({ min: 19.5, max: 22 })
    expect(c.conditions.humidityPct).toEqual({ min: 41, max: 48 })
    expect(c.conditions.statement).toContain('20 °C at −0.9 ¢/°C')
    const none = buildCertificateContent(input({ pieces: input().pieces.map(p => ({ ...p, strike: { ...p.strike, temperatureC: null } })) }))
    expect(none.conditions.temperatureC).toBeNull()
    expect(none.conditions.statement).toMatch(/No bench temperature/)
  })

  it('carries the decision rule, the uncertainty, the scope line and the method in two sentences', () => {
    const c = buildCertificateContent(input())
    expect(c.decisionRule).toMatch(/every required partial/)
    // Engine 1.0.0 strikes carry no per-partial uncertainty: the paragraph says so instead of a figure.
    expect(c.uncertainty).toContain('did not yet estimate the uncertainty')
    expect(c.uncertainty).not.toContain('npm')
    expect(c.scope).toMatch(/relate only to the instrument measured/)
    expect(c.method.split(/\.\s/).length).toBe(2)
    expect(c.method).toContain('1.0.0')
  })

  it('computes the uncertainty paragraph from the partials of the strikes it rests on', () => {
    const pieces = input().pieces.map(p => ({
      ...p,
      strike: { ...p.strike, engineVersion: '2.0.0', partials: p.strike.matches.map(m => ({ frequencyHz: m.measuredHz, uncertaintyCents: 0.15 })) },
    }))
    // U = k · u = 2 × 0.15 ¢. source: JCGM 100:2008 (GUM) §6.2.1
    expect(buildCertificateContent(input({ pieces })).uncertainty).toContain('±0.30 ¢')
  })
})

describe('dates', () => {
  it('writes UTC dates unambiguously', () => {
    // source: ISO 8601-1:2019 calendar date and time of day
    expect(formatDateTime('2026-03-14T09:30:59Z')).toBe('2026-03-14 09:30 UTC')
    expect(formatDate(new Date('2026-12-31T23:59:00Z'))).toBe('2026-12-31')
    expect(formatDateTime(null)).toBe('—')
  })
})
