import { fileURLToPath } from 'node:url'

export default defineNuxtConfig({
  compatibilityDate: '2025-07-15',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils'],
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
    mailFrom: 'Passagewright <passages@kestrel-bight.example>',
    tileCacheDir: '',
    outboxWorker: 'on',
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
  // Separate build folders let several builds run side by side (tests, benchmarks).
  buildDir: process.env.PW_BUILD_DIR || undefined,
})
