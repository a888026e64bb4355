import { spawn } from 'node:child_process'
import { Agent, request } from 'node:http'
import { BASE_URL } from '../support/http'
import { OUTPUT_DIR, SERVER_ENTRY } from '../support/output'

/** The built server that scripts/test.sh starts. */
export { OUTPUT_DIR, SERVER_ENTRY }

/** Starts the built server with extra environment and collects what it says until it exits (or `timeoutMs`). */
export async function startBuiltServer(env: Record<string, string>, timeoutMs = 20_000) {
  const child = spawn(process.execPath, [SERVER_ENTRY], {
    env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: '0', NITRO_PORT: '0', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  child.stdout.on('data', (d: Buffer) => (output += d))
  child.stderr.on('data', (d: Buffer) => (output += d))
  const code = await new Promise<number | null>((resolve) => {
    const timer = setTimeout(() => {
      child.kill('SIGKILL')
      resolve(null)
    }, timeoutMs)
    child.on('exit', (c) => {
      clearTimeout(timer)
      resolve(c)
    })
  })
  return { code, output }
}

export interface RawReply {
  status: number
  headers: Record<string, string | string[] | undefined>
  body: string
  /** Body bytes written when the answer's headers arrived. */
  sentBytes: number
  /** Body bytes written in all (with `keepSending`, until the server cut the connection). */
  totalSent: number
  /** Whether the server closed the connection before the whole body was sent. */
  cut: boolean
  /** Milliseconds from the start of the request to the answer's headers. */
  ms: number
}

/**
 * A request through node:http, for what fetch hides: bodies sent piece by piece
 * (chunked unless `length` is given) and how much of the body had been written when
 * the answer came. Writing stops at the answer, or with `keepSending` goes on until
 * the body ends or the server cuts the connection.
 */
export function rawRequest(path: string, options: { method?: string, headers?: Record<string, string>, chunks?: Iterable<Uint8Array>, length?: number, keepSending?: boolean } = {}): Promise<RawReply> {
  const url = new URL(path, BASE_URL)
  const started = performance.now()
  return new Promise((resolve, reject) => {
    let sent = 0
    let reply: Omit<RawReply, 'totalSent' | 'cut'> | null = null
    let answered = false
    let ended = false
    let cut = false
    let bodyDone = false
    const finish = () => {
      if (reply && (bodyDone || cut || !options.keepSending)) {
        agent.destroy()
        resolve({ ...reply, totalSent: sent, cut })
      }
    }
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers }
    if (options.length !== undefined) headers['content-length'] = String(options.length)
    // A connection of its own (kept alive, as browsers do): one whose body was cut short must never carry the next request.
    const agent = new Agent({ keepAlive: true, maxSockets: 1 })
    const req = request(url, { method: options.method ?? 'POST', headers, agent }, (res) => {
      answered = true
      const sentBytes = sent
      const ms = performance.now() - started
      let body = ''
      res.setEncoding('utf8')
      res.on('data', (d: string) => (body += d))
      const done = () => {
        reply ??= { status: res.statusCode ?? 0, headers: res.headers, body, sentBytes, ms }
        finish()
      }
      res.on('end', done).on('close', done).on('error', () => {})
    })
    // The server cuts the connection some time after refusing a body: that ends our writing, not the test.
    req.on('error', (error) => {
      cut = true
      if (!answered) reject(error)
      else finish()
    })
    req.on('close', () => {
      if (!bodyDone) cut = true
      finish()
    })
    const iterator = (options.chunks ?? [])[Symbol.iterator]()
    // One chunk per turn of the event loop, so an answer is noticed while sending, as a browser would.
    const pump = () => {
      if (cut || req.destroyed || (answered && !options.keepSending)) return
      const next = iterator.next()
      if (next.done) {
        if (!ended) req.end(() => {
          bodyDone = true
          finish()
        })
        ended = true
        return
      }
      sent += next.value.byteLength
      if (req.write(next.value)) setImmediate(pump)
      else req.once('drain', pump)
    }
    pump()
  })
}

/** `count` chunks of `size` bytes each (the same zero-filled buffer). */
export function* zeroChunks(count: number, size = 64 * 1024): Generator<Uint8Array> {
  const chunk = new Uint8Array(size)
  for (let i = 0; i < count; i++) yield chunk
}
