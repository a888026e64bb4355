import { beforeAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet, postStrike, strikeWav, templateId } from '../../../support/records'

type Role = 'owner' | 'supervisor' | 'benchmaker' | 'office'
const ROLES: Role[] = ['owner', 'supervisor', 'benchmaker', 'office']

// The role × route matrix of the role table in README.md (Roles and stages):
// owner everything; supervisor review and all benchmaker rights; benchmaker strikes
// and moves pieces; office sets, buyers, shipping, reads everything.
interface Ctx { setId: string, pieceId: string, templateId: string, strikeId: string }
const MATRIX: { route: string, allowed: Role[], call: (token: string, c: Ctx) => Promise<{ status: number }> }[] = [
  { route: 'GET /api/sets', allowed: ROLES, call: t => api('/api/sets', { token: t }) },
  { route: 'GET /api/sets/:id', allowed: ROLES, call: (t, c) => api(`/api/sets/${c.setId}`, { token: t }) },
  { route: 'POST /api/sets', allowed: ['owner', 'office'], call: (t, c) => api('/api/sets', { method: 'POST', token: t, body: { name: 'M', model: 'M', serial: `R-${Math.random()}`, buyer: { name: 'B', email: 'b@example.test' }, referenceHz: 440, fromNote: 'C4', toNote: 'C4', chromatic: true, templateId: c.templateId } }) },
  { route: 'GET /api/pieces', allowed: ROLES, call: t => api('/api/pieces', { token: t }) },
  { route: 'GET /api/pieces/:id', allowed: ROLES, call: (t, c) => api(`/api/pieces/${c.pieceId}`, { token: t }) },
  { route: 'POST /api/pieces/:id/strikes', allowed: ['owner', 'supervisor', 'benchmaker'], call: (t, c) => postStrike(t, c.pieceId, strikeWav(261.63, [1, 4], [0, 0])) },
  { route: 'POST /api/pieces/:id/stage', allowed: ['owner', 'supervisor', 'benchmaker'], call: (t, c) => api(`/api/pieces/${c.pieceId}/stage`, { method: 'POST', token: t, body: { to: 'roughed' } }) },
  { route: 'POST /api/pieces/:id/approve', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/pieces/${c.pieceId}/approve`, { method: 'POST', token: t, body: { strikeId: c.strikeId } }) },
  { route: 'POST /api/pieces/:id/return', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/pieces/${c.pieceId}/return`, { method: 'POST', token: t, body: { comment: 'again' } }) },
  { route: 'POST /api/pieces/:id/reopen', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/pieces/${c.pieceId}/reopen`, { method: 'POST', token: t, body: { reason: 'checking' } }) },
  { route: 'POST /api/pieces/:id/assign', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/pieces/${c.pieceId}/assign`, { method: 'POST', token: t, body: { assigneeId: null } }) },
  { route: 'GET /api/review', allowed: ['owner', 'supervisor'], call: t => api('/api/review', { token: t }) },
  { route: 'GET /api/templates', allowed: ROLES, call: t => api('/api/templates', { token: t }) },
  { route: 'POST /api/templates', allowed: ['owner'], call: t => api('/api/templates', { method: 'POST', token: t, body: { family: 'tine', name: 'Test tine', partials: [{ label: 'f', ratio: 1, toleranceCents: 4, required: true }] } }) },
  { route: 'PUT /api/templates/:id', allowed: ['owner'], call: (t, c) => api(`/api/templates/${c.templateId}`, { method: 'PUT', token: t, body: { family: 'bar', name: 'Marimba bar, double (1 : 4)', partials: [{ label: 'f', ratio: 1, toleranceCents: 3, required: true }, { label: 's', ratio: 4, toleranceCents: 5, required: true }] } }) },
  { route: 'GET /api/lots', allowed: ROLES, call: t => api('/api/lots', { token: t }) },
  { route: 'POST /api/lots', allowed: ['owner', 'office'], call: t => api('/api/lots', { method: 'POST', token: t, body: { code: `L-${Math.random()}`, material: 'rosewood' } }) },
  { route: 'GET /api/strikes/:id', allowed: ROLES, call: (t, c) => api(`/api/strikes/${c.strikeId}`, { token: t }) },
  { route: 'GET /api/dashboard', allowed: ROLES, call: t => api('/api/dashboard', { token: t }) },
  { route: 'POST /api/sets/:id/reanalyze', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/sets/${c.setId}/reanalyze`, { method: 'POST', token: t, body: {} }) },
  { route: 'POST /api/pieces/:id/reanalyze', allowed: ['owner', 'supervisor'], call: (t, c) => api(`/api/pieces/${c.pieceId}/reanalyze`, { method: 'POST', token: t, body: {} }) },
  { route: 'GET /api/strikes/:id/analyses', allowed: ROLES, call: (t, c) => api(`/api/strikes/${c.strikeId}/analyses`, { token: t }) },
  { route: 'POST /api/sets/:id/ship', allowed: ['owner', 'office'], call: (t, c) => api(`/api/sets/${c.setId}/ship`, { method: 'POST', token: t }) },
  { route: 'POST /api/team', allowed: ['owner'], call: t => api('/api/team', { method: 'POST', token: t, body: { name: 'N', email: `n-${Math.random()}@example.test`, role: 'office', temporaryPassword: 'temporary-pass-123' } }) },
]

const tokens = {} as Record<Role, string>
let ctx: Ctx
let foreign: { token: string, ctx: Ctx }

async function context(token: string): Promise<Ctx> {
  const set = await createSet(token, { fromNote: 'C4', toNote: 'C4' })
  const strike = await postStrike(token, set.pieces[0].id, strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0]))
  return { setId: set.id, pieceId: set.pieces[0].id, templateId: await templateId(token, 'Marimba bar, double (1 : 4)'), strikeId: strike.body.id }
}

beforeAll(async () => {
  const owner = await newWorkshop('Matrix workshop')
  tokens.owner = owner.token
  for (const role of ['supervisor', 'benchmaker', 'office'] as const) tokens[role] = (await memberWithRole(owner.token, role)).token
  ctx = await context(owner.token)
  const other = await newWorkshop('Other workshop')
  foreign = { token: other.token, ctx: await context(other.token) }
})

describe('role × route matrix', () => {
  for (const row of MATRIX) {
    for (const role of ROLES) {
      const allowed = row.allowed.includes(role)
      it(`${row.route} as ${role}: ${allowed ? 'allowed' : '403'}`, async () => {
        const reply = await row.call(tokens[role], ctx)
        if (allowed) expect(reply.status, JSON.stringify(reply)).not.toBe(403)
        else expect(reply.status).toBe(403)
        expect(reply.status).not.toBe(500)
      })
    }
  }
})

describe('tenant isolation', () => {
  const reads = [
    (c: Ctx) => `/api/sets/${c.setId}`,
    (c: Ctx) => `/api/pieces/${c.pieceId}`,
    (c: Ctx) => `/api/strikes/${c.strikeId}`,
    (c: Ctx) => `/api/strikes/${c.strikeId}/audio`,
    (c: Ctx) => `/api/strikes/${c.strikeId}/analyses`,
    (c: Ctx) => `/api/reanalysis?set=${c.setId}`,
    (c: Ctx) => `/api/templates/${c.templateId}`,
  ]
  for (const path of reads) {
    it(`answers 404 for another workshop's ${path({ setId: 'set', pieceId: 'piece', strikeId: 'strike', templateId: 'template' })}`, async () => {
      const reply = await api(path(foreign.ctx), { token: tokens.owner })
      expect(reply.status).toBe(404)
    })
  }

  it('does not list another workshop\'s pieces, nor change them', async () => {
    const list = await api(`/api/pieces?set=${foreign.ctx.setId}`, { token: tokens.owner })
    expect(list.body.total).toBe(0)
    const move = await api(`/api/pieces/${foreign.ctx.pieceId}/stage`, { method: 'POST', token: tokens.owner, body: { to: 'roughed' } })
    expect(move.status).toBe(404)
    const strike = await postStrike(tokens.owner, foreign.ctx.pieceId, strikeWav(261.63, [1, 4], [0, 0]))
    expect(strike.status).toBe(404)
    const own = await api(`/api/pieces/${foreign.ctx.pieceId}`, { token: foreign.token })
    expect(own.body.stage).toBe('tuning')
    expect(own.body.strikeCount).toBe(1)
  })
})
