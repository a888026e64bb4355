import { BlockList, isIP } from 'node:net'
import type { H3Event } from 'h3'
import { getHeader } from 'h3'

/**
 * The trusted reverse proxies, from `NUXT_TRUSTED_PROXIES`: addresses or CIDR
 * ranges separated by commas or spaces (`127.0.0.1, 10.0.0.0/8, ::1`). Empty
 * means none: the socket's address is the client's and X-Forwarded-For is ignored.
 * Throws a plain sentence for an entry that is neither.
 */
export function parseTrustedProxies(setting: string): BlockList | null {
  const entries = setting.split(/[\s,]+/).filter(Boolean)
  if (entries.length === 0) return null
  const list = new BlockList()
  for (const entry of entries) {
    const [address = '', prefix] = entry.split('/')
    const family = isIP(address)
    const bits = prefix === undefined ? undefined : Number(prefix)
    const maxBits = family === 6 ? 128 : 32
    if (family === 0 || (bits !== undefined && !(Number.isInteger(bits) && bits >= 0 && bits <= maxBits))) {
      throw new Error(`NUXT_TRUSTED_PROXIES: "${entry}" is not an IP address or a CIDR range.`)
    }
    const type = family === 6 ? 'ipv6' : 'ipv4'
    if (bits === undefined) list.addAddress(address, type)
    else list.addSubnet(address, bits, type)
  }
  return list
}

/** IPv4 clients seen on an IPv6 socket appear as ::ffff:a.b.c.d; one spelling per client. */
function normalise(address: string): string {
  return /^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(address) ? address.slice(7) : address
}

function isTrusted(trusted: BlockList, address: string): boolean {
  const family = isIP(address)
  return family !== 0 && trusted.check(address, family === 6 ? 'ipv6' : 'ipv4')
}

/**
 * The client's address: the socket's, or, when the socket is a trusted proxy, the
 * X-Forwarded-For entries read from the right (nearest hop) and skipped while they
 * are trusted proxies too. Entries left of the first untrusted hop are whatever the
 * client wrote, so they are never used.
 */
export function resolveClientAddress(socketAddress: string, forwardedFor: string | undefined, trusted: BlockList | null): string {
  let current = normalise(socketAddress)
  if (!trusted || !forwardedFor) return current
  const hops = forwardedFor.split(',').map(h => normalise(h.trim())).reverse()
  for (const hop of hops) {
    if (!isTrusted(trusted, current) || isIP(hop) === 0) break
    current = hop
  }
  return current
}

let cached: { setting: string, list: BlockList | null } | undefined

/** The address that per-address limits count against (see DEVELOPERS.md, "Client addresses"). */
export function clientAddress(event: H3Event): string {
  const setting = String(useRuntimeConfig().trustedProxies ?? '')
  if (cached?.setting !== setting) cached = { setting, list: parseTrustedProxies(setting) }
  return resolveClientAddress(event.node.req.socket.remoteAddress ?? 'unknown', getHeader(event, 'x-forwarded-for'), cached.list)
}
