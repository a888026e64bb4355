import { getResponseHeader, setResponseHeader } from 'h3'

/**
 * Pages get their nonce when they are rendered; answers of the renderer that are
 * not rendered pages (a redirect) would otherwise carry the placeholder
 * `'nonce-{{nonce}}'`. They run no script, so the source is dropped.
 */
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('beforeResponse', (event) => {
    const csp = getResponseHeader(event, 'content-security-policy')
    if (typeof csp === 'string' && csp.includes('{{nonce}}')) {
      setResponseHeader(event, 'content-security-policy', csp.replace(/\s*'nonce-\{\{nonce\}\}'/g, ''))
    }
  })
})
