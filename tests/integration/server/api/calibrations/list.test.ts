import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'

const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(() => sql.end())

async function stored(workshopId: string, device: string, offsetPpm: number, daysAgo: number, operatorId: string | null = null) {
  await sql`insert into calibrations (workshop_id, device, reference_hz, reference_uncertainty_ppm, reference_description, measured_hz, offset_ppm, uncertainty_ppm, operator_id, created_at)
    values (${workshopId}, ${device}, 1000, 0.5, 'Reference fork, calibrated', ${1000 * (1 + offsetPpm * 1e-6)}, ${offsetPpm}, 0.4, ${operatorId}, now() - make_interval(days => ${daysAgo}))`
}

describe('GET /api/calibrations', () => {
  it('lists each device\'s current calibration and its history newest first, with expiry', async () => {
    const owner = await newWorkshop('Calibration list')
    await stored(owner.workshopId, 'Interface A', 40.1, 200, owner.userId)
    await stored(owner.workshopId, 'Interface A', 41.3, 100, owner.userId)
    await stored(owner.workshopId, 'Interface A', 42.0, 10, owner.userId)
    await stored(owner.workshopId, 'Field recorder', -12.5, 95)
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const reply = await api('/api/calibrations', { token: bench.token })
    expect(reply.status).toBe(200)
    expect(reply.body.validDays).toBe(90)
    const byName = Object.fromEntries(reply.body.devices.map((d: { device: string }) => [d.device, d]))
    expect(Object.keys(byName).sort()).toEqual(['Field recorder', 'Interface A'])
    const a = byName['Interface A']
    expect(a.history.map((c: { offsetPpm: number }) => c.offsetPpm)).toEqual([42.0, 41.3, 40.1])
    expect(a.current).toEqual(a.history[0])
    expect(a.current).toMatchObject({ expired: false, daysLeft: 79, operatorName: 'Test Owner', referenceHz: 1000, referenceUncertaintyPpm: 0.5, referenceDescription: 'Reference fork, calibrated', uncertaintyPpm: 0.4 })
    expect(Date.parse(a.current.expiresAt) - Date.parse(a.current.measuredAt)).toBe(90 * 86_400_000)
    expect(byName['Field recorder'].current).toMatchObject({ expired: true, daysLeft: -5, operatorName: null })
  })

  it('shows nothing of another workshop, refuses office (403) and strangers (401)', async () => {
    const owner = await newWorkshop('List owner')
    const other = await newWorkshop('List other')
    await stored(other.workshopId, 'Their interface', 10, 1)
    expect((await api('/api/calibrations', { token: owner.token })).body.devices).toEqual([])
    const office = await memberWithRole(owner.token, 'office')
    expect((await api('/api/calibrations', { token: office.token })).status).toBe(403)
    expect((await api('/api/calibrations', {})).status).toBe(401)
    const header = await api('/api/calibrations', { token: owner.token, headers: { 'x-workshop-id': other.workshopId } })
    expect(header.status).toBe(404)
  })
})
