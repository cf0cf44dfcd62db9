/**
 * Size of the JavaScript a visitor downloads before the first public page shows: the entry
 * chunk of dist/web/index.html plus the chunks it modulepreloads, each gzipped. Beside that,
 * for every public page, the page's own lazy chunk and the chunks it imports that the entry
 * does not already bring (what the page needs before it can render).
 *
 *   node --import tsx ops/bench/bundle-size.ts            build (vite build, the project's
 *                                                         config) into a temporary folder
 *   node --import tsx ops/bench/bundle-size.ts --dist dist/web   measure an existing build
 *        [--out ops/bench/results/bundle-size.md]
 *
 * Building into a temporary folder leaves the shared dist/web alone (a running `npm start`
 * serves it). Gzip at zlib's default level 6, as typical web servers compress.
 * Targets: initial JavaScript ≤ 200 kB gzipped; the report page's own chunks — its lazy chunk,
 * the chunks it imports that the entry does not bring, and the lazy map it shows at once
 * (Leaflet, its CSS and ours) — ≤ 120 kB gzipped.
 */
import { execFileSync } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { gzipSync } from 'node:zlib'
import { argValue, machineInfo, machineLine, reportResult } from './support'

const ROOT = fileURLToPath(new URL('../..', import.meta.url))
const TARGET_KB = 200
const REPORT_TARGET_KB = 120
/** Lazy chunks a page loads as soon as it shows (React.lazy inside it), counted with the page. */
const SHOWN_AT_ONCE: Record<string, string[]> = {
  '/report': ['src/components/map/leaflet/leaflet-field-map.tsx'],
}
const out = argValue('--out')
const PUBLIC_ROUTES: Record<string, string> = {
  '/': 'src/app/routes/home.tsx',
  '/report': 'src/app/routes/report.tsx',
  '/track': 'src/app/routes/track.tsx',
  '/track/:token': 'src/app/routes/track-token.tsx',
  '/sign-in': 'src/app/routes/sign-in.tsx',
  '/register': 'src/app/routes/register.tsx',
  '/forgot-password': 'src/app/routes/forgot-password.tsx',
  '/set-password': 'src/app/routes/set-password.tsx',
}

interface ManifestChunk {
  file: string
  src?: string
  isEntry?: boolean
  isDynamicEntry?: boolean
  imports?: string[]
  dynamicImports?: string[]
  css?: string[]
}

function build(): { dist: string; cleanup(): void } {
  const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-bundle-'))
  const t0 = performance.now()
  execFileSync(process.execPath, [path.join(ROOT, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--outDir', dist, '--emptyOutDir', '--manifest', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' })
  console.log(`vite build into ${dist} took ${((performance.now() - t0) / 1000).toFixed(1)} s`)
  return { dist, cleanup: () => fs.rmSync(dist, { recursive: true, force: true }) }
}

const kB = (bytes: number) => (bytes / 1000).toFixed(1)

function sizes(dist: string, file: string): { raw: number; gzip: number } {
  const buf = fs.readFileSync(path.join(dist, file))
  return { raw: buf.length, gzip: gzipSync(buf).length }
}

/** The entry script and the modulepreloaded chunks named in index.html, in order. */
function initialScripts(dist: string): { entry: string; preloads: string[] } {
  const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8')
  const entry = /<script[^>]*type="module"[^>]*src="\/?([^"]+)"/.exec(html)?.[1]
  if (!entry) throw new Error('no module script in index.html')
  const preloads = [...html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="\/?([^"]+)"/g)].map((m) => m[1]!)
  return { entry, preloads }
}

function readManifest(dist: string): Record<string, ManifestChunk> | null {
  for (const p of [path.join(dist, '.vite', 'manifest.json'), path.join(dist, 'manifest.json')]) if (fs.existsSync(p)) return JSON.parse(fs.readFileSync(p, 'utf8'))
  return null
}

/** Files a chunk needs at once: itself and its static imports, transitively (with `css`, their stylesheets too). */
function staticClosure(manifest: Record<string, ManifestChunk>, key: string, seen = new Set<string>(), css = false): Set<string> {
  const chunk = manifest[key]
  if (!chunk || seen.has(chunk.file)) return seen
  seen.add(chunk.file)
  if (css) for (const c of chunk.css ?? []) seen.add(c)
  for (const i of chunk.imports ?? []) staticClosure(manifest, i, seen, css)
  return seen
}

/**
 * The report page's own files: its lazy chunk and what it imports, then the chunks it shows at
 * once (the map), JavaScript and CSS, less what the entry already brought (and its CSS).
 */
function pageFiles(manifest: Record<string, ManifestChunk>, route: string, src: string, initial: string[]): { file: string; gzip: number }[] {
  const entryCss = Object.values(manifest).filter((c) => c.isEntry).flatMap((c) => c.css ?? [])
  const files = staticClosure(manifest, src, new Set(), true)
  for (const lazyKey of SHOWN_AT_ONCE[route] ?? []) {
    if (!manifest[lazyKey]) throw new Error(`no chunk for ${lazyKey} in the manifest`)
    staticClosure(manifest, lazyKey, files, true)
  }
  return [...files].filter((f) => !initial.includes(f) && !entryCss.includes(f)).map((f) => ({ file: f, gzip: 0 }))
}

function main(): void {
  const given = argValue('--dist')
  const built = given ? null : build()
  const dist = given ? path.resolve(given) : built!.dist
  try {
    const { entry, preloads } = initialScripts(dist)
    const initial = [entry, ...preloads]
    const rows = initial.map((f) => ({ file: f, ...sizes(dist, f) }))
    const totalGzip = rows.reduce((s, r) => s + r.gzip, 0)
    const totalRaw = rows.reduce((s, r) => s + r.raw, 0)
    const allJs = fs.readdirSync(path.join(dist, 'assets')).filter((f) => f.endsWith('.js'))
    const allJsGzip = allJs.reduce((s, f) => s + sizes(dist, `assets/${f}`).gzip, 0)
    const css = fs.readdirSync(path.join(dist, 'assets')).filter((f) => f.endsWith('.css'))

    const manifest = readManifest(dist)
    const routeRows: string[] = []
    let reportGzip = Number.NaN
    const reportRows: string[] = []
    if (manifest) {
      const files = pageFiles(manifest, '/report', PUBLIC_ROUTES['/report']!, initial).map((f) => ({ ...f, gzip: sizes(dist, f.file).gzip, raw: sizes(dist, f.file).raw }))
      reportGzip = files.reduce((s, f) => s + f.gzip, 0)
      reportRows.push(...files.sort((a, b) => b.gzip - a.gzip).map((f) => `| ${path.basename(f.file)} | ${kB(f.raw)} | ${kB(f.gzip)} |`))
      for (const [route, src] of Object.entries(PUBLIC_ROUTES)) {
        if (!manifest[src]) {
          routeRows.push(`| ${route} | (no chunk for ${src}) | – | – |`)
          continue
        }
        const extra = [...staticClosure(manifest, src)].filter((f) => !initial.includes(f))
        const extraGzip = extra.reduce((s, f) => s + sizes(dist, f).gzip, 0)
        routeRows.push(`| ${route} | ${extra.map((f) => `${path.basename(f)} (${kB(sizes(dist, f).gzip)})`).join(', ')} | ${kB(extraGzip)} | ${kB(totalGzip + extraGzip)} |`)
      }
    }

    const md = [
      '# Initial JavaScript of the public pages',
      '',
      `- ${machineLine(machineInfo())}`,
      `- ${given ? `Measured the existing build in ${given}` : 'Built with the project’s vite config (`vite build`) into a temporary folder'}; gzip at zlib level 6; kB = 1000 bytes`,
      `- Initial JavaScript (entry + modulepreloads of index.html): **${kB(totalGzip)} kB gzipped** (${kB(totalRaw)} kB raw); target ≤ ${TARGET_KB} kB: **${totalGzip / 1000 <= TARGET_KB ? 'met' : 'missed'}**`,
      `- All JavaScript of the build, every lazy page included: ${allJs.length} files, ${kB(allJsGzip)} kB gzipped; CSS: ${css.map((f) => `${f} ${kB(sizes(dist, `assets/${f}`).gzip)} kB gzipped`).join(', ')}`,
      '',
      '| file (initial) | raw kB | gzip kB |',
      '|---|---:|---:|',
      ...rows.map((r) => `| ${r.file}${r.file === entry ? ' (entry)' : ' (modulepreload)'} | ${kB(r.raw)} | ${kB(r.gzip)} |`),
      `| **total** | **${kB(totalRaw)}** | **${kB(totalGzip)}** |`,
      '',
      ...(manifest
        ? [
            'Each public page also loads its own lazy chunk (and chunks it imports that the entry does not bring) before it renders:',
            '',
            '| page | extra chunks (gzip kB) | extra gzip kB | entry + page gzip kB |',
            '|---|---|---:|---:|',
            ...routeRows,
            '',
          ]
        : ['(No manifest in this build: per-page chunks not listed. Run without --dist to build with one.)', '']),
      ...(manifest
        ? [
            `## The report page with its map`,
            '',
            `Its own chunks and the map it shows at once (Leaflet's lazy chunk, its CSS and ours), beyond the entry: **${kB(reportGzip)} kB gzipped**; target ≤ ${REPORT_TARGET_KB} kB: **${reportGzip / 1000 <= REPORT_TARGET_KB ? 'met' : 'missed'}**`,
            '',
            '| file | raw kB | gzip kB |',
            '|---|---:|---:|',
            ...reportRows,
            '',
          ]
        : []),
    ].join('\n')
    reportResult(md, out)
    process.exitCode = totalGzip / 1000 <= TARGET_KB && !(reportGzip / 1000 > REPORT_TARGET_KB) ? 0 : 1
  } finally {
    built?.cleanup()
  }
}

main()
