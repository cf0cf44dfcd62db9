/** The licence register's figures in words: authorised limits, powers, ranges. Pure. */
import type { LimitSpec } from '@shared/radio/compliance/limit-spec'
import { formatFrequencyRangeHz } from '@/lib/frequency'

/** Two decimals at most, no trailing zeros. */
export const figure = (x: number) => String(Number.parseFloat(x.toFixed(2)))

/** "30 dBm (1 W)". */
export function formatDbm(dbm: number): string {
  const mw = 10 ** (dbm / 10)
  const linear = mw >= 1e6 ? `${figure(mw / 1e6)} kW` : mw >= 1000 ? `${figure(mw / 1000)} W` : `${figure(mw)} mW`
  return `${figure(dbm)} dBm (${linear})`
}

/** The limit as the licence states it: "EIRP 30 dBm (1 W)", "conducted 40 dBm (10 W), 6 dBi, feeder 1 dB". */
export function describeLicence(s: { limit: LimitSpec; antennaGainDbi: number | null; feederLossDb: number | null }): string {
  const l = s.limit
  if (l.kind === 'eirp') return `EIRP ${formatDbm(l.eirpDbm)}`
  if (l.kind === 'erp') return `ERP ${formatDbm(l.erpDbm)}`
  if (l.kind === 'conducted') return `conducted ${formatDbm(l.conductedPowerDbm)}, antenna ${figure(s.antennaGainDbi ?? 0)} dBi, feeder ${figure(s.feederLossDb ?? 0)} dB`
  return l.kind
}

export const formatRange = (s: { lowFreqHz: number; highFreqHz: number }) => formatFrequencyRangeHz({ lowHz: s.lowFreqHz, highHz: s.highFreqHz })

export const formatDate = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })
