import { describe, expect, it } from 'vitest'
import { sendClaimedJob } from '../../../../server/utils/job-claim'

// A row as the queues see it: claimed by one sweep at a time, then given the job's id.
function fakeRow() {
  const row = { jobId: null as string | null, sends: 0 }
  const claim = async () => {
    if (row.jobId !== null) return false
    row.jobId = 'claimed'
    return true
  }
  const record = async (jobId: string | null) => {
    row.jobId = jobId
  }
  return { row, claim, record }
}

describe('sendClaimedJob', () => {
  it('sends the job once and records its id on the row', async () => {
    const { row, claim, record } = fakeRow()
    const send = async () => `job-${++row.sends}`
    expect(await sendClaimedJob(claim, send, record)).toBe(true)
    expect(await sendClaimedJob(claim, send, record)).toBe(false)
    expect(row).toEqual({ jobId: 'job-1', sends: 1 })
  })

  it('keeps the row claimed when the queue answers without a job id', async () => {
    const { row, claim, record } = fakeRow()
    await sendClaimedJob(claim, async () => null, record)
    expect(row.jobId).toBe('claimed')
  })

  it('frees the claim when sending fails, so the next sweep tries the row again', async () => {
    const { row, claim, record } = fakeRow()
    const down = async (): Promise<string> => {
      throw new Error('queue down')
    }
    await expect(sendClaimedJob(claim, down, record)).rejects.toThrow('queue down')
    expect(row.jobId).toBeNull()
    expect(await sendClaimedJob(claim, async () => 'job-2', record)).toBe(true)
    expect(row.jobId).toBe('job-2')
  })
})
