/**
 * Memory and time of refusing an oversized upload: sends a 56 MB multipart body
 * chunked (no Content-Length) to a running server and samples the server's RSS
 * (/proc/PID/status) while it arrives; then the same with a 49 MB body, which is
 * read whole (and refused by the engine as not audio).
 *
 *   TW_BASE_URL=http://127.0.0.1:3000 npx tsx scripts/bench-upload.ts
 *
 * The server's process is found by the port it listens on (`ss`), or given as TW_SERVER_PID.
 */
import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { request } from 'node:http'
import { randomUUID } from 'node:crypto'

const BASE = process.env.TW_BASE_URL ?? 'http://127.0.0.1:3000'
const MB = 1024 * 1024

function serverPid(): number {
  if (process.env.TW_SERVER_PID) return Number(process.env.TW_SERVER_PID)
  const port = new URL(BASE).port || '80'
  const out = execFileSync('ss', ['-ltnpH', `sport = :${port}`], { encoding: 'utf8' })
  const match = /pid=(\d+)/.exec(out)
  if (!match) throw new Error(`No process found listening on port ${port}; set TW_SERVER_PID.`)
  return Number(match[1])
}

const rssMb = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))![1]) / 1024

async function json<T>(path: string, init: { method?: string, token?: string, body?: unknown } = {}): Promise<T> {
  const response = await fetch(`${BASE}${path}`, {
    method: init.method ?? 'GET',
    headers: { 'content-type': 'application/json', ...(init.token ? { authorization: `Bearer ${init.token}` } : {}) },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  })
  return response.json() as Promise<T>
}

function send(path: string, token: string, fileBytes: number): Promise<{ status: number, ms: number, sentMb: number }> {
  const boundary = 'benchboundary'
  const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.wav"\r\nContent-Type: audio/wav\r\n\r\n`)
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`)
  const chunk = Buffer.alloc(64 * 1024)
  const started = performance.now()
  return new Promise((resolve, reject) => {
    let sent = 0
    let left = fileBytes
    let answered = false
    const req = request(`${BASE}${path}`, { method: 'POST', headers: { 'authorization': `Bearer ${token}`, 'content-type': `multipart/form-data; boundary=${boundary}` } }, (res) => {
      answered = true
      const result = { status: res.statusCode ?? 0, ms: performance.now() - started, sentMb: sent / MB }
      res.resume()
      res.on('end', () => resolve(result))
    })
    req.on('error', error => (answered ? undefined : reject(error)))
    req.write(head)
    const pump = () => {
      while (!answered && left > 0) {
        const n = Math.min(chunk.length, left)
        left -= n
        sent += n
        if (!req.write(n === chunk.length ? chunk : chunk.subarray(0, n))) return void req.once('drain', pump)
      }
      if (!answered) req.end(tail)
    }
    pump()
  })
}

async function measure(label: string, pid: number, path: string, token: string, fileBytes: number) {
  const before = rssMb(pid)
  let peak = before
  const timer = setInterval(() => (peak = Math.max(peak, rssMb(pid))), 10)
  const result = await send(path, token, fileBytes)
  await new Promise(r => setTimeout(r, 300))
  clearInterval(timer)
  console.log(`${label}: HTTP ${result.status} after ${result.ms.toFixed(0)} ms, ${result.sentMb.toFixed(1)} MB written by then; server RSS ${before.toFixed(0)} MB before, peak ${peak.toFixed(0)} MB (+${(peak - before).toFixed(0)} MB)`)
}

const pid = serverPid()
const email = `bench-upload-${randomUUID().slice(0, 8)}@example.test`
const signup = await json<{ token: string }>('/api/auth/signup', { method: 'POST', body: { name: 'Bench Upload', email, password: 'correct-horse-battery', workshopName: 'Upload bench' } })
const token = signup.token
const templates = await json<{ id: string, name: string }[]>('/api/templates', { token })
const template = templates.find(t => t.name.startsWith('Marimba'))!
const created = await json<{ id: string }>('/api/sets', { method: 'POST', token, body: { name: 'Upload bench', model: 'B-1', serial: `UB-${Date.now()}`, buyer: { name: 'A Buyer', email: 'buyer@example.test' }, referenceHz: 440, fromNote: 'C4', toNote: 'C4', chromatic: true, templateId: template.id } })
const set = await json<{ pieces: { id: string }[] }>(`/api/sets/${created.id}`, { token })
const path = `/api/pieces/${set.pieces[0]!.id}/strikes`
console.log(`server pid ${pid} at ${BASE}`)
await measure('56 MB chunked upload (refused)', pid, path, token, 56 * MB)
await measure('49 MB chunked upload (read whole, not audio)', pid, path, token, 49 * MB)
