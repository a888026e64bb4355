import postgres from 'postgres'
import { encodeWav } from '../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../shared/synthesis/synthStrike'
import { api, memberWithRole, newWorkshop, uniqueEmail } from './http'

/**
 * A small workshop with one set built through the API: pieces struck with
 * synthetic bars tuned exactly to their template (1 : 4), sent to review and
 * approved by a supervisor, so the set can be certified.
 */
export async function approvedSet(options: { from?: string, to?: string, serial?: string } = {}) {
  const owner = await newWorkshop('Larchmere Tuned Bars')
  const supervisor = await memberWithRole(owner.token, 'supervisor')
  const office = await memberWithRole(owner.token, 'office')
  const bench = await memberWithRole(owner.token, 'benchmaker')
  const templates = await api('/api/templates', { token: owner.token })
  const template = templates.body.find((t: { name: string }) => t.name === 'Marimba bar, double (1 : 4)')
  if (!template) throw new Error('starter template missing')
  const buyerEmail = uniqueEmail('buyer')
  const created = await api('/api/sets', {
    method: 'POST', token: office.token,
    body: {
      name: 'Practice marimba for the music room', model: 'LM-2 practice', serial: options.serial ?? `LM2-${Date.now().toString(36)}`,
      buyer: { name: 'Dana Whitcombe', organisation: 'Fernhill Community School', email: buyerEmail },
      referenceHz: 442, fromNote: options.from ?? 'C5', toNote: options.to ?? 'C7', chromatic: false, templateId: template.id,
    },
  })
  if (created.status !== 200 && created.status !== 201) throw new Error(`set: ${created.status} ${JSON.stringify(created.body)}`)
  const set = (await api(`/api/sets/${created.body.id}`, { token: owner.token })).body
  return { owner, supervisor, office, bench, set, buyerEmail, template }
}

/**
 * Makes the set's approvals final at once, as if their undo window had passed: no API may
 * do this, so it is direct SQL on the database the server uses (the pair's for the
 * two-instance test).
 */
export async function finishApprovals(setId: string, databaseUrl = process.env.NUXT_DATABASE_URL!) {
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} })
  try {
    await sql`update pieces set approval_final_at = now() - interval '1 second' where set_id = ${setId} and approval_final_at > now()`
  }
  finally {
    await sql.end()
  }
}

/** Strikes, reviews and approves every piece of the set, and lets the approvals become final. */
export async function approveAll(ctx: Awaited<ReturnType<typeof approvedSet>>, options: { databaseUrl?: string } = {}) {
  for (const [i, piece] of (ctx.set.pieces as { id: string, targetHz: number }[]).entries()) {
    const samples = synthStrike([
      { frequencyHz: piece.targetHz, amplitudeDb: -8, decayDbPerS: 12 },
      { frequencyHz: piece.targetHz * 4, amplitudeDb: -16, decayDbPerS: 30 },
    ], { sampleRate: 44100, durationS: 1.2, onsetS: 0.1, noiseDb: -80, seed: i + 1 })
    const form = new FormData()
    form.set('file', new Blob([encodeWav(samples, 44100)], { type: 'audio/wav' }), `piece-${i + 1}.wav`)
    form.set('temperatureC', (20 + (i % 3) * 0.5).toFixed(1))
    form.set('humidityPct', String(42 + (i % 4)))
    const strike = await api(`/api/pieces/${piece.id}/strikes`, { method: 'POST', token: ctx.bench.token, body: form })
    if (strike.status !== 201) throw new Error(`strike: ${strike.status} ${JSON.stringify(strike.body)}`)
    // Striking may already have moved the piece to tuning.
    const { stage } = (await api(`/api/pieces/${piece.id}`, { token: ctx.bench.token })).body as { stage: string }
    for (const to of stage === 'tuning' ? ['review'] : ['tuning', 'review']) {
      const moved = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: ctx.bench.token, body: { to } })
      if (moved.status !== 200) throw new Error(`stage ${to}: ${moved.status} ${JSON.stringify(moved.body)}`)
    }
    const strikeId = strike.body.id ?? strike.body.strike?.id
    const approved = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: ctx.supervisor.token, body: { strikeId } })
    if (approved.status !== 200) throw new Error(`approve: ${approved.status} ${JSON.stringify(approved.body)}`)
  }
  await finishApprovals(ctx.set.id, options.databaseUrl)
}
