// npm run bench:pieces [-- --strikes 1000000 --pieces 200000 --workshops 11]: seeds one
// workshop with `--strikes` strikes over `--pieces` pieces (sets of 50) and `--workshops` − 1
// others of the same size, one piece of the first with 50 full-size results, then times
// over HTTP the Pieces API (filtered by stage, sorted by worst cents, page 3 of 50) and that
// piece's page, and prints the plans PostgreSQL chose for their queries (EXPLAIN ANALYZE).
// Run by scripts/bench-pieces.sh, which starts a throw-away database and server.
import { performance } from 'node:perf_hooks'
import { parseArgs } from 'node:util'
import { drizzle } from 'drizzle-orm/postgres-js'
import postgres from 'postgres'
import * as schema from '../server/database/schema'
import type { Member } from '../server/utils/auth'
import { getPiece, listPieces } from '../server/utils/pieces'
import { PieceQuerySchema } from '../shared/schemas/records'

const { values } = parseArgs({ options: { 'strikes': { type: 'string', default: '100000' }, 'pieces': { type: 'string' }, 'workshops': { type: 'string', default: '1' }, 'measure-only': { type: 'boolean', default: false } } })
const STRIKES = Number(values.strikes)
const PIECES = Number(values.pieces ?? Math.round(STRIKES / 5))
const WORKSHOPS = Number(values.workshops)
const SETS = Math.ceil(PIECES / 50)
const PER_PIECE = Math.max(1, Math.round(STRIKES / PIECES))
if (![STRIKES, PIECES, WORKSHOPS].every(n => Number.isInteger(n) && n > 0)) throw new Error('--strikes, --pieces and --workshops take whole numbers above 0')

const base = process.env.TW_BASE_URL!
const app = postgres(process.env.NUXT_DATABASE_URL!, { max: 2, onnotice: () => {} })
// The administrator seeds: with foreign-key triggers off (session_replication_role) and the
// indexes built after the rows, a million strikes load in a fraction of the time.
const admin = postgres(process.env.TONEWRIGHT_BENCH_ADMIN_URL ?? process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
const seconds = (t: number) => `${((performance.now() - t) / 1000).toFixed(1)} s`

async function json(path: string, init: RequestInit = {}) {
  const r = await fetch(`${base}${path}`, { ...init, headers: { 'content-type': 'application/json', ...init.headers } })
  if (!r.ok) throw new Error(`${path}: ${r.status} ${await r.text()}`)
  return r.json()
}

async function signUp(n: number) {
  const email = `bench-${Date.now()}-${n}@example.test`
  const { token, workshopId } = await json('/api/auth/signup', { method: 'POST', body: JSON.stringify({ name: 'Bench Owner', email, password: 'bench-password-1', workshopName: `Benchmark workshop ${n}` }) })
  const templates = await json('/api/templates', { headers: { authorization: `Bearer ${token}` } })
  const [user] = await app`select user_id from memberships where workshop_id = ${workshopId}`
  return { token: token as string, workshopId: workshopId as string, userId: user!.user_id as string, versionId: templates[0].current.id as string }
}

async function seedWorkshop(sql: postgres.TransactionSql, w: { workshopId: string, userId: string, versionId: string }) {
  await sql`
    insert into sets (workshop_id, name, model, serial, buyer_name, buyer_email, from_note, to_note)
    select ${w.workshopId}, 'Set ' || g, 'BM-43', 'S-' || g, 'Buyer', 'buyer@example.test', 'A2', 'C7' from generate_series(1, ${SETS}) g`
  await sql`
    insert into pieces (workshop_id, set_id, position, note, midi, target_hz, template_version_id, stage, strike_count, latest_verdict, latest_worst_cents, assignee_id)
    select ${w.workshopId}, s.id, p, 'N' || p, 44 + p, 110 * power(2, p / 12.0), ${w.versionId},
           (array['blank','roughed','tuning','review','approved','rework'])[1 + abs(p + hashtext(s.id::text)) % 6],
           ${PER_PIECE}, (array['within','outside','incomplete'])[1 + p % 3], ((p * 37 + hashtext(s.id::text)) % 61) - 30.0, ${w.userId}
    from sets s cross join generate_series(1, 50) p where s.workshop_id = ${w.workshopId} and (s.serial = 'S-' || ${SETS} and p <= ${PIECES - (SETS - 1) * 50} or s.serial <> 'S-' || ${SETS})`
  await sql`
    insert into strikes (workshop_id, piece_id, user_id, stage, audio_key, audio_bytes, audio_type, engine_version, analysis, fundamental_hz, worst_cents, verdict, created_at)
    select ${w.workshopId}, p.id, ${w.userId}, 'tuning', 'bench/' || p.id || '/' || k, 0, 'audio/wav', '1.0.0',
           jsonb_build_object('matches', jsonb_build_array(jsonb_build_object('label', 'fundamental', 'cents', k))), p.target_hz, k, 'outside', now() - k * interval '1 hour'
    from pieces p cross join generate_series(1, ${PER_PIECE}) k where p.workshop_id = ${w.workshopId}`
}

/** A result the size the engine stores for a real strike (60 partials, 8 matches). */
function fullResult(k: number) {
  const partials = Array.from({ length: 60 }, (_, i) => ({ frequencyHz: 440 * (i + 1) * 1.01, amplitudeDb: -10 - i, decayDbPerS: 3 + i, t60S: 20 / (1 + i), r2: 0.99, startS: 0.02, endS: 3.9, stabilityCents: 0.4, beatHz: null, modulationHz: null, modulationDepthDb: null, uncertaintyCents: 0.3 }))
  const matches = Array.from({ length: 8 }, (_, i) => ({ label: `partial ${i + 1}`, ratio: i + 1, targetHz: 440 * (i + 1), measuredHz: 440 * (i + 1) + k / 10, cents: k / 10 - 2, rawCents: k / 10 - 2, toleranceCents: 5, within: true, direction: 'sharp', required: i < 3, missing: false }))
  return { engineVersion: '2.0.0', partials, matches, verdict: 'within', guidance: [], warnings: [] }
}

/** --measure-only: the database seeded by the last run (bench-pieces.sh keeps it), measured again. */
async function lastRun() {
  const [owner] = await app`select u.email, m.workshop_id, m.user_id from users u join memberships m on m.user_id = u.id where u.email like 'bench-%-0@example.test' order by u.created_at desc limit 1`
  if (!owner) throw new Error('No earlier seed to measure; run without --measure-only first.')
  const { token } = await json('/api/auth/login', { method: 'POST', body: JSON.stringify({ email: owner.email, password: 'bench-password-1' }) })
  const [piece] = await app`select id from pieces where workshop_id = ${owner.workshop_id} and strike_count = 50 limit 1`
  return { main: { token: token as string, workshopId: owner.workshop_id as string, userId: owner.user_id as string }, piece: piece! }
}

const t0 = performance.now()
const seeded = values['measure-only'] ? await lastRun() : await seed()
const { main, piece } = seeded

async function seed() {
  const main = await signUp(0)
  const others = []
  for (let n = 1; n < WORKSHOPS; n++) others.push(await signUp(n))
  // Indexes are dropped while the rows load and built again from their own definitions afterwards.
  const indexes = await admin<{ name: string, def: string }[]>`
  select indexname as name, indexdef as def from pg_indexes i
  where schemaname = 'public' and tablename in ('pieces', 'strikes', 'sets')
    and not exists (select 1 from pg_constraint c where c.conname = i.indexname)`
  await admin.begin(async (tx) => {
    await tx`set local session_replication_role = replica`
    for (const index of indexes) await tx.unsafe(`drop index ${index.name}`)
    for (const [n, w] of [main, ...others].entries()) {
      const t = performance.now()
      await seedWorkshop(tx, w)
      console.log(`workshop ${n + 1}/${WORKSHOPS}: ${SETS} sets, ${PIECES} pieces, ${PIECES * PER_PIECE} strikes in ${seconds(t)}`)
    }
  })
  let t = performance.now()
  for (const index of indexes) await admin.unsafe(index.def)
  console.log(`${indexes.length} indexes built in ${seconds(t)}`)
  // The piece page: one piece with 50 strikes carrying full-size results.
  const [piece] = await admin`select id from pieces where workshop_id = ${main.workshopId} order by set_id, position limit 1`
  for (let k = PER_PIECE + 1; k <= 50; k++) {
    await admin`
    insert into strikes (workshop_id, piece_id, user_id, stage, audio_key, audio_bytes, audio_type, engine_version, analysis, fundamental_hz, worst_cents, verdict, created_at)
    values (${main.workshopId}, ${piece!.id}, ${main.userId}, 'tuning', ${`bench/${piece!.id}/${k}`}, 0, 'audio/wav', '2.0.0', ${admin.json(fullResult(k))}, 440, ${k / 10 - 2}, 'within', now() - ${k} * interval '1 minute')`
  }
  await admin`update pieces set strike_count = 50 where id = ${piece!.id}`
  t = performance.now()
  await admin`vacuum analyze sets, pieces, strikes`
  console.log(`vacuum analyze in ${seconds(t)}`)
  const [{ n }] = await app`select count(*)::int as n from strikes`
  const [{ size }] = await app`select pg_size_pretty(pg_database_size(current_database())) as size`
  console.log(`seeded ${n} strikes in ${WORKSHOPS} workshop(s) (${size}) in ${seconds(t0)}`)
  return { main, piece: piece! }
}

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))]!
async function timeRequests(path: string, token: string) {
  for (let i = 0; i < 20; i++) await json(path, { headers: { authorization: `Bearer ${token}` } }) // warm-up
  const times: number[] = []
  for (let i = 0; i < 200; i++) {
    const t = performance.now()
    await json(path, { headers: { authorization: `Bearer ${token}` } })
    times.push(performance.now() - t)
  }
  console.log(`GET ${path}`)
  console.log(`  200 requests: median ${quantile(times, 0.5).toFixed(1)} ms, p95 ${quantile(times, 0.95).toFixed(1)} ms, max ${Math.max(...times).toFixed(1)} ms (goal: p95 under 50 ms)`)
}

const listPath = '/api/pieces?stage=tuning&stage=review&sort=-cents&page=3&pageSize=50'
const page = await json(listPath, { headers: { authorization: `Bearer ${main.token}` } })
console.log(`page of ${page.items.length} pieces, total ${page.total}`)
await timeRequests(listPath, main.token)
await timeRequests(`/api/pieces/${piece!.id}`, main.token)

// The same service functions the routes call, with their SQL caught and explained.
const caught: { query: string, params: unknown[] }[] = []
const db = drizzle(app, { schema, logger: { logQuery: (query, params) => caught.push({ query, params }) } })
const member = { workshopId: main.workshopId, userId: main.userId } as Member
await listPieces(db, member, PieceQuerySchema.parse({ stage: ['tuning', 'review'], sort: '-cents', page: '3', pageSize: '50' }))
await getPiece(db, main.workshopId, piece!.id)
for (const { query, params } of caught) {
  const plan = await app.unsafe(`explain (analyze, buffers) ${query}`, params as never[])
  console.log(`\n${query}\n${plan.map(row => `  ${row['QUERY PLAN']}`).join('\n')}`)
}
await app.end()
await admin.end()
