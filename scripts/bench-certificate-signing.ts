/**
 * Signing figures against a running server: the time of the signing request for a
 * 4.3-octave marimba (52 pieces), the time until its PDF is stored by the job, and
 * how `GET /api/health` answers while the PDF is rendered. Signs up a throw-away
 * workshop of its own.
 *
 *   TW_BASE_URL=http://127.0.0.1:3000 npx tsx scripts/bench-certificate-signing.ts [re-issues]
 */
import { cpus, loadavg } from 'node:os'
import { encodeWav } from '../shared/analysis/encodeWav'
import { APPROVAL_UNDO_WINDOW_S } from '../shared/records/approvalWindow'
import { synthStrike } from '../shared/synthesis/synthStrike'
import { api, memberWithRole, newWorkshop } from '../tests/integration/support/http'

const runs = Number(process.argv[2] ?? 4)
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

const owner = await newWorkshop('Bench Bar Works')
const supervisor = await memberWithRole(owner.token, 'supervisor')
const bench = await memberWithRole(owner.token, 'benchmaker')
const template = (await api('/api/templates', { token: owner.token })).body.find((t: { name: string }) => t.name === 'Marimba bar, double (1 : 4)')
const created = await api('/api/sets', {
  method: 'POST', token: owner.token,
  body: { name: 'Concert marimba', model: 'HM-43', serial: `HM43-${Date.now().toString(36)}`, buyer: { name: 'R. Okafor', organisation: 'Millbrook School', email: 'buyer@example.test' }, referenceHz: 442, fromNote: 'A2', toNote: 'C7', chromatic: true, templateId: template.id },
})
if (created.status !== 201 && created.status !== 200) throw new Error(`set: ${created.status} ${JSON.stringify(created.body)}`)
const set = (await api(`/api/sets/${created.body.id}`, { token: owner.token })).body as { pieces: { id: string, targetHz: number }[] }
console.log(`recording and approving ${set.pieces.length} pieces…`)
for (const [i, piece] of set.pieces.entries()) {
  const samples = synthStrike([
    { frequencyHz: piece.targetHz, amplitudeDb: -8, decayDbPerS: 12 },
    { frequencyHz: piece.targetHz * 4, amplitudeDb: -16, decayDbPerS: 30 },
  ], { sampleRate: 44100, durationS: 1.2, onsetS: 0.1, noiseDb: -80, seed: i + 1 })
  const form = new FormData()
  form.set('file', new Blob([encodeWav(samples, 44100)], { type: 'audio/wav' }), `piece-${i + 1}.wav`)
  form.set('temperatureC', '20.5')
  const strike = await api(`/api/pieces/${piece.id}/strikes`, { method: 'POST', token: bench.token, body: form })
  if (strike.status !== 201) throw new Error(`strike: ${strike.status} ${JSON.stringify(strike.body)}`)
  const { stage } = (await api(`/api/pieces/${piece.id}`, { token: bench.token })).body as { stage: string }
  for (const to of stage === 'tuning' ? ['review'] : ['tuning', 'review']) await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to } })
  const approved = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: supervisor.token, body: { strikeId: strike.body.id ?? strike.body.strike?.id } })
  if (approved.status !== 200) throw new Error(`approve: ${approved.status} ${JSON.stringify(approved.body)}`)
}
// A set is signed only once its approvals are final (their undo window has passed).
await new Promise(r => setTimeout(r, (APPROVAL_UNDO_WINDOW_S + 1) * 1000))

/** Health latency samples (every 50 ms) until the certificate's PDF is stored; the time until then. */
async function untilPdf(id: string) {
  const started = performance.now()
  const health: number[] = []
  for (;;) {
    const t = performance.now()
    await fetch(`${process.env.TW_BASE_URL ?? 'http://127.0.0.1:3000'}/api/health`)
    health.push(performance.now() - t)
    const pdf = await fetch(`${process.env.TW_BASE_URL ?? 'http://127.0.0.1:3000'}/api/certificates/${id}/pdf`, { headers: { authorization: `Bearer ${owner.token}` } })
    await pdf.arrayBuffer()
    if (pdf.status === 200) return { pdfMs: performance.now() - started, health }
    await new Promise(r => setTimeout(r, 50))
  }
}

const signMs: number[] = []
const pdfMs: number[] = []
const health: number[] = []
let t = performance.now()
let cert = (await api(`/api/sets/${created.body.id}/certificates`, { method: 'POST', token: supervisor.token })).body
signMs.push(performance.now() - t)
for (let r = 0; ; r++) {
  const waited = await untilPdf(cert.id)
  pdfMs.push(waited.pdfMs)
  health.push(...waited.health)
  if (r >= runs) break
  t = performance.now()
  cert = (await api(`/api/certificates/${cert.id}/reissue`, { method: 'POST', token: supervisor.token, body: { reason: `Bench re-issue ${r + 1}` } })).body
  signMs.push(performance.now() - t)
  if (!cert.id) throw new Error(JSON.stringify(cert))
}
console.log(`signing request (${set.pieces.length} pieces): median ${median(signMs).toFixed(0)} ms over ${signMs.length} (min ${Math.min(...signMs).toFixed(0)}, max ${Math.max(...signMs).toFixed(0)})`)
console.log(`signed → PDF stored by the job: median ${median(pdfMs).toFixed(0)} ms`)
console.log(`GET /api/health while PDFs render: median ${median(health).toFixed(1)} ms, max ${Math.max(...health).toFixed(1)} ms over ${health.length} requests`)
console.log(`machine: ${cpus().length} cores, load average ${loadavg().map(l => l.toFixed(2)).join(' ')}`)
