/** Builds the web app when dist/web is missing or older than its sources. */
import { execFileSync } from 'node:child_process'
import fs from 'node:fs'
import path from 'node:path'
import { ROOT } from './services'

const SOURCES = ['web', 'shared', 'vite.config.ts', 'package-lock.json']

function newestMtimeMs(p: string): number {
  const full = path.join(ROOT, p)
  if (!fs.existsSync(full)) return 0
  const st = fs.statSync(full)
  if (!st.isDirectory()) return st.mtimeMs
  let newest = st.mtimeMs
  for (const e of fs.readdirSync(full, { withFileTypes: true })) {
    if (e.name === 'node_modules' || e.name.startsWith('.')) continue
    newest = Math.max(newest, newestMtimeMs(path.join(p, e.name)))
  }
  return newest
}

export const WEB_DIST = path.join(ROOT, 'dist', 'web')

export function ensureWebBuild(): 'built' | 'up to date' {
  const index = path.join(WEB_DIST, 'index.html')
  const builtAt = fs.existsSync(index) ? fs.statSync(index).mtimeMs : 0
  const changedAt = Math.max(...SOURCES.map(newestMtimeMs))
  if (builtAt > changedAt) return 'up to date'
  execFileSync(process.execPath, [path.join(ROOT, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: ROOT,
    stdio: 'inherit',
  })
  return 'built'
}
