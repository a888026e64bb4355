// Nuxt 4 configuration. Every setting that differs between machines comes from
// runtime config, overridden by NUXT_* environment variables at start.
import { buildAnalysisWorker } from './scripts/build-analysis-worker'
import { addWorkerEntries } from './server/workers/entries'
import { ROLES } from './shared/auth/roles'

export default defineNuxtConfig({
  // Local modules in modules/ (the development-only Mailbox) are registered by Nuxt itself.
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', '@sidebase/nuxt-auth', '@nuxt/eslint', 'nuxt-security'],
  $development: {
    runtimeConfig: { public: { devMailbox: true } },
    // `nuxt dev` reloads the page over its own socket.
    security: { headers: { contentSecurityPolicy: { 'connect-src': ['\'self\'', 'ws:', 'wss:'] } } },
  },
  devtools: { enabled: false },
  app: {
    head: {
      title: 'Tonewright',
      htmlAttrs: { lang: 'en' },
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  css: [
    '@fontsource/ibm-plex-sans/400.css',
    '@fontsource/ibm-plex-sans/500.css',
    '@fontsource/ibm-plex-sans/600.css',
    '~/assets/css/main.css',
  ],
  runtimeConfig: {
    databaseUrl: 'postgres://tonewright@127.0.0.1:54329/tonewright',
    authSecret: '',
    sessionMaxAgeS: 60 * 60 * 24 * 7,
    signInMaxPerAddress: 30,
    // Reverse proxies whose X-Forwarded-For is believed (addresses or CIDR ranges, comma-separated); none by default.
    trustedProxies: '',
    // Strike audio and certificate PDFs: `fs` (files under dir) or `s3` (an S3-compatible bucket;
    // without keys the SDK's own credential chain is used). NUXT_STORAGE_DRIVER, NUXT_STORAGE_BUCKET, …
    storage: { driver: 'fs', dir: '.data/storage', bucket: '', region: 'us-east-1', endpoint: '', forcePathStyle: false, accessKeyId: '', secretAccessKey: '' },
    // Worker threads that decode and measure strikes (0: the machine's available
    // parallelism), tasks that may wait (0: twice the threads), the Retry-After of a full queue,
    // and a worker file other than the bundle beside the built server (empty: that bundle).
    analysis: { threads: 0, maxQueue: 0, retryAfterS: 5, workerFile: '' },
    // Strike audio whose row never committed is removed after olderThanS, checked every intervalS.
    strikeUploadSweep: { intervalS: 300, olderThanS: 600 },
    smtp: { host: '127.0.0.1', port: 2525, user: '', pass: '', from: 'Tonewright <certificates@tonewright.test>' },
    // Where links in certificates and e-mails point (the public address of this app).
    siteUrl: 'http://127.0.0.1:3000',
    // Delivery retries of the mail queue: attempts after the first, and the first delay (doubling).
    mailRetry: { limit: 6, delayS: 3 },
    // How long a mail worker's claim on a message holds (s): longer than any SMTP conversation.
    mailLeaseS: 300,
    // Folder of the local SMTP catcher, read by the development Mailbox screen.
    mailCatcherDir: '.data/mail',
    // The Mailbox screen (modules/dev-mailbox.ts) exists only under `nuxt dev`; production refuses to start with this on.
    public: { devMailbox: false },
  },
  compatibilityDate: '2025-07-15',
  nitro: {
    // `npm test` builds into its own folder so that it never replaces a running `npm start`'s files.
    output: { dir: process.env.TONEWRIGHT_OUTPUT_DIR || '.output' },
    hooks: {
      // Worker-thread entries (PDF rendering) are built beside the server.
      'rollup:before': (nitro, config) => addWorkerEntries(config, nitro.options.rootDir),
      // The analysis pool's worker is its own bundle beside the built server (<output>/server/workers).
      async compiled(nitro) {
        if (nitro.options.dev) return
        await buildAnalysisWorker(nitro.options.output.serverDir)
      },
    },
  },
  typescript: { strict: true },
  telemetry: false,
  auth: {
    isEnabled: true,
    baseURL: '/api/auth',
    originEnvKey: 'NUXT_AUTH_ORIGIN',
    globalAppMiddleware: { isEnabled: true, allow404WithoutAuth: true, addDefaultCallbackUrl: true },
    sessionRefresh: { enableOnWindowFocus: true, enablePeriodically: false },
    provider: {
      type: 'local',
      pages: { login: '/signin' },
      endpoints: {
        signIn: { path: '/login', method: 'post' },
        signOut: { path: '/logout', method: 'post' },
        signUp: { path: '/signup', method: 'post' },
        getSession: { path: '/session', method: 'get' },
      },
      token: {
        signInResponseTokenPointer: '/token',
        type: 'Bearer',
        cookieName: 'auth.token',
        headerName: 'Authorization',
        maxAgeInSeconds: 60 * 60 * 24 * 7,
        sameSiteAttribute: 'lax',
      },
      session: {
        dataType: {
          id: 'string',
          email: 'string',
          name: 'string',
          workshopId: 'string',
          workshopName: 'string',
          role: ROLES.map(role => `'${role}'`).join(' | '),
          workshops: '{ id: string, name: string, role: string }[]',
          mustChangePassword: 'boolean',
          settings: '{ timeZone: string, locale: string, temperatureUnit: \'C\' | \'F\', referenceHz: number } | null',
        },
      },
    },
  },
  eslint: { config: { stylistic: true } },
  // Security headers on every response and a nonce-based Content-Security-Policy on
  // every page. Request size, content type and origin checks are ours
  // (server/middleware/request-guard.ts): they count bytes as they arrive, which the
  // module's Content-Length check does not, and the sign-in limits live in PostgreSQL
  // (shared by every instance), so the module's in-memory limiter is off.
  security: {
    nonce: true,
    headers: {
      contentSecurityPolicy: {
        'default-src': ['\'self\''],
        'base-uri': ['\'none\''],
        'object-src': ['\'none\''],
        'frame-ancestors': ['\'none\''],
        'form-action': ['\'self\''],
        // No 'strict-dynamic': it would ignore 'self', which the code-split chunks and the capture worklet need.
        'script-src': ['\'self\'', '\'nonce-{{nonce}}\''],
        'script-src-attr': ['\'none\''],
        'style-src': ['\'self\'', '\'nonce-{{nonce}}\''],
        // Vue renders :style bindings as style attributes (bar widths, stage colours).
        'style-src-attr': ['\'unsafe-inline\''],
        'img-src': ['\'self\'', 'data:'],
        'font-src': ['\'self\'', 'data:'],
        'connect-src': ['\'self\''],
        'media-src': ['\'self\'', 'blob:'],
        'worker-src': ['\'self\''],
        'manifest-src': ['\'self\''],
        'frame-src': ['\'self\''],
        'upgrade-insecure-requests': false,
      },
      xFrameOptions: 'DENY',
      xContentTypeOptions: 'nosniff',
      referrerPolicy: 'same-origin',
      crossOriginEmbedderPolicy: false,
      // The Bench needs the microphone of its own page; nothing else is used.
      permissionsPolicy: { 'camera': [], 'display-capture': [], 'fullscreen': ['self'], 'geolocation': [], 'microphone': ['self'], 'payment': [], 'usb': [] },
    },
    rateLimiter: false,
    requestSizeLimiter: false,
    xssValidator: false,
    corsHandler: false,
    removeLoggers: false,
  },
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts' },
})
