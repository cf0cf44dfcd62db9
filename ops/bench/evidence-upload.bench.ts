/**
 * Benchmark: a large evidence upload through the app against the same file uploaded straight
 * to the same store with the AWS SDK, in one run.
 *
 *   node --import tsx ops/bench/evidence-upload.bench.ts [--size-mib 1024] [--runs 1] [--out ops/bench/results/evidence-upload.md]
 *
 * It starts, each in its own process: a throwaway PostgreSQL cluster (migrated, demo-seeded;
 * removed at the end), the local S3 fake (s3rver, on a folder of its own) and Quietband's app
 * (ops/bench/serve.ts with that store). It writes a file of random bytes to disk (1 MiB at a
 * time, never whole in memory), signs in as a demo investigator and, per run:
 *  - app: POST /api/cases/:id/evidence, multipart (`kind`, then `file`) streamed from disk,
 *    while the server process's resident memory (VmRSS of /proc/<pid>/status) is sampled every
 *    50 ms; growth = highest sample − the sample just before the upload;
 *  - direct: the same file with @aws-sdk/lib-storage `Upload` (its default part size and queue)
 *    from a file stream into the same bucket, no app in between.
 * Odd runs upload through the app first, even runs straight to the store first.
 * Checks: the app's answer carries the file's SHA-256 and size. Targets: growth < 100 MB and
 * app throughput ≥ 80 % of direct.
 */
import { spawn, type ChildProcess } from 'node:child_process'
import crypto from 'node:crypto'
import fs from 'node:fs'
import http from 'node:http'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { Upload } from '@aws-sdk/lib-storage'
import pg from 'pg'
import { prepareDatabase } from '../../server/db/roles'
import { createS3Client } from '../../server/storage/s3'
import { reachableTempDir, startCluster } from '../local/clusters'
import { startS3Fake } from '../local/s3-fake'
import { seedDemo } from '../seed-demo'
import { argValue, loadAverage, machineInfo, machineLine, reportResult, signIn } from './support'

const here = path.dirname(fileURLToPath(import.meta.url))
const BUCKET = 'bench-upload'
const MiB = 1024 * 1024

// child mode: the S3 fake in a process of its own
if (process.argv[2] === '--s3-child') {
  const fake = await startS3Fake({ directory: process.argv[3], bucket: BUCKET })
  console.log(`s3 ${fake.endpoint}`)
  process.once('SIGTERM', () => void fake.close().then(() => process.exit(0)))
} else {
  await main()
}

/** Spawns `node --import tsx <args>` and waits for a stdout line matching `ready`. */
function startChild(args: string[], ready: RegExp, env: NodeJS.ProcessEnv = process.env): Promise<{ child: ChildProcess; match: RegExpExecArray }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', ...args], { env, stdio: ['ignore', 'pipe', 'inherit'] })
    let buf = ''
    child.stdout!.on('data', (d: Buffer) => {
      buf += d.toString()
      const m = ready.exec(buf)
      if (m) resolve({ child, match: m })
    })
    child.once('exit', (code) => reject(new Error(`${args.join(' ')} exited (${code}) before it was ready:\n${buf}`)))
  })
}

function rssBytes(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'))
  return m ? Number(m[1]) * 1024 : NaN
}

/** A file of random bytes written 1 MiB at a time; its SHA-256. */
function writeRandomFile(file: string, bytes: number): string {
  const hash = crypto.createHash('sha256')
  const fd = fs.openSync(file, 'w')
  const block = Buffer.alloc(MiB)
  try {
    for (let left = bytes; left > 0; left -= block.length) {
      const part = left >= block.length ? block : block.subarray(0, left)
      crypto.randomFillSync(part)
      hash.update(part)
      fs.writeSync(fd, part)
    }
  } finally {
    fs.closeSync(fd)
  }
  return hash.digest('hex')
}

/** POSTs the file as multipart (`kind`, then `file`) streamed from disk; the answer's status and body. */
function postEvidence(url: string, cookie: string, caseId: string, file: string, sizeBytes: number): Promise<{ status: number; body: string }> {
  const boundary = `----qb-bench-${crypto.randomUUID()}`
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\niq_recording\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="bench-recording.sigmf-data"\r\nContent-Type: application/octet-stream\r\n\r\n`,
  )
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`)
  const target = new URL(`/api/cases/${caseId}/evidence`, url)
  return new Promise((resolve, reject) => {
    const req = http.request(target, {
      method: 'POST',
      headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length + sizeBytes + tail.length) },
    })
    req.once('error', reject)
    req.once('response', (res) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.once('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }))
    })
    req.write(head)
    const body = fs.createReadStream(file, { highWaterMark: MiB })
    body.once('error', reject)
    body.on('end', () => req.end(tail))
    body.pipe(req, { end: false })
  })
}

async function main() {
  const sizeBytes = Number(argValue('--size-mib', '1024')) * MiB
  const runs = Number(argValue('--runs', '1'))
  const out = argValue('--out', undefined)
  const machine = machineInfo()
  const loads: string[] = [loadAverage()]
  const work = reachableTempDir('qb-bench-upload-')
  const file = path.join(work, 'recording.bin')
  const children: ChildProcess[] = []
  const cluster = await startCluster('qb-bench-upload-db-')
  try {
    await prepareDatabase(cluster.ownerUrl)
    const owner = new pg.Pool({ connectionString: cluster.ownerUrl, max: 2 })
    await seedDemo(owner)
    const { rows } = await owner.query<{ id: string }>(
      `SELECT c.id FROM cases c JOIN offices o ON o.id = c.office_id WHERE o.name = 'Harrowmere' AND c.status <> 'closed' ORDER BY c.received_at LIMIT 1`,
    )
    await owner.end()
    const caseId = rows[0]?.id
    if (!caseId) throw new Error('the demo has no open Harrowmere case')

    const s3 = await startChild([path.join(here, 'evidence-upload.bench.ts'), '--s3-child', path.join(work, 's3')], /^s3 (\S+)$/m)
    children.push(s3.child)
    const endpoint = s3.match[1]
    const server = await startChild(
      [path.join(here, 'serve.ts'), '--database-url', cluster.appUrl, '--s3-endpoint', endpoint, '--s3-bucket', BUCKET, '--upload-max-bytes', String(sizeBytes + 16 * MiB)],
      /^listening (\S+)$/m,
      cluster.env,
    )
    children.push(server.child)
    const url = server.match[1]
    const serverPid = server.child.pid!

    const t0 = performance.now()
    const sha256 = writeRandomFile(file, sizeBytes)
    console.log(`wrote ${sizeBytes / MiB} MiB of random bytes in ${((performance.now() - t0) / 1000).toFixed(1)} s`)
    const cookie = await signIn(url, 'm.ferreira@quietband.test')

    // warm-up: a small upload through every path of the route
    const small = path.join(work, 'small.bin')
    const smallSha = writeRandomFile(small, 2 * MiB)
    const warm = await postEvidence(url, cookie, caseId, small, 2 * MiB)
    if (warm.status !== 201 || !warm.body.includes(smallSha)) throw new Error(`warm-up upload failed: ${warm.status} ${warm.body}`)

    const client = createS3Client({ endpoint, region: 'us-east-1', bucket: BUCKET, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true })
    const results: { run: number; appS: number; directS: number; baseRss: number; peakRss: number; loadBefore: string; loadAfter: string }[] = []
    for (let run = 1; run <= runs; run++) {
      const loadBefore = loadAverage()
      const direct = async () => {
        const t = performance.now()
        await new Upload({ client, params: { Bucket: BUCKET, Key: `direct/${crypto.randomUUID()}`, Body: fs.createReadStream(file) } }).done()
        return (performance.now() - t) / 1000
      }
      // odd runs upload through the app first, even runs straight to the store first
      const directFirst = run % 2 === 0 ? await direct() : undefined
      await new Promise((r) => setTimeout(r, 1000))
      const baseRss = rssBytes(serverPid)
      let peakRss = baseRss
      const sampler = setInterval(() => (peakRss = Math.max(peakRss, rssBytes(serverPid))), 50)
      const t = performance.now()
      const answer = await postEvidence(url, cookie, caseId, file, sizeBytes)
      const appS = (performance.now() - t) / 1000
      clearInterval(sampler)
      peakRss = Math.max(peakRss, rssBytes(serverPid))
      if (answer.status !== 201) throw new Error(`upload answered ${answer.status}: ${answer.body.slice(0, 500)}`)
      const evidence = (JSON.parse(answer.body) as { evidence: { sha256?: string; sizeBytes?: number } }).evidence
      if (!answer.body.includes(sha256)) throw new Error(`the app's answer does not carry the file's SHA-256 ${sha256}: ${answer.body.slice(0, 500)}`)
      if (evidence.sizeBytes !== undefined && evidence.sizeBytes !== sizeBytes) throw new Error(`the app stored ${evidence.sizeBytes} bytes, not ${sizeBytes}`)
      const directS = directFirst ?? (await direct())
      const loadAfter = loadAverage()
      loads.push(loadAfter)
      results.push({ run, appS, directS, baseRss, peakRss, loadBefore, loadAfter })
      console.log(
        `run ${run}: app ${appS.toFixed(2)} s (${(sizeBytes / MiB / appS).toFixed(1)} MiB/s), direct ${directS.toFixed(2)} s (${(sizeBytes / MiB / directS).toFixed(1)} MiB/s), ` +
          `ratio ${(directS / appS).toFixed(2)}; server RSS ${(baseRss / MiB).toFixed(0)} → peak ${(peakRss / MiB).toFixed(0)} MiB (+${((peakRss - baseRss) / MiB).toFixed(1)} MiB); load ${loadBefore} → ${loadAfter}`,
      )
    }

    const mb = (b: number) => (b / 1e6).toFixed(1)
    const rowsMd = results.map(
      (r) =>
        `| ${r.run} (${r.run % 2 === 0 ? 'direct' : 'app'}) | ${r.appS.toFixed(2)} s (${(sizeBytes / MiB / r.appS).toFixed(1)} MiB/s) | ${r.directS.toFixed(2)} s (${(sizeBytes / MiB / r.directS).toFixed(1)} MiB/s) | **${((100 * r.directS) / r.appS).toFixed(0)} %** | ${mb(r.baseRss)} → ${mb(r.peakRss)} MB: **+${mb(r.peakRss - r.baseRss)} MB** | ${r.loadBefore} → ${r.loadAfter} |`,
    )
    const worstRatio = Math.min(...results.map((r) => r.directS / r.appS))
    const worstGrowth = Math.max(...results.map((r) => r.peakRss - r.baseRss))
    const md = [
      `# Evidence upload of ${sizeBytes / MiB} MiB: app against a direct SDK upload (${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC)`,
      '',
      'Produced by `node --import tsx ops/bench/evidence-upload.bench.ts' + (process.argv.length > 2 ? ' ' + process.argv.slice(2).join(' ') : '') + '`.',
      '',
      `- ${machineLine(machine)}; load average (1/5/15 min) ${loads.join(' → ')}`,
      `- Processes: PostgreSQL (throwaway cluster), s3rver 3.7.1 (own process, files on the local disk), the app (ops/bench/serve.ts, own process), this script (the client)`,
      `- File: ${sizeBytes / MiB} MiB of random bytes on disk, SHA-256 checked in the app's answer`,
      '- app: `POST /api/cases/:id/evidence` (demo investigator, kind `iq_recording`), multipart streamed from the file; time to the 201 answer',
      '- direct: `@aws-sdk/lib-storage` `Upload` of a file stream to the same bucket (defaults: 5 MiB parts, 4 at a time), same client settings as the app (checksums WHEN_REQUIRED)',
      '- server memory: VmRSS of the app process every 50 ms; growth = highest sample − the sample just before the upload',
      '',
      '| run (first) | app | direct | app throughput ÷ direct | server RSS before → peak | load |',
      '| --- | --- | --- | ---: | --- | --- |',
      ...rowsMd,
      '',
      `Targets: throughput ≥ 80 % of direct — **${worstRatio >= 0.8 ? 'met' : 'not met'}** (worst ${(100 * worstRatio).toFixed(0)} %); memory growth < 100 MB — **${worstGrowth < 100e6 ? 'met' : 'not met'}** (worst +${mb(worstGrowth)} MB).`,
    ].join('\n')
    reportResult(md, out)
  } finally {
    for (const c of children.reverse()) c.kill('SIGTERM')
    await new Promise((r) => setTimeout(r, 500))
    cluster.remove()
    fs.rmSync(work, { recursive: true, force: true })
  }
  process.exit(0)
}
