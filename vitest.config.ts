import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'
import { defineVitestProject } from '@nuxt/test-utils/config'

// expect.poll waits for a real condition (a saved state, a row count) and returns as soon as it holds;
// its default of 1 s is shorter than a save takes on a loaded machine, so tests that talk to the
// server wait up to 30 s before they fail.
const serverPoll = { poll: { timeout: 30_000, interval: 100 } }

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
          expect: serverPoll,
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
          expect: serverPoll,
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
})
