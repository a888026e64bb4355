import { spawn } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { SERVER_ENTRY } from '../support/output'

const server = SERVER_ENTRY

describe('configuration', () => {
  it('refuses to start in production without an auth secret, saying why', async () => {
    const child = spawn(process.execPath, [server], {
      env: { ...process.env, NODE_ENV: 'production', NUXT_AUTH_SECRET: '', PORT: '3999', HOST: '127.0.0.1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    })
    let output = ''
    const collect = (d: Buffer) => {
      output += d
    }
    child.stdout.on('data', collect)
    child.stderr.on('data', collect)
    const code = await new Promise<number | null>((resolve) => {
      const timer = setTimeout(() => {
        child.kill('SIGKILL')
        resolve(null)
      }, 20_000)
      child.on('exit', (c) => {
        clearTimeout(timer)
        resolve(c)
      })
    })
    expect(code).toBe(1)
    expect(output).toMatch(/set NUXT_AUTH_SECRET/)
  })
})
