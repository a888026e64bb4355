import { describe, expect, it } from 'vitest'
import { buildCertificateContent, type ContentInput } from '../../../../shared/certificates/content'
import { pieceBudget, type PieceBudgetInput } from '../../../../shared/uncertainty/pieceBudget'

const match = (label: string, f0: number, cents: number, tol: number) => ({
  label, ratio: 1, targetHz: f0, measuredHz: f0 * 2 ** (cents / 1200), cents, rawCents: cents, normalizedCents: cents,
  toleranceCents: tol, within: Math.abs(cents) <= tol, missing: false, required: true, direction: cents > 0 ? 'sharp' as const : 'flat' as const, amplitudeDb: -10,
})

const clock = { state: 'calibrated' as const, device: 'Bench interface A', calibratedAt: '2026-01-02T10:00:00.000Z', offsetPpm: 41.2, uncertaintyPpm: 0.5, referenceUncertaintyPpm: 0.1, expired: true, driftPpm: null }

// The worked budget of tests/unit/shared/uncertainty/pieceBudget.test.ts (JCGM 100:2008 §5, k = 2): U = 0.49826 ¢ at +4.6 ¢ of ±5 ¢.
function budgetInput(rule: 'simple' | 'guarded', over: Partial<PieceBudgetInput> = {}): PieceBudgetInput {
  return {
    matches: [{ label: 'fundamental', cents: 4.6, toleranceCents: 5, required: true, missing: false, uncertaintyCents: 0.2 }],
    finalState: [[{ label: 'fundamental', cents: 4.6 }], [{ label: 'fundamental', cents: 4.4 }], [{ label: 'fundamental', cents: 4.8 }]],
    clock: { ...clock, driftPpm: 20, expired: false }, temperatureRecorded: true, temperatureCoefficientCentsPerK: -0.3, rule, ...over,
  }
}

function input(rule: 'simple' | 'guarded'): ContentInput {
  const template = { name: 'Marimba bar, double (1 : 4)', version: 3, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.3, decisionRule: rule }
  const strike = (cents: number) => ({ temperatureC: 20, humidityPct: 45, verdict: 'within' as const, engineVersion: '2.0.0', matches: [match('fundamental', 525.63, cents, 5)] })
  return {
    number: 'TW-2026-0042', verificationUrl: 'https://certs.example.test/verify/xyz', supersedes: null,
    signedAt: new Date('2026-03-14T09:30:00Z'), signer: { name: 'Ines Varga', role: 'Supervisor' },
    workshop: { name: 'Harbourside Bar Works', address: '12 Quay Lane' },
    set: { name: 'Practice marimba', model: 'HM-2', serial: 'HM2-9', fromNote: 'C5', toNote: 'D5', chromatic: false, buyerName: 'R. Okafor', buyerOrganisation: '', buyerEmail: 'r@example.test', referenceHz: 442, temperament: 'equal' },
    scrappedCount: 0, lots: [],
    pieces: [
      { position: 1, note: 'C5', targetHz: 525.63, lotId: null, template, overrideReason: null, strike: strike(4.6), budget: pieceBudget(budgetInput(rule)) },
      { position: 2, note: 'D5', targetHz: 590, lotId: null, template, overrideReason: null, strike: strike(1), budget: pieceBudget(budgetInput(rule, { matches: [{ label: 'fundamental', cents: 1, toleranceCents: 5, required: true, missing: false, uncertaintyCents: 0.2 }], finalState: [[{ label: 'fundamental', cents: 1 }]], clock })) },
    ],
  }
}

describe('a certificate with budgets', () => {
  it('freezes ± U beside each deviation and the budget lines for the annex', () => {
    const c = buildCertificateContent(input('simple'))
    const c5 = c.pieces[0]!
    expect(c5.partials[0]!.expandedUncertaintyCents).toBeCloseTo(0.49826, 4)
    expect(c5.budget[0]!.lines).toHaveLength(6)
    expect(c5.budget[0]!.combinedStandardUncertaintyCents).toBeCloseTo(0.24913, 4)
    expect(c.pieces[1]!.budget[0]!.notAssessed.map(g => g.name)).toEqual(['repeatability', 'clock drift since calibration'])
  })

  it('names the decision rule, and marks the piece whose verdict depends on it', () => {
    const simple = buildCertificateContent(input('simple'))
    expect(simple.decisionRule).toMatch(/simple acceptance/)
    expect(simple.pieces[0]!.decision).toEqual({ rule: 'simple', verdict: 'pass', otherVerdict: 'conditional', dependsOnRule: true })
    const guarded = buildCertificateContent(input('guarded'))
    expect(guarded.decisionRule).toMatch(/guarded acceptance.*\|Δ\| \+ U ≤ tolerance/)
    expect(guarded.pieces[0]!.decision!.verdict).toBe('conditional')
    expect(guarded.pieces[1]!.decision).toMatchObject({ verdict: 'pass', dependsOnRule: false })
  })

  it('lists the input calibrations, an expired one said so, and computes the paragraph from the budgets', () => {
    const c = buildCertificateContent(input('simple'))
    expect(c.calibrations).toEqual([
      { device: 'Bench interface A', calibratedAt: '2026-01-02T10:00:00.000Z', offsetPpm: 41.2, uncertaintyPpm: 0.5, expired: true, driftAssessed: false, pieceCount: 2 },
    ])
    expect(c.uncalibratedPieceCount).toBe(0)
    // U of the two partials: 0.498 ¢ and (D5: estimator, clock, temperature, resolution) √(0.04 + 7.49e-7 + 0.0075 + 0.000833) = √0.048334 = 0.21985, × 2 = 0.43970 ¢.
    expect(c.pieces[1]!.partials[0]!.expandedUncertaintyCents).toBeCloseTo(0.4397, 4)
    expect(c.uncertainty).toMatch(/between ±0\.44 ¢ and ±0\.50 ¢/)
    expect(c.uncertainty).toMatch(/not an accredited calibration laboratory/)
    expect(c.uncertainty).toMatch(/repeatability for 1 partial/)
  })

  it('claims no U for a partial whose engine gave no estimate of its own, and falls back to the older paragraph when none has one', () => {
    const base = input('simple')
    const noEstimate = (p: ContentInput['pieces'][number]) => ({ ...p, budget: pieceBudget(budgetInput('simple', { matches: [{ label: 'fundamental', cents: 1, toleranceCents: 5, required: true, missing: false, uncertaintyCents: null }] })) })
    const c = buildCertificateContent({ ...base, pieces: base.pieces.map(noEstimate) })
    expect(c.pieces[0]!.partials[0]!.expandedUncertaintyCents).toBeNull()
    expect(c.pieces[0]!.budget[0]!.notAssessed.map(g => g.name)).toContain('estimator')
    expect(c.uncertainty).not.toMatch(/±/)
    const mixed = buildCertificateContent({ ...base, pieces: [base.pieces[0]!, noEstimate(base.pieces[1]!)] })
    expect(mixed.uncertainty).toMatch(/For 1 partial measured by an engine that gave no estimate of its own, no U is stated/)
  })
})
