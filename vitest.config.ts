import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'
import { defineVitestProject } from '@nuxt/test-utils/config'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '#shared': `${root}shared`, '~~': root.replace(/\/$/, '') }

export default defineConfig({
  test: {
    projects: [
      // Components mounted with mountSuspended inside a Nuxt app (auto-imports, Pinia), in happy-dom.
      await defineVitestProject({
        test: { name: 'components', include: ['tests/components/**/*.test.ts'], environment: 'nuxt', testTimeout: 60_000 },
      }),
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'nuxt',
          include: ['tests/nuxt/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
})
