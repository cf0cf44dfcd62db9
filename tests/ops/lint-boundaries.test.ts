/**
 * eslint.config.js holds the import rules DEVELOPERS.md states. Each case lints a few lines as if
 * they were a file at a real place in the tree (nothing is written), importing real files: were
 * the import resolver to stop finding them, the boundary rules would pass everything quietly, and
 * these tests would fail instead.
 */
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { ESLint } from 'eslint'
import { describe, expect, it } from 'vitest'

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..')
const eslint = new ESLint({ cwd: root })

/** The rule and message of each problem ESLint finds in `text` placed at `file`. */
async function problems(file: string, text: string): Promise<Array<{ rule: string | null; message: string }>> {
  const [result] = await eslint.lintText(text, { filePath: path.join(root, file) })
  return result!.messages.map((m) => ({ rule: m.ruleId, message: m.message }))
}

/** Some module of a web feature (the first found), as a path from that feature's folder. */
function aModuleOf(feature: string): string {
  const files = fs.readdirSync(path.join(root, 'web/src/features', feature), { recursive: true, encoding: 'utf8' })
  const file = files.find((f) => /\.tsx?$/.test(f))
  if (!file) throw new Error(`web/src/features/${feature} has no module to import`)
  return file.replace(/\.tsx?$/, '')
}

const boundary = (why: string) => ({ rule: 'import-x/no-restricted-paths', message: expect.stringContaining(why) })

describe('the import boundaries', () => {
  it('refuse a shared/ file that imports from web/ or server/', async () => {
    const found = await problems(
      'shared/domain/lint-probe.ts',
      "import { ApiError } from '../../web/src/lib/api-client'\nimport { createApp } from '../../server/app'\nexport const probe = [ApiError, createApp]\n",
    )
    expect(found).toEqual([boundary('shared/ is isomorphic'), boundary('shared/ is isomorphic')])
  })

  it('refuse a shared/radio/ file that imports the rest of shared/, and let it import a package and itself', async () => {
    const found = await problems(
      'shared/radio/lint-probe.ts',
      "import FFT from 'fft.js'\nimport * as units from './units'\nimport * as roles from '../domain/roles'\nexport const probe = [FFT, units, roles]\n",
    )
    expect(found).toEqual([boundary('shared/radio/ is a self-contained library')])
  })

  it('refuse a web feature that imports another feature, and let it import itself, web/src/lib and shared/', async () => {
    const found = await problems(
      'web/src/features/case-list/lint-probe.ts',
      [
        `import * as own from './${aModuleOf('case-list')}'`,
        "import * as apiClient from '../../lib/api-client'",
        "import * as roles from '../../../../shared/domain/roles'",
        `import * as other from '../case-page/${aModuleOf('case-page')}'`,
        'export const probe = [own, apiClient, roles, other]',
        '',
      ].join('\n'),
    )
    expect(found).toEqual([boundary('Web features do not import each other')])
  })

  it('hold for imports through the @/ (web/src) and @shared/ aliases as for relative ones', async () => {
    const feature = await problems(
      'web/src/features/case-list/lint-probe.ts',
      [
        `import * as own from '@/features/case-list/${aModuleOf('case-list')}'`,
        "import * as apiClient from '@/lib/api-client'",
        "import * as roles from '@shared/domain/roles'",
        `import * as other from '@/features/case-page/${aModuleOf('case-page')}'`,
        'export const probe = [own, apiClient, roles, other]',
        '',
      ].join('\n'),
    )
    expect(feature).toEqual([boundary('Web features do not import each other')])
    expect(await problems('shared/domain/lint-probe.ts', "import { ApiError } from '@/lib/api-client'\nexport const probe = ApiError\n")).toEqual([
      boundary('shared/ is isomorphic'),
    ])
    expect(await problems('shared/radio/lint-probe.ts', "import * as roles from '@shared/domain/roles'\nexport const probe = roles\n")).toEqual([
      boundary('shared/radio/ is a self-contained library'),
    ])
    expect(await problems('server/lint-probe.ts', "import * as apiClient from '@/lib/api-client'\nexport const probe = apiClient\n")).toEqual([
      boundary('The server imports nothing from the web app'),
    ])
  })

  it('refuse server/ importing the web app, and the web app importing server/', async () => {
    expect(await problems('server/lint-probe.ts', "import * as apiClient from '../web/src/lib/api-client'\nexport const probe = apiClient\n")).toEqual([
      boundary('The server imports nothing from the web app'),
    ])
    expect(await problems('web/src/lib/lint-probe.ts', "import * as app from '../../../server/app'\nexport const probe = app\n")).toEqual([
      boundary('The web app talks to the server over HTTP only'),
    ])
  })
})

describe('the repository rule', () => {
  const restricted = (why: string) => ({ rule: '@typescript-eslint/no-restricted-imports', message: expect.stringContaining(why) })
  const queryImports = [
    "import { eq } from 'drizzle-orm'",
    "import { pgTable } from 'drizzle-orm/pg-core'",
    "import { users } from '../../db/schema'",
    "import type { User } from '../../db/schema'",
    'export const probe = [eq, pgTable, users]',
    'export type Probe = User',
    '',
  ].join('\n')

  it('refuses a service that imports drizzle or a table, and lets it import a row type', async () => {
    expect(await problems('server/modules/auth/lint-probe.service.ts', queryImports)).toEqual([
      restricted('Services never import drizzle'),
      restricted('Services never import drizzle'),
      restricted('Only repos use the tables'),
    ])
  })

  it('lets a repo import drizzle and the tables', async () => {
    expect(await problems('server/modules/auth/lint-probe.repo.ts', queryImports)).toEqual([])
  })
})

describe('import cycles', () => {
  it('are refused: a report field component that imports the form which imports it', async () => {
    const found = await problems(
      'web/src/features/reports/components/contact-fields.tsx',
      "import { ReportForm } from './report-form'\nexport const probe = ReportForm\n",
    )
    expect(found.map((p) => p.rule)).toEqual(['import-x/no-cycle'])
  })

  it('are not found where a field component names only the form’s value types', async () => {
    const found = await problems(
      'web/src/features/reports/components/contact-fields.tsx',
      "import type { ReportFormInput } from './report-form-types'\nexport type Probe = ReportFormInput\n",
    )
    expect(found).toEqual([])
  })
})
