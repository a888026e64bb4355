import { spawnSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('../../', import.meta.url))

/** The words of package.json's `analyze` script after `node`: its Node flags and the launcher. */
export function analyzeCommandWords(): string[] {
  const [command, ...words] = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).scripts.analyze as string).split(' ')
  if (command !== 'node') throw new Error(`package.json's analyze script no longer starts with node: ${command}`)
  return words
}

/**
 * Runs `npm run analyze -- ARGS` as package.json gives it, Node flags included, without npm's
 * own start-up. The flags matter: Node 20 can deadlock at exit while a background optimising
 * compile waits for the main thread (nodejs/node#54918); a run without them once hung after
 * printing its JSON.
 */
export function runAnalyzeCli(args: string[], options: { timeoutMs?: number, env?: NodeJS.ProcessEnv } = {}) {
  return spawnSync(process.execPath, [...analyzeCommandWords(), ...args], {
    cwd: root, encoding: 'utf8', timeout: options.timeoutMs ?? 90_000, env: options.env ?? process.env,
  })
}
