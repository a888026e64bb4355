import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { approveAll, approvedSet } from '../../../support/certified-set'
import { api } from '../../../support/http'
import { testSql } from '../../../support/mail'
import { canonicalJson } from '../../../../../shared/certificates/canonicalJson'

// Engine 1 wrote no cross-check, uncertainty or modulation per partial, and no bands or
// dynamic range among the parameters (shared/schemas/analysis.ts). Its rows must still read.
const LATER_PARTIAL_FIELDS = ['modulationHz', 'modulationDepthDb', 'crossCheckCents', 'uncertaintyCents', 'uncertaintyDecayPct']

function engineOneShape(analysis: Record<string, any>) {
  const partials = (analysis.partials as Record<string, unknown>[])
    .map(p => Object.fromEntries(Object.entries(p).filter(([key]) => !LATER_PARTIAL_FIELDS.includes(key))))
  const { bands: _bands, dynamicRangeDb: _range, ...parameters } = analysis.parameters
  return { ...analysis, engineVersion: '1.0.0', partials, parameters }
}

describe('a strike stored by an older engine', () => {
  it('reads in the current shape, lists its matches and still signs and verifies a certificate', async () => {
    const ctx = await approvedSet({ from: 'C5', to: 'C5' })
    await approveAll(ctx)
    const pieceId = ctx.set.pieces[0].id as string
    const [strike] = await testSql()<{ id: string, analysis: Record<string, any> }[]>`select id, analysis from strikes where piece_id = ${pieceId}`
    expect(strike!.analysis.partials[0]).toHaveProperty('crossCheckCents')
    const old = engineOneShape(strike!.analysis)
    await testSql()`update strikes set analysis = ${testSql().json(old)}, engine_version = '1.0.0' where id = ${strike!.id}`
    await testSql()`update strike_analyses set analysis = ${testSql().json(old)}, engine_version = '1.0.0' where strike_id = ${strike!.id}`

    const read = await api(`/api/strikes/${strike!.id}`, { token: ctx.bench.token })
    expect(read.status).toBe(200)
    expect(read.body.analysis.engineVersion).toBe('1.0.0')
    for (const p of read.body.analysis.partials) for (const key of LATER_PARTIAL_FIELDS) expect(p[key]).toBeNull()
    expect(read.body.analysis.parameters.bands).toEqual([])
    expect(read.body.analysis.parameters.dynamicRangeDb).toBeNull()
    // What the old engine did write comes back unchanged.
    expect(read.body.analysis.matches).toEqual(strike!.analysis.matches)
    expect(read.body.analysis.partials.map((p: { frequencyHz: number }) => p.frequencyHz)).toEqual(strike!.analysis.partials.map((p: { frequencyHz: number }) => p.frequencyHz))

    const piece = await api(`/api/pieces/${pieceId}`, { token: ctx.bench.token })
    expect(piece.body.strikes[0].matches.map((m: { label: string }) => m.label)).toEqual(strike!.analysis.matches.map((m: { label: string }) => m.label))

    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    const [cert] = await testSql()<{ content: { engineVersions: string[], uncertainty: string } }[]>`select content from certificates where id = ${signed.body.id}`
    expect(cert!.content.engineVersions).toEqual(['1.0.0'])
    // No figure is claimed for a strike whose engine estimated none.
    expect(cert!.content.uncertainty).not.toMatch(/±/)
    const verified = await api(`/api/verify/${signed.body.code}`)
    expect(verified.status).toBe(200)
    expect(verified.body.hashMatches).toBe(true)
    expect(verified.body.pieces[0].partials).toHaveLength(2)
  })

  it('reads a certificate signed before it carried an uncertainty paragraph', async () => {
    const ctx = await approvedSet({ from: 'D5', to: 'D5' })
    await approveAll(ctx)
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    // An older certificate: no `uncertainty` field, hashed as it was stored.
    await testSql()`update certificates set content = content - 'uncertainty' where id = ${signed.body.id}`
    const [row] = await testSql()<{ content: unknown }[]>`select content from certificates where id = ${signed.body.id}`
    const hash = createHash('sha256').update(canonicalJson(row!.content), 'utf8').digest('hex')
    await testSql()`update certificates set content_hash = ${hash} where id = ${signed.body.id}`
    const verified = await api(`/api/verify/${signed.body.code}`)
    expect(verified.status).toBe(200)
    expect(verified.body.hashMatches).toBe(true)
    expect(verified.body.pieces).toHaveLength(1)
    const queued = await api(`/api/certificates/${signed.body.id}/send`, { method: 'POST', token: ctx.office.token, body: {} })
    expect(queued.status).toBeLessThan(300)
  })
})
