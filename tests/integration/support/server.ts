import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'
import { fileURLToPath } from 'node:url'

import { SERVER_ENTRY } from './output'

const ROOT = fileURLToPath(new URL('../../../', import.meta.url))

/** A free loopback port, from the kernel. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer()
    probe.once('error', reject)
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      const port = typeof address === 'object' && address ? address.port : 0
      probe.close(() => resolve(port))
    })
  })
}

export interface ExtraServer { baseUrl: string, process: ChildProcess, log: () => string, stop: (signal?: NodeJS.Signals) => Promise<void> }

/**
 * A second instance of the built server (the same build as the test server, the same
 * database and secret from the environment scripts/test.sh exported) with `env` on top,
 * for tests that must kill or reconfigure a server. Answers once /api/health does.
 */
export async function startServer(env: Record<string, string>, port?: number): Promise<ExtraServer> {
  const listen = port ?? await freePort()
  const child = spawn(process.execPath, [SERVER_ENTRY], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(listen), NITRO_HOST: '127.0.0.1', NITRO_PORT: String(listen), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  const collect = (d: Buffer) => {
    output += d.toString()
  }
  child.stdout!.on('data', collect)
  child.stderr!.on('data', collect)
  const baseUrl = `http://127.0.0.1:${listen}`
  const stop = async (signal: NodeJS.Signals = 'SIGTERM') => {
    if (child.exitCode !== null || child.signalCode !== null) return
    const exited = new Promise(resolve => child.once('exit', resolve))
    child.kill(signal)
    await exited
  }
  for (let i = 0; i < 240; i++) {
    if (child.exitCode !== null) throw new Error(`the extra server exited: ${output}`)
    const ok = await fetch(`${baseUrl}/api/health`).then(r => r.status === 200, () => false)
    if (ok) return { baseUrl, process: child, log: () => output, stop }
    await new Promise(resolve => setTimeout(resolve, 250))
  }
  await stop('SIGKILL')
  throw new Error(`the extra server did not answer: ${output}`)
}
