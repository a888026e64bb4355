import { execFileSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import { afterAll, describe, expect, it } from 'vitest'
import { api } from '../../support/http'

const control = fileURLToPath(new URL('../../../../scripts/pg-control.sh', import.meta.url))
const dir = process.env.TW_PG_DIR!
const port = process.env.TW_PG_PORT!

function pg(action: 'start' | 'stop') {
  execFileSync('bash', [control, action, dir, port], { stdio: 'inherit' })
}

async function healthWithin(status: number, seconds: number) {
  const until = Date.now() + seconds * 1000
  let last = 0
  while (Date.now() < until) {
    last = (await api('/api/health')).status
    if (last === status) return last
    await new Promise(r => setTimeout(r, 250))
  }
  return last
}

describe('health', () => {
  afterAll(() => pg('start'))

  it('answers ok with the database up, 503 while PostgreSQL is stopped, and ok again when it returns', async () => {
    const up = await api('/api/health')
    expect(up.status).toBe(200)
    expect(up.body).toEqual({ ok: true, db: true })

    pg('stop')
    expect(await healthWithin(503, 15)).toBe(503)
    const down = await api('/api/health')
    expect(down.body).toEqual({ ok: false, db: false })

    pg('start')
    expect(await healthWithin(200, 30)).toBe(200)
  })
})
