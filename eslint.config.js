// ESLint: the import boundaries DEVELOPERS.md states, no import cycles, and the recommended
// JavaScript and typescript-eslint sets (the two rules tsc already covers are off, see below).
// Runs in `npm test` (ops/test.sh) and alone as `npm run lint`; tests/ops/lint-boundaries.test.ts
// shows each boundary and the cycle rule catching a violation.
//
// Not on: typescript-eslint's type-aware sets (recommendedTypeChecked). Measured on this code:
// over 900 findings (mostly no-unsafe-member-access/-assignment on parsed JSON and query rows,
// and no-unnecessary-type-assertion) and more than a minute on two cores, against about 10 s
// for this configuration.
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import js from '@eslint/js'
import { defineConfig, globalIgnores } from 'eslint/config'
import tseslint from 'typescript-eslint'
import { importX } from 'eslint-plugin-import-x'
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript'

// Paths below are from the repository root, wherever eslint is started.
const root = path.dirname(fileURLToPath(import.meta.url))

// Every folder under web/src/features is a feature; a new one is covered without editing this file.
const features = fs
  .readdirSync(path.join(root, 'web/src/features'), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name)

// Named exceptions to "web features do not import each other": { importer, imported, reason }.
// Empty: a piece two features need lives in web/src/components or web/src/lib instead.
const featureExceptions = []

// "Services never import drizzle": in server/modules, only a repo (*.repo.ts) imports drizzle-orm
// or the tables; the rest may import row types only (`import type`). Named exceptions: { file, reason }.
const queryCodeOutsideRepos = [
  { file: 'server/modules/cases/due.ts', reason: 'the due and overdue SQL built once from shared/domain/case-clocks, for every repo that needs it' },
]

const boundaryZones = [
  {
    target: './shared',
    from: ['./web', './server', './ops', './tests'],
    message: 'shared/ is isomorphic: it imports nothing from web/, server/, ops/ or tests/.',
  },
  {
    target: './shared/radio',
    from: '.',
    except: ['./shared/radio', './node_modules'],
    message: 'shared/radio/ is a self-contained library: it imports only itself and packages.',
  },
  {
    target: './web',
    from: './server',
    message: 'The web app talks to the server over HTTP only; share code through shared/.',
  },
  {
    target: './server',
    from: './web',
    message: 'The server imports nothing from the web app; share code through shared/.',
  },
  ...features.map((feature) => ({
    target: `./web/src/features/${feature}`,
    from: './web/src/features',
    except: [
      `./${feature}`,
      ...featureExceptions.filter((e) => e.importer === feature).map((e) => `./${e.imported}`),
    ],
    message:
      'Web features do not import each other: move the shared piece to web/src/components or web/src/lib.',
  })),
]

export default defineConfig(
  globalIgnores(['dist/', 'test-results/', 'coverage/', '.local/', '.pgdata/', 'drizzle/', 'ops/bench/out/']),
  { linterOptions: { reportUnusedDisableDirectives: 'error' } },
  {
    files: ['**/*.{ts,tsx}'],
    extends: [js.configs.recommended, tseslint.configs.recommended],
  },
  {
    files: ['**/*.{js,mjs}'],
    extends: [js.configs.recommended],
    languageOptions: { globals: { process: 'readonly', console: 'readonly' } },
  },
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    plugins: { 'import-x': importX },
    settings: {
      // Without these, import-x reads only .js modules and no-cycle sees no TypeScript import.
      'import-x/extensions': ['.ts', '.tsx', '.js', '.mjs'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      // The resolver reads tsconfig.json's paths too, so an `@/…` or `@shared/…` import meets the
      // same boundaries as a relative one (tests/ops/lint-boundaries.test.ts shows both).
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: path.join(root, 'tsconfig.json') })],
    },
    rules: {
      'import-x/no-restricted-paths': ['error', { basePath: root, zones: boundaryZones }],
      // Type-only imports (`import type`) are erased from the build and are not followed, so
      // this finds cycles that exist when the code runs.
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
    },
  },
  {
    files: ['**/*.{ts,tsx}'],
    rules: {
      // Left to tsc, one source for each check: it already reports undefined names (with the
      // types in view; the core rule misfires on type-only globals) and, with noUnusedLocals and
      // noUnusedParameters, unused names (an underscore marks a parameter kept for its position).
      'no-undef': 'off',
      '@typescript-eslint/no-unused-vars': 'off',
    },
  },
  {
    files: ['server/modules/**/*.ts'],
    ignores: ['server/modules/**/*.repo.ts', ...queryCodeOutsideRepos.map((e) => e.file)],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^drizzle-orm(/|$)',
              message: 'Services never import drizzle: put the query in the module’s *.repo.ts and call it.',
            },
            {
              regex: '(^|/)db/schema(/|$)',
              allowTypeImports: true,
              message: 'Only repos use the tables: outside *.repo.ts import row types only (`import type`).',
            },
          ],
        },
      ],
    },
  },
)
