/**
 * Benchmark: processing a SigMF recording of 2^24 cf32_le samples (128 MiB) into the summary
 * PSD and the spectrogram, block by block, as the evidence processing job does.
 *
 *   node --import tsx ops/bench/spectrum-processing.bench.ts [--runs N]
 *
 * Two timings per run:
 *  - library: decode 1 MiB blocks (createSigmfBlockDecoder) → Welch accumulator (4096-point Hann,
 *    50 % overlap) + spectrogram (512 columns, ≤ 256 rows) → results, display trace;
 *  - analysis: the same through analyseSpectrumFile reading a `.sigmf` tar archive from an
 *    in-memory stream in 1 MiB chunks (tar reader, summary: peaks, noise floor, OBW, channel
 *    power, quantised spectrogram) — everything but the object store and the database.
 * Target: under 2 s for the analysis.
 */
import { Readable } from 'node:stream'
import { cpus, loadavg } from 'node:os'
import {
  createSigmfBlockDecoder,
  createSpectrogramAccumulator,
  createWelchAccumulator,
  decimateTrace,
  parseSigmfMetadata,
  psdAsTrace,
} from '../../shared/radio/spectrum/index.ts'
import { analyseSpectrumFile } from '../../server/modules/evidence/processing/analyse-spectrum.ts'

const args = process.argv.slice(2)
const runs = Number(args[args.indexOf('--runs') + 1]) || 5
const SAMPLES = 2 ** 24
const FS_HZ = 20e6
const BLOCK = 1024 * 1024

function makeData(): Buffer {
  let a = 0x5eed4321
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296
  }
  const x = new Float32Array(2 * SAMPLES)
  const sd = Math.sqrt(1e-4 / 2)
  for (let n = 0; n < SAMPLES; n++) {
    const p = 2 * Math.PI * 0.1234567 * n
    x[2 * n] = 0.3 * Math.cos(p) + sd * (uniform() - 0.5) * 3.4641
    x[2 * n + 1] = 0.3 * Math.sin(p) + sd * (uniform() - 0.5) * 3.4641
  }
  return Buffer.from(x.buffer)
}

const metaJson = JSON.stringify({
  global: { 'core:datatype': 'cf32_le', 'core:version': '1.2.6', 'core:sample_rate': FS_HZ },
  captures: [{ 'core:sample_start': 0, 'core:frequency': 2.44e9 }],
  annotations: [],
})

function tarHeader(name: string, size: number): Buffer {
  const h = Buffer.alloc(512)
  h.write(name, 0)
  h.write('0000644\0', 100)
  h.write(size.toString(8).padStart(11, '0') + '\0', 124)
  h.write('        ', 148)
  h.write('0', 156)
  h.write('ustar\0', 257)
  h.write('00', 263)
  let sum = 0
  for (const b of h) sum += b
  h.write(sum.toString(8).padStart(6, '0') + '\0 ', 148)
  return h
}
const pad = (n: number) => Buffer.alloc((512 - (n % 512)) % 512)

function* blocks(b: Buffer) {
  for (let at = 0; at < b.length; at += BLOCK) yield b.subarray(at, at + BLOCK)
}

function libraryRun(data: Buffer): number {
  const t0 = performance.now()
  const metadata = parseSigmfMetadata(metaJson)
  const dec = createSigmfBlockDecoder({ metadata })
  const welch = createWelchAccumulator({ sampleRateHz: FS_HZ, centerFreqHz: 2.44e9, segmentLength: 4096 })
  const spectro = createSpectrogramAccumulator({ sampleRateHz: FS_HZ, centerFreqHz: 2.44e9, segmentLength: 512, maxRows: 256 })
  for (const b of blocks(data)) {
    const iq = dec.decode(b)
    welch.push(iq)
    spectro.push(iq)
  }
  dec.finish()
  const trace = psdAsTrace(welch.result().value)
  decimateTrace(trace)
  const s = spectro.result()
  if (s.rowCount !== 256 || s.columnCount !== 512) throw new Error('unexpected spectrogram shape')
  return performance.now() - t0
}

async function analysisRun(archive: Buffer): Promise<number> {
  const t0 = performance.now()
  const r = await analyseSpectrumFile({ open: async () => Readable.from(blocks(archive)), originalName: 'bench.sigmf', contentType: 'application/x-tar' })
  const took = performance.now() - t0
  if (r.spectrogram?.rowCount !== 256 || r.displayTrace.freqHz.length > 4096) throw new Error('unexpected result shape')
  return took
}

const median = (v: number[]) => [...v].sort((p, q) => p - q)[Math.floor(v.length / 2)]!

async function main() {
  console.log(`spectrum processing: ${SAMPLES} cf32_le samples (${(SAMPLES * 8) / 2 ** 20} MiB), ${runs} runs; ${cpus().length} CPUs, load ${loadavg()[0]!.toFixed(2)}`)
  const data = makeData()
  const meta = Buffer.from(metaJson)
  const archive = Buffer.concat([tarHeader('bench/bench.sigmf-meta', meta.length), meta, pad(meta.length), tarHeader('bench/bench.sigmf-data', data.length), data, pad(data.length), Buffer.alloc(1024)])
  libraryRun(data) // warm-up
  const lib: number[] = []
  const full: number[] = []
  for (let i = 0; i < runs; i++) {
    lib.push(libraryRun(data))
    full.push(await analysisRun(archive))
  }
  console.log(`library (decode + Welch + spectrogram): median ${median(lib).toFixed(0)} ms, min ${Math.min(...lib).toFixed(0)}, max ${Math.max(...lib).toFixed(0)}`)
  console.log(`analysis from a tar stream:             median ${median(full).toFixed(0)} ms, min ${Math.min(...full).toFixed(0)}, max ${Math.max(...full).toFixed(0)}`)
  console.log(`target < 2000 ms: ${median(full) < 2000 ? 'met' : 'NOT met'}; load after ${loadavg()[0]!.toFixed(2)}`)
}

void main()
