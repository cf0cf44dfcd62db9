/**
 * Band-limit reference: licence-exempt limits with their regulation citations.
 *
 * Document: ETSI EN 300 328, ETSI EN 301 893, 47 CFR §§15.247, 15.407, 15.255 and
 * ERC/REC 70-03 Annexes 1 and 7, as listed with their verification status in CHECK-VALUES.md
 * §11 (the project's register of check values). This is seed data that a supervisor edits in the product.
 *
 * Status tags: [V-S] = value confirmed in a secondary published source (the citation names the
 * regulation, not that source); [M] = recalled, NOT verified — check the regulation text before
 * relying on it. An entry is tagged [M] when any part of the limit it applies is [M].
 */
import type { CitedLimit } from './assess-compliance'
import { GAIN_RULES } from './limit-spec'

export type BandLimitStatus = '[V-S]' | '[M]'

export interface BandLimitEntry extends CitedLimit {
  /** Stable id, stored with findings: never rename. */
  id: string
  title: string
  /** Frequency ranges the entry covers [Hz], inclusive. */
  bandsHz: { lowHz: number; highHz: number }[]
  status: BandLimitStatus
  /** What exactly is verified and what is not. */
  statusNote: string
  /** Conditions that go with the limit (duty cycle, TPC, indoor use…), for the reader. */
  conditions?: string
}

const MHZ = 1e6
const GHZ = 1e9
/** dBm from mW, for limits written in mW. */
const dbm = (powerMw: number): number => 10 * Math.log10(powerMw)

export const BAND_LIMITS: readonly BandLimitEntry[] = [
  {
    id: 'en300328-2g4-eirp',
    title: '2.4 GHz wideband data transmission: RF output power',
    bandsHz: [{ lowHz: 2400 * MHZ, highHz: 2483.5 * MHZ }],
    spec: { kind: 'eirp', eirpDbm: 20 },
    citation: 'ETSI EN 300 328 (V2.2.2), RF output power: 20 dBm (100 mW) e.i.r.p.',
    status: '[V-S]',
    statusNote: '20 dBm e.i.r.p. confirmed in a secondary summary of EN 300 328 V2.2.2.',
  },
  {
    id: 'en300328-2g4-psd',
    title: '2.4 GHz wideband data transmission: power spectral density (non-FHSS)',
    bandsHz: [{ lowHz: 2400 * MHZ, highHz: 2483.5 * MHZ }],
    spec: { kind: 'eirp-density', eirpDensityDbm: 10, referenceBandwidthHz: 1 * MHZ },
    citation: 'ETSI EN 300 328, clause 4.3.2.3 [M]: 10 dBm/MHz e.i.r.p. for non-FHSS equipment',
    status: '[M]',
    statusNote: 'Value and clause number recalled, not verified.',
  },
  {
    id: 'en301893-5g47-tpc',
    title: '5 GHz RLAN 5470–5725 MHz with TPC',
    bandsHz: [{ lowHz: 5470 * MHZ, highHz: 5725 * MHZ }],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'eirp', eirpDbm: 30 },
        { kind: 'eirp-density', eirpDensityDbm: 17, referenceBandwidthHz: 1 * MHZ },
      ],
    },
    citation: 'ETSI EN 301 893, 5470–5725 MHz: 30 dBm (1 W) mean e.i.r.p. and 17 dBm/MHz with TPC',
    status: '[V-S]',
    statusNote: 'Confirmed in a national general-authorisation text quoting these limits.',
    conditions: 'Transmit power control with at least 3 dB range.',
  },
  {
    id: 'en301893-5g47-no-tpc',
    title: '5 GHz RLAN 5470–5725 MHz without TPC',
    bandsHz: [{ lowHz: 5470 * MHZ, highHz: 5725 * MHZ }],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'eirp', eirpDbm: 27 },
        { kind: 'eirp-density', eirpDensityDbm: 14, referenceBandwidthHz: 1 * MHZ },
      ],
    },
    citation: 'ETSI EN 301 893, 5470–5725 MHz without TPC: both limits 3 dB lower (27 dBm, 14 dBm/MHz e.i.r.p.)',
    status: '[V-S]',
    statusNote: 'Confirmed in the same national general-authorisation text.',
  },
  {
    id: 'en301893-5g15-5g35-tpc',
    title: '5 GHz RLAN 5150–5350 MHz with TPC',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5350 * MHZ }],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'eirp', eirpDbm: 23 },
        { kind: 'eirp-density', eirpDensityDbm: 10, referenceBandwidthHz: 1 * MHZ },
      ],
    },
    citation: 'ETSI EN 301 893, Table 2 [M]: 5150–5350 MHz 23 dBm (200 mW) mean e.i.r.p., 10 dBm/MHz',
    status: '[M]',
    statusNote: 'Recalled, not verified; believed consistent with EC Decision 2005/513/EC as amended [M].',
    conditions: '5150–5250 MHz indoor use.',
  },
  {
    id: 'en301893-5g25-5g35-no-tpc',
    title: '5 GHz RLAN 5250–5350 MHz without TPC',
    bandsHz: [{ lowHz: 5250 * MHZ, highHz: 5350 * MHZ }],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'eirp', eirpDbm: 20 },
        { kind: 'eirp-density', eirpDensityDbm: 7, referenceBandwidthHz: 1 * MHZ },
      ],
    },
    citation: 'ETSI EN 301 893, Table 2 [M]: 5250–5350 MHz without TPC 20 dBm e.i.r.p., 7 dBm/MHz',
    status: '[M]',
    statusNote: 'Recalled, not verified.',
  },
  {
    id: 'cfr47-15-247-digital',
    title: 'Digital modulation, 902–928 / 2400–2483.5 / 5725–5850 MHz: conducted power with gain rule',
    bandsHz: [
      { lowHz: 902 * MHZ, highHz: 928 * MHZ },
      { lowHz: 2400 * MHZ, highHz: 2483.5 * MHZ },
      { lowHz: 5725 * MHZ, highHz: 5850 * MHZ },
    ],
    spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
    citation: '47 CFR §15.247(b)(3) 1 W conducted; §15.247(b)(4) reduced dB for dB of antenna gain above 6 dBi',
    status: '[V-S]',
    statusNote: 'Content confirmed in the 2000 CFR text and secondary summaries; current paragraph numbering (b)(3)/(b)(4) [M].',
  },
  {
    id: 'cfr47-15-247-2g4-ptp',
    title: '2.4 GHz fixed point-to-point: conducted power with 1 dB per 3 dB gain rule',
    bandsHz: [{ lowHz: 2400 * MHZ, highHz: 2483.5 * MHZ }],
    spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.onePerThreeAbove6DbiPointToPoint },
    citation: '47 CFR §15.247(c)(1)(i): fixed point-to-point, 1 dB reduction per 3 dB of gain above 6 dBi',
    status: '[V-S]',
    statusNote: 'Rule wording confirmed in a secondary source; paragraph numbering [M].',
    conditions: 'Fixed point-to-point operation only.',
  },
  {
    id: 'cfr47-15-247-5g8-ptp',
    title: '5.8 GHz fixed point-to-point: conducted power, no gain reduction',
    bandsHz: [{ lowHz: 5725 * MHZ, highHz: 5850 * MHZ }],
    spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.noReduction },
    citation: '47 CFR §15.247(c)(1)(ii): 5725–5850 MHz fixed point-to-point, no antenna-gain reduction',
    status: '[V-S]',
    statusNote: 'Confirmed in an equipment manual quoting the paragraph.',
    conditions: 'Fixed point-to-point operation only.',
  },
  {
    id: 'cfr47-15-247-psd',
    title: 'Digital modulation: conducted power spectral density',
    bandsHz: [
      { lowHz: 902 * MHZ, highHz: 928 * MHZ },
      { lowHz: 2400 * MHZ, highHz: 2483.5 * MHZ },
      { lowHz: 5725 * MHZ, highHz: 5850 * MHZ },
    ],
    spec: { kind: 'conducted-density', conductedDensityDbm: 8, referenceBandwidthHz: 3e3, gainRule: GAIN_RULES.noReduction },
    citation: '47 CFR §15.247(e) [M]: 8 dBm in any 3 kHz',
    status: '[M]',
    statusNote: 'Value recalled, not verified; whether a gain reduction applies to it is not verified either.',
  },
  {
    id: 'cfr47-15-407-unii1-ap-power',
    title: 'U-NII-1 outdoor access point: conducted power',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5250 * MHZ }],
    spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
    citation: '47 CFR §15.407(a)(1)(i): 1 W conducted with antenna gain up to 6 dBi',
    status: '[V-S]',
    statusNote: 'Confirmed in reprints of the 2015–2017 CFR text.',
  },
  {
    id: 'cfr47-15-407-unii1-ap-psd',
    title: 'U-NII-1 outdoor access point: conducted power spectral density',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5250 * MHZ }],
    spec: { kind: 'conducted-density', conductedDensityDbm: 17, referenceBandwidthHz: 1 * MHZ, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
    citation: '47 CFR §15.407(a)(1)(i): 17 dBm in any 1 MHz',
    status: '[M]',
    statusNote: '17 dBm/MHz confirmed [V-S]; that the gain reduction above 6 dBi also applies to the density is recalled [M].',
  },
  {
    id: 'cfr47-15-407-unii1-ap-elevation',
    title: 'U-NII-1 outdoor access point: EIRP above 30° elevation',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5250 * MHZ }],
    spec: { kind: 'eirp', eirpDbm: dbm(125) },
    citation: '47 CFR §15.407(a)(1)(i): e.i.r.p. at any elevation angle above 30° ≤ 125 mW (21 dBm)',
    status: '[V-S]',
    statusNote: 'Confirmed in reprints of the 2015–2017 CFR text.',
    conditions: 'Applies to the EIRP radiated more than 30° above the horizon.',
  },
  {
    id: 'cfr47-15-407-unii1-ptp',
    title: 'U-NII-1 fixed point-to-point: conducted power, gain rule above 23 dBi',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5250 * MHZ }],
    spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove23DbiPointToPoint },
    citation: '47 CFR §15.407(a)(1)(iii): fixed point-to-point up to 23 dBi without reduction, then 1 dB per dB',
    status: '[V-S]',
    statusNote: 'Confirmed in reprints of the 2015–2017 CFR text.',
    conditions: 'Fixed point-to-point operation only.',
  },
  {
    id: 'cfr47-15-407-unii1-client',
    title: 'U-NII-1 client device: conducted power',
    bandsHz: [{ lowHz: 5150 * MHZ, highHz: 5250 * MHZ }],
    spec: { kind: 'conducted', conductedPowerDbm: dbm(250), gainRule: GAIN_RULES.dbForDbAbove6Dbi },
    citation: '47 CFR §15.407(a)(1)(iv): client devices 250 mW conducted',
    status: '[M]',
    statusNote: '250 mW confirmed [V-S]; the dB-for-dB gain reduction above 6 dBi for clients is recalled [M].',
  },
  {
    id: 'cfr47-15-407-unii2',
    title: 'U-NII-2A / U-NII-2C: conducted power',
    bandsHz: [
      { lowHz: 5250 * MHZ, highHz: 5350 * MHZ },
      { lowHz: 5470 * MHZ, highHz: 5725 * MHZ },
    ],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'conducted', conductedPowerDbm: dbm(250), gainRule: GAIN_RULES.dbForDbAbove6Dbi },
        { kind: 'conducted-density', conductedDensityDbm: 11, referenceBandwidthHz: 1 * MHZ, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
      ],
    },
    citation: '47 CFR §15.407(a)(2): 250 mW or 11 dBm + 10 log B conducted (B = emission bandwidth in MHz), 11 dBm/MHz',
    status: '[M]',
    statusNote: '"250 mW or 11 dBm + 10 log B" confirmed [V-S]; "whichever is less" and the gain reduction above 6 dBi are recalled [M].',
  },
  {
    id: 'cfr47-15-407-unii3',
    title: 'U-NII-3: conducted power',
    bandsHz: [{ lowHz: 5725 * MHZ, highHz: 5850 * MHZ }],
    spec: {
      kind: 'lesser-of',
      limits: [
        { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
        { kind: 'conducted-density', conductedDensityDbm: 30, referenceBandwidthHz: 500e3, gainRule: GAIN_RULES.dbForDbAbove6Dbi },
      ],
    },
    citation: '47 CFR §15.407(a)(3): 1 W conducted; 30 dBm in any 500 kHz',
    status: '[M]',
    statusNote: '1 W confirmed [V-S]; the 30 dBm/500 kHz density, the gain reduction above 6 dBi and the point-to-point exemption are recalled [M].',
  },
  {
    id: 'cfr47-15-255-average',
    title: '57–71 GHz: average EIRP',
    bandsHz: [{ lowHz: 57 * GHZ, highHz: 71 * GHZ }],
    spec: { kind: 'eirp', eirpDbm: 40 },
    citation: '47 CFR §15.255(c): average e.i.r.p. 40 dBm',
    status: '[M]',
    statusNote: 'Recalled, not verified in §15.255; band extent 57–71 GHz also [M].',
  },
  {
    id: 'cfr47-15-255-peak',
    title: '57–71 GHz: peak EIRP',
    bandsHz: [{ lowHz: 57 * GHZ, highHz: 71 * GHZ }],
    spec: { kind: 'eirp', eirpDbm: 43 },
    citation: '47 CFR §15.255(c): peak e.i.r.p. 43 dBm',
    status: '[M]',
    statusNote: 'Recalled, not verified in §15.255.',
  },
  {
    id: 'cfr47-15-255-ptp-average',
    title: '57–71 GHz outdoor fixed point-to-point: average EIRP with gain rule',
    bandsHz: [{ lowHz: 57 * GHZ, highHz: 71 * GHZ }],
    spec: { kind: 'eirp', eirpDbm: 82, gainRule: GAIN_RULES.twoPerDbBelow51Dbi },
    citation: '47 CFR §15.255(c): outdoor fixed point-to-point average e.i.r.p. 82 dBm, reduced 2 dB per dB of gain below 51 dBi',
    status: '[M]',
    statusNote: 'Recalled for §15.255; the identical wording in §15.258(b)(1)–(2) (116–246 GHz) was confirmed [V-S].',
    conditions: 'Outdoor fixed point-to-point operation only.',
  },
  {
    id: 'cfr47-15-255-ptp-peak',
    title: '57–71 GHz outdoor fixed point-to-point: peak EIRP with gain rule',
    bandsHz: [{ lowHz: 57 * GHZ, highHz: 71 * GHZ }],
    spec: { kind: 'eirp', eirpDbm: 85, gainRule: GAIN_RULES.twoPerDbBelow51Dbi },
    citation: '47 CFR §15.255(c): outdoor fixed point-to-point peak e.i.r.p. 85 dBm, reduced 2 dB per dB of gain below 51 dBi',
    status: '[M]',
    statusNote: 'Recalled for §15.255; same wording confirmed in §15.258(b) [V-S].',
    conditions: 'Outdoor fixed point-to-point operation only.',
  },
  {
    id: 'erc-rec-70-03-a1-868-0',
    title: 'Non-specific short-range devices 868.000–868.600 MHz',
    bandsHz: [{ lowHz: 868.0 * MHZ, highHz: 868.6 * MHZ }],
    spec: { kind: 'erp', erpDbm: dbm(25) },
    citation: 'ERC/REC 70-03 Annex 1: 868.000–868.600 MHz, 25 mW e.r.p., ≤ 1 % duty cycle or equivalent mitigation',
    status: '[V-S]',
    statusNote: 'Confirmed in a national frequency table citing ERC/REC 70-03 Annexes 1 and 7 and EC Decision 2006/771/EC as amended; band-letter labels [M].',
    conditions: 'Duty cycle ≤ 1 % (or equivalent mitigation).',
  },
  {
    id: 'erc-rec-70-03-a7-868-6',
    title: 'Alarms 868.600–868.700 MHz',
    bandsHz: [{ lowHz: 868.6 * MHZ, highHz: 868.7 * MHZ }],
    spec: { kind: 'erp', erpDbm: dbm(10) },
    citation: 'ERC/REC 70-03 Annex 7: 868.600–868.700 MHz alarms, 10 mW e.r.p., ≤ 1 % duty cycle',
    status: '[V-S]',
    statusNote: 'Confirmed on the CEPT alarms annex page.',
    conditions: 'Duty cycle ≤ 1 %.',
  },
  {
    id: 'erc-rec-70-03-a1-868-7',
    title: 'Non-specific short-range devices 868.700–869.200 MHz',
    bandsHz: [{ lowHz: 868.7 * MHZ, highHz: 869.2 * MHZ }],
    spec: { kind: 'erp', erpDbm: dbm(25) },
    citation: 'ERC/REC 70-03 Annex 1: 868.700–869.200 MHz, 25 mW e.r.p., ≤ 0.1 % duty cycle',
    status: '[V-S]',
    statusNote: 'Confirmed in the same national frequency table.',
    conditions: 'Duty cycle ≤ 0.1 %.',
  },
  {
    id: 'erc-rec-70-03-a1-869-4',
    title: 'Non-specific short-range devices 869.400–869.650 MHz',
    bandsHz: [{ lowHz: 869.4 * MHZ, highHz: 869.65 * MHZ }],
    spec: { kind: 'erp', erpDbm: dbm(500) },
    citation: 'ERC/REC 70-03 Annex 1: 869.400–869.650 MHz, 500 mW e.r.p., ≤ 10 % duty cycle',
    status: '[V-S]',
    statusNote: 'Confirmed in the same national frequency table.',
    conditions: 'Duty cycle ≤ 10 %.',
  },
]

/** Entries whose bands contain freqHz (inclusive edges). */
export function findBandLimits(opts: { freqHz: number; entries?: readonly BandLimitEntry[] }): BandLimitEntry[] {
  const freqHz = opts?.freqHz
  const entries = opts?.entries ?? BAND_LIMITS
  if (typeof freqHz !== 'number' || !Number.isFinite(freqHz) || freqHz <= 0) {
    throw new RangeError(`freqHz must be a finite number greater than zero (got ${String(freqHz)}).`)
  }
  return entries.filter((e) => e.bandsHz.some((b) => freqHz >= b.lowHz && freqHz <= b.highHz))
}
