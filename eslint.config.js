// Lint for mistakes, not for formatting: the recommended rules of ESLint, typescript-eslint and
// eslint-plugin-vue ("essential"), with the few exceptions this codebase has reasons for.
import js from '@eslint/js'
import vueI18n from '@intlify/eslint-plugin-vue-i18n'
import pluginVue from 'eslint-plugin-vue'
import globals from 'globals'
import tseslint from 'typescript-eslint'

const KEY_MESSAGE = 'A query key comes from its src/api/<domain>.ts (e.g. boardKeys.all), never a literal array.'
const literalQueryKeys = [
  { selector: "Property[key.name='queryKey'] ArrayExpression", message: KEY_MESSAGE },
  {
    selector:
      'CallExpression[callee.property.name=/^(getQueryData|getQueriesData|setQueryData|setQueriesData|getQueryState|invalidateQueries|refetchQueries|cancelQueries|removeQueries|resetQueries|prefetchQuery|fetchQuery|ensureQueryData)$/] > ArrayExpression.arguments',
    message: KEY_MESSAGE,
  },
]
const DATE_MESSAGE = "Show dates and times with useYardTime() (src/composables/yard-time.ts): the yard's clock, not the browser's."
const ownDateFormats = [
  { selector: ":matches(NewExpression, CallExpression)[callee.object.name='Intl'][callee.property.name='DateTimeFormat']", message: DATE_MESSAGE },
  { selector: "CallExpression[callee.property.name=/^toLocale(Date|Time)String$/]", message: DATE_MESSAGE },
  { selector: "CallExpression[callee.property.name='toLocaleString'][callee.object.type='NewExpression'][callee.object.callee.name='Date']", message: DATE_MESSAGE },
]

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
  {
    // Server data has one home: query keys, queries, mutations and what each invalidates live in
    // src/api/<domain>.ts. Elsewhere in the client a key comes from there (`vehicleKeys.detail(id)`),
    // never typed as an array, and a view calls the api's use…Query / use…Mutation. Dates and times
    // are shown on the yard's clock, through useYardTime().
    files: ['src/**/*.ts', 'src/**/*.vue'],
    ignores: ['src/api/**'],
    rules: {
      'no-restricted-syntax': ['error', ...literalQueryKeys, ...ownDateFormats],
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: '@tanstack/vue-query',
              importNames: ['useQuery', 'useQueries', 'useInfiniteQuery', 'useMutation'],
              message: 'Call the use…Query / use…Mutation of src/api/<domain>.ts, where the key and what a change invalidates are kept.',
            },
          ],
        },
      ],
    },
  },
  {
    // The one place that formats dates and times, on the yard's clock.
    files: ['src/composables/yard-time.ts'],
    rules: { 'no-restricted-syntax': ['error', ...literalQueryKeys] },
  },
  {
    // Every string a person reads comes from the catalogs (src/locales/<locale>/<namespace>.json for the
    // screens, shared/messages/<locale>/<namespace>.json for the words both sides use): a key used in a
    // template or a script that no catalog has is an error, and so is raw text in any template (below).
    files: ['src/**/*.vue', 'src/**/*.ts'],
    plugins: { '@intlify/vue-i18n': vueI18n },
    settings: {
      'vue-i18n': {
        localeDir: [
          { pattern: './src/locales/*/*.json', localeKey: 'path', localePattern: /^.*\/(?<locale>[a-z]{2})\/[^/]+\.json$/ },
          { pattern: './shared/messages/*/*.json', localeKey: 'path', localePattern: /^.*\/(?<locale>[a-z]{2})\/[^/]+\.json$/ },
        ],
        messageSyntaxVersion: '^11.0.0',
      },
    },
    rules: { '@intlify/vue-i18n/no-missing-keys': 'error' },
  },
  {
    files: ['src/**/*.vue'],
    rules: {
      '@intlify/vue-i18n/no-raw-text': [
        'error',
        {
          ignorePattern: '^[-–—·•:/()#%+×.,→…✓\\s\\d]*$',
          // Words typed into these attributes are read (or heard) too.
          attributes: { '/.+/': ['label', 'placeholder', 'title', 'aria-label', 'alt', 'submit-label', 'hint', 'caption', 'description'] },
        },
      ],
    },
  },
)
