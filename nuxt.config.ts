import { fileURLToPath } from 'node:url'

export default defineNuxtConfig({
  compatibilityDate: '2025-07-15',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', 'nuxt-security'],
  css: [
    '@fontsource/inter/400.css',
    '@fontsource/inter/500.css',
    '@fontsource/inter/600.css',
    '@fontsource/inter/700.css',
    'leaflet/dist/leaflet.css',
  ],
  tailwindcss: { cssPath: '~/assets/css/tailwind.css', viewer: false },
  devtools: { enabled: false },
  telemetry: false,
  app: {
    head: {
      title: 'Passagewright',
      htmlAttrs: { lang: 'en' },
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    smtpUrl: 'smtp://127.0.0.1:2525',
    // The installation's sender, for companies that have not set their own (company settings, mailFrom).
    mailFrom: 'Passagewright <passages@passagewright.example>',
    tileCacheDir: '',
    outboxWorker: 'on',
    tableWorker: 'on',
    // Behind a TLS-terminating proxy: trust its X-Forwarded-Proto / X-Forwarded-Host (NUXT_TRUST_PROXY=on).
    trustProxy: 'off',
    // Further origins whose pages may write (NUXT_TRUSTED_ORIGINS, comma-separated), e.g. when a proxy rewrites Host.
    trustedOrigins: '',
    // Sealed-cookie sessions: no server state, so any number of instances share them.
    session: { maxAge: 60 * 60 * 12, cookie: { httpOnly: true, sameSite: 'lax', secure: true } },
  },
  security: {
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'base-uri': ["'none'"],
        'connect-src': ["'self'"],
        'font-src': ["'self'", 'data:'],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'object-src': ["'none'"],
        'script-src-attr': ["'none'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        // Leaflet positions its panes with inline style attributes.
        'style-src': ["'self'", "'unsafe-inline'"],
        'worker-src': ["'self'"],
        'upgrade-insecure-requests': false,
      },
      xFrameOptions: 'DENY',
      xContentTypeOptions: 'nosniff',
      crossOriginEmbedderPolicy: false,
    },
    // Sign-in throttling is our own (server/utils/loginThrottle.ts); a global limiter would refuse busy offices.
    rateLimiter: false,
    xssValidator: false,
    corsHandler: false,
    // Body sizes are counted as they stream, per route (server/utils/requestRules.ts); this one only reads Content-Length.
    requestSizeLimiter: false,
    removeLoggers: false,
  },
  hooks: {
    // Our API error handler runs first; pages still get Nuxt's error page.
    'nitro:config'(config) {
      const nuxtHandlers = [config.errorHandler].flat().filter((h): h is string => typeof h === 'string')
      config.errorHandler = [fileURLToPath(new URL('./server/error.ts', import.meta.url)), ...nuxtHandlers] as unknown as string
    },
  },
  nitro: {
    output: process.env.PW_OUTPUT_DIR ? { dir: process.env.PW_OUTPUT_DIR } : undefined,
  },
  typescript: { strict: true },
  // Separate build folders let several builds run side by side (tests, benchmarks). Without one,
  // always `.nuxt`: Nuxt 4 would otherwise build into node_modules/.cache when `.nuxt` exists
  // (after `nuxi prepare` or `nuxt dev`), and the type check (tsconfig → .nuxt) would read stale types.
  buildDir: process.env.PW_BUILD_DIR || '.nuxt',
})
