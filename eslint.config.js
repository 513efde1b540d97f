// Lint for mistakes, not for formatting: the recommended rules of ESLint, typescript-eslint and
// eslint-plugin-vue ("essential"), with the few exceptions this codebase has reasons for.
import js from '@eslint/js'
import pluginVue from 'eslint-plugin-vue'
import globals from 'globals'
import tseslint from 'typescript-eslint'

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'components.d.ts', 'test-results/**', 'playwright-report/**', 'bench-results/**', 'screenshots/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/essential'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      // `_`-prefixed names are deliberately unused (destructuring to omit a field, a required parameter).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      // Express's `declare global namespace Express` augmentation is the library's own pattern.
      '@typescript-eslint/no-namespace': ['error', { allowDeclarations: true }],
    },
  },
  {
    // One way to change a vehicle: only the unit of work appends history (DEVELOPERS.md, "Adding a domain").
    files: ['server/**/*.ts'],
    ignores: ['server/vehicles/vehicle-change.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: [{ name: '@db/history', importNames: ['appendHistory'], message: 'Change a vehicle with changeVehicle or createVehicle (server/vehicles/index), which append its history.' }],
      }],
    },
  },
)
