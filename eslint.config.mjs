// Lint for correctness, not layout: @nuxt/eslint's config for a Nuxt app (TypeScript and Vue
// rules) without its stylistic rules, which would fight the existing formatting. Run by npm test.
import { createConfigForNuxt } from '@nuxt/eslint-config/flat'

export default createConfigForNuxt({
  features: { stylistic: false, tooling: false },
  dirs: { src: ['.'] },
}).append(
  { ignores: ['.data/**', '.output/**', '.nuxt/**', 'tests/e2e/screenshots/**', 'public/**'] },
  {
    rules: {
      // Caught errors and Knex rows are typed `any` at the boundary on purpose; vue-tsc checks the rest.
      '@typescript-eslint/no-explicit-any': 'off',
      // Input schemas refuse control characters by naming them in a character class.
      'no-control-regex': 'off',
      // `catch {}` while polling for a server that is not up yet is deliberate.
      'no-empty': ['error', { allowEmptyCatch: true }],
      // `a ? b() : c()` as a statement reads well in short handlers.
      '@typescript-eslint/no-unused-expressions': ['error', { allowTernary: true, allowShortCircuit: true }],
      // Module augmentation (`interface User extends SessionUser {}`) is how nuxt-auth-utils is typed.
      '@typescript-eslint/no-empty-object-type': ['error', { allowInterfaces: 'with-single-extends' }],
    },
  },
  {
    files: ['tests/**'],
    // The fuzz test sends 2^53 + 1 on purpose, to see that the server refuses an unsafe integer.
    rules: { 'no-loss-of-precision': 'off' },
  },
)
