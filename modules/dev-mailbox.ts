import { addServerHandler, createResolver, defineNuxtModule, extendPages } from '@nuxt/kit'

/**
 * The Mailbox (screen and API over the local mail catcher's folder) exists only
 * under `nuxt dev`: a production build never contains its page or its routes,
 * whatever the environment says at start.
 */
export default defineNuxtModule({
  meta: { name: 'tonewright-dev-mailbox' },
  setup(_options, nuxt) {
    if (!nuxt.options.dev) return
    const { resolve } = createResolver(import.meta.url)
    extendPages((pages) => {
      pages.push({ name: 'mailbox', path: '/mailbox', file: resolve('../app/dev/MailboxPage.vue') })
    })
    addServerHandler({ route: '/api/dev/mailbox', method: 'get', handler: resolve('../server/dev/mailbox.get.ts') })
    addServerHandler({ route: '/api/dev/mailbox/:id/:file', method: 'get', handler: resolve('../server/dev/mailbox-attachment.get.ts') })
  },
})
