// Seeds 100 000 strikes over 20 000 pieces in one workshop, then times the Pieces
// API (filtered by stage, sorted by worst cents, page 3 of 50) over HTTP.
import { performance } from 'node:perf_hooks'
import postgres from 'postgres'

const base = process.env.TW_BASE_URL!
const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 2, onnotice: () => {} })

async function json(path: string, init: RequestInit = {}) {
  const r = await fetch(`${base}${path}`, { ...init, headers: { 'content-type': 'application/json', ...init.headers } })
  if (!r.ok) throw new Error(`${path}: ${r.status} ${await r.text()}`)
  return r.json()
}

const email = `bench-${Date.now()}@example.test`
const { token, workshopId } = await json('/api/auth/signup', { method: 'POST', body: JSON.stringify({ name: 'Bench Owner', email, password: 'bench-password-1', workshopName: 'Benchmark workshop' }) })
const auth = { authorization: `Bearer ${token}` }
const templates = await json('/api/templates', { headers: auth })
const versionId = templates[0].current.id as string
const [user] = await sql`select user_id from memberships where workshop_id = ${workshopId}`

const t0 = performance.now()
// 400 sets of 50 pieces, 5 strikes each: 20 000 pieces, 100 000 strikes.
await sql`
  insert into sets (workshop_id, name, model, serial, buyer_name, buyer_email, from_note, to_note)
  select ${workshopId}, 'Set ' || g, 'BM-43', 'S-' || g, 'Buyer', 'buyer@example.test', 'A2', 'C7' from generate_series(1, 400) g`
await sql`
  insert into pieces (workshop_id, set_id, position, note, midi, target_hz, template_version_id, stage, strike_count, latest_verdict, latest_worst_cents, assignee_id)
  select ${workshopId}, s.id, p, 'N' || p, 44 + p, 110 * power(2, p / 12.0), ${versionId},
         (array['blank','roughed','tuning','review','approved','rework'])[1 + abs(p + hashtext(s.id::text)) % 6],
         5, (array['within','outside','incomplete'])[1 + p % 3], ((p * 37) % 61) - 30.0, ${user!.user_id}
  from sets s cross join generate_series(1, 50) p where s.workshop_id = ${workshopId}`
await sql`
  insert into strikes (workshop_id, piece_id, user_id, stage, audio_key, audio_bytes, audio_type, engine_version, analysis, fundamental_hz, worst_cents, verdict, created_at)
  select ${workshopId}, p.id, ${user!.user_id}, 'tuning', 'bench/' || p.id || '/' || k, 0, 'audio/wav', '1.0.0',
         jsonb_build_object('matches', jsonb_build_array(jsonb_build_object('label', 'fundamental', 'cents', k))), p.target_hz, k, 'outside', now() - k * interval '1 hour'
  from pieces p cross join generate_series(1, 5) k where p.workshop_id = ${workshopId}`
await sql`analyze`
const [{ n }] = await sql`select count(*)::int as n from strikes where workshop_id = ${workshopId}`
console.log(`seeded ${n} strikes over ${n / 5} pieces in ${((performance.now() - t0) / 1000).toFixed(1)} s`)

const path = '/api/pieces?stage=tuning&stage=review&sort=-cents&page=3&pageSize=50'
for (let i = 0; i < 20; i++) await json(path, { headers: auth }) // warm-up
const times: number[] = []
for (let i = 0; i < 200; i++) {
  const t = performance.now()
  const page = await json(path, { headers: auth })
  times.push(performance.now() - t)
  if (i === 0) console.log(`page of ${page.items.length} pieces, total ${page.total}`)
}
times.sort((a, b) => a - b)
const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!
console.log(`GET ${path}`)
console.log(`  200 requests: median ${q(0.5).toFixed(1)} ms, p95 ${q(0.95).toFixed(1)} ms, max ${times.at(-1)!.toFixed(1)} ms (goal: p95 under 50 ms)`)
await sql.end()
