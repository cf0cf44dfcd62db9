/**
 * Builds a PropagationModel from its serializable spec, and describes every model for a UI.
 *
 * Each model keeps a stable MethodRef id (stored with results, never renamed). The slope
 * dL/d(log10 d) is analytic where the loss is a power law (free space 20, log-distance 10·n,
 * two-ray asymptote 40, two-ray breakpoint 20/40, Hata B) and a central difference in log d otherwise.
 * Sources: see each model's file.
 */
import type { MethodRef, ValidityRange } from '../types'
import {
  absorbingDistanceM,
  absorbingLossDb,
  absorbingMethod,
  absorbingSlopeDbPerDecade,
  resolveAbsorptionDbPerKm,
} from './absorption'
import { FREE_SPACE_METHOD, FREE_SPACE_ROUNDED_METHOD, FREE_SPACE_VALIDITY, freeSpaceDistanceM, freeSpaceLossDb } from './free-space-p525'
import {
  COST231_HATA_METHOD,
  COST231_HATA_VALIDITY,
  HATA_METHOD,
  HATA_VALIDITY,
  cost231HataDistanceM,
  cost231HataLossDb,
  cost231HataSlopeDbPerDecade,
  hataDistanceM,
  hataLossDb,
  hataSlopeDbPerDecade,
} from './hata'
import { LOG_DISTANCE_METHOD, logDistanceDistanceM, logDistanceLossDb, logDistanceSlopeDbPerDecade } from './log-distance'
import type { PathDistanceResult, PathLossResult, PropagationModel, PropagationModelKind, PropagationModelSpec } from './model'
import { centralSlopeDbPerDecade } from './numeric'
import { TR38901_METHOD, TR38901_VALIDITY, tr38901DistanceM, tr38901LossDb } from './tr38901'
import {
  TWO_RAY_ASYMPTOTE_METHOD,
  TWO_RAY_BREAKPOINT_METHOD,
  TWO_RAY_EXACT_METHOD,
  twoRayBreakpointSlopeDbPerDecade,
  twoRayDistanceM,
  twoRayLossDb,
} from './two-ray'

type Spec<K extends PropagationModelKind> = Extract<PropagationModelSpec, { kind: K }>

interface Parts {
  method: MethodRef
  lossDb(distanceM: number): PathLossResult
  distanceM(lossDb: number): PathDistanceResult
  /** Analytic slope when there is one; otherwise the central difference is used. */
  slopeDbPerDecade?(distanceM: number): number
}

function assemble(spec: PropagationModelSpec, parts: Parts): PropagationModel {
  // Evaluate once so that a bad spec fails where it is built, not at first use.
  parts.lossDb(1000)
  return {
    spec,
    method: parts.method,
    lossDb: parts.lossDb,
    distanceM: parts.distanceM,
    slopeDbPerDecade: (distanceM) =>
      parts.slopeDbPerDecade ? parts.slopeDbPerDecade(distanceM) : centralSlopeDbPerDecade((d) => parts.lossDb(d).value.lossDb, distanceM),
  }
}

function freeSpace(spec: Spec<'free-space'>): Parts {
  return {
    method: spec.form === 'p525-rounded' ? FREE_SPACE_ROUNDED_METHOD : FREE_SPACE_METHOD,
    lossDb: (distanceM) => freeSpaceLossDb({ freqHz: spec.freqHz, distanceM, form: spec.form }),
    distanceM: (lossDb) => freeSpaceDistanceM({ freqHz: spec.freqHz, lossDb, form: spec.form }),
    slopeDbPerDecade: () => 20,
  }
}

function logDistance(spec: Spec<'log-distance'>): Parts {
  return {
    method: LOG_DISTANCE_METHOD,
    lossDb: (distanceM) => logDistanceLossDb({ ...spec, distanceM }),
    distanceM: (lossDb) => logDistanceDistanceM({ ...spec, lossDb }),
    slopeDbPerDecade: (distanceM) => logDistanceSlopeDbPerDecade({ ...spec, distanceM }),
  }
}

function twoRay(spec: Spec<'two-ray'>): Parts {
  const common = {
    lossDb: (distanceM: number) => twoRayLossDb({ ...spec, distanceM }),
    distanceM: (lossDb: number) => twoRayDistanceM({ ...spec, lossDb }),
  }
  if (spec.form === 'asymptote') return { ...common, method: TWO_RAY_ASYMPTOTE_METHOD, slopeDbPerDecade: () => 40 }
  if (spec.form === 'breakpoint') {
    return { ...common, method: TWO_RAY_BREAKPOINT_METHOD, slopeDbPerDecade: (distanceM) => twoRayBreakpointSlopeDbPerDecade({ ...spec, distanceM }) }
  }
  return { ...common, method: TWO_RAY_EXACT_METHOD }
}

function absorbing(spec: Spec<'absorbing'>): Parts {
  const base = createPropagationModel(spec.base)
  const { absorptionDbPerKm, warnings } = resolveAbsorptionDbPerKm(spec)
  const withNote = <T extends { warnings: string[] }>(r: T): T => ({ ...r, warnings: [...r.warnings, ...warnings] })
  return {
    method: absorbingMethod({ base: base.method }),
    lossDb: (distanceM) => withNote(absorbingLossDb({ base, absorptionDbPerKm, distanceM })),
    distanceM: (lossDb) => withNote(absorbingDistanceM({ base, absorptionDbPerKm, lossDb })),
    slopeDbPerDecade: (distanceM) => absorbingSlopeDbPerDecade({ base, absorptionDbPerKm, distanceM }),
  }
}

function hata(spec: Spec<'hata'>): Parts {
  return {
    method: HATA_METHOD,
    lossDb: (distanceM) => hataLossDb({ ...spec, distanceM }),
    distanceM: (lossDb) => hataDistanceM({ ...spec, lossDb }),
    slopeDbPerDecade: () => hataSlopeDbPerDecade(spec),
  }
}

function cost231(spec: Spec<'cost231-hata'>): Parts {
  return {
    method: COST231_HATA_METHOD,
    lossDb: (distanceM) => cost231HataLossDb({ ...spec, distanceM }),
    distanceM: (lossDb) => cost231HataDistanceM({ ...spec, lossDb }),
    slopeDbPerDecade: () => cost231HataSlopeDbPerDecade(spec),
  }
}

function tr38901(spec: Spec<'tr38901'>): Parts {
  return {
    method: TR38901_METHOD,
    lossDb: (distanceM) => tr38901LossDb({ ...spec, distanceM }),
    distanceM: (lossDb) => tr38901DistanceM({ ...spec, lossDb }),
  }
}

/** Builds the model a spec describes. Throws a RangeError for impossible parameters. */
export function createPropagationModel(spec: PropagationModelSpec): PropagationModel {
  switch (spec.kind) {
    case 'free-space':
      return assemble(spec, freeSpace(spec))
    case 'log-distance':
      return assemble(spec, logDistance(spec))
    case 'two-ray':
      return assemble(spec, twoRay(spec))
    case 'absorbing':
      return assemble(spec, absorbing(spec))
    case 'hata':
      return assemble(spec, hata(spec))
    case 'cost231-hata':
      return assemble(spec, cost231(spec))
    case 'tr38901':
      return assemble(spec, tr38901(spec))
    default: {
      const unknown: never = spec
      throw new RangeError(`Unknown propagation model kind: ${JSON.stringify((unknown as { kind?: unknown }).kind)}.`)
    }
  }
}

// ── Descriptors for a UI ─────────────────────────────────────────────────────

export interface ModelParameterDescriptor {
  /** Key in the spec. */
  key: string
  label: string
  unit?: string
  required: boolean
  defaultValue?: number | string
  choices?: { value: string; label: string }[]
  help?: string
}

export interface PropagationModelDescriptor {
  kind: PropagationModelKind
  /** Method ids this kind can produce (stable, stored with results). */
  methodIds: string[]
  label: string
  /** One or two plain sentences for a field engineer: when to use it. */
  summary: string
  parameters: ModelParameterDescriptor[]
  validity: ValidityRange[]
  /** Validity that depends on a choice (e.g. TR 38.901 scenario/condition), keyed "scenario/condition". */
  validityByVariant?: Record<string, ValidityRange[]>
  /** Limits that depend on the other parameters, in words. */
  validityNote?: string
  source: string
}

const BASE_METHOD_IDS = [
  FREE_SPACE_METHOD.id,
  FREE_SPACE_ROUNDED_METHOD.id,
  LOG_DISTANCE_METHOD.id,
  TWO_RAY_EXACT_METHOD.id,
  TWO_RAY_ASYMPTOTE_METHOD.id,
  TWO_RAY_BREAKPOINT_METHOD.id,
  HATA_METHOD.id,
  COST231_HATA_METHOD.id,
  TR38901_METHOD.id,
]

const FREQ: ModelParameterDescriptor = { key: 'freqHz', label: 'Frequency', unit: 'Hz', required: true }
/** Antenna heights have one key pair in every model: txHeightM (base station) and rxHeightM (mobile, terminal). */
const BASE_HEIGHT: ModelParameterDescriptor = { key: 'txHeightM', label: 'Base station (transmitter) antenna height', unit: 'm', required: true }
const MOBILE_HEIGHT: ModelParameterDescriptor = { key: 'rxHeightM', label: 'Mobile (receiver) antenna height', unit: 'm', required: true, defaultValue: 1.5 }

export const PROPAGATION_MODEL_DESCRIPTORS: readonly PropagationModelDescriptor[] = [
  {
    kind: 'free-space',
    methodIds: [FREE_SPACE_METHOD.id, FREE_SPACE_ROUNDED_METHOD.id],
    label: 'Free space',
    summary: 'Clear line of sight with no ground reflection or obstacles. The lowest loss possible; a floor for any path.',
    parameters: [
      FREQ,
      {
        key: 'form',
        label: 'Formula',
        required: false,
        defaultValue: 'exact',
        choices: [
          { value: 'exact', label: 'Exact, 20·log10(4πdf/c)' },
          { value: 'p525-rounded', label: 'ITU-R P.525 rounded constant 32.4 (0.05 dB lower)' },
        ],
      },
    ],
    validity: FREE_SPACE_VALIDITY,
    source: FREE_SPACE_METHOD.source,
  },
  {
    kind: 'log-distance',
    methodIds: [LOG_DISTANCE_METHOD.id],
    label: 'Log-distance with exponent and exponent changes',
    summary:
      'Loss grows by 10·n dB per decade of distance from a reference distance. Use fitted exponents, e.g. about 2 in the open, 3–5 in built-up areas; add exponent changes where the exponent changes.',
    parameters: [
      { ...FREQ, required: false, help: 'Needed only when the loss at d0 is empty (free space at d0).' },
      { key: 'refDistanceM', label: 'Reference distance d0', unit: 'm', required: true, defaultValue: 1 },
      { key: 'refLossDb', label: 'Loss at d0 (free space if empty)', unit: 'dB', required: false },
      { key: 'exponent', label: 'Path-loss exponent n from d0', required: true, defaultValue: 2 },
      {
        key: 'exponentChanges',
        label: 'Exponent changes (from distance, exponent n)',
        required: false,
        help: 'Each applies from its distance on, beyond d0 and in increasing order.',
      },
      { key: 'shadowSigmaDb', label: 'Shadow-fading standard deviation', unit: 'dB', required: false },
    ],
    validity: [],
    validityNote: 'Distances at or beyond d0; below d0 the first exponent is extrapolated with a warning.',
    source: LOG_DISTANCE_METHOD.source,
  },
  {
    kind: 'two-ray',
    methodIds: [TWO_RAY_EXACT_METHOD.id, TWO_RAY_ASYMPTOTE_METHOD.id, TWO_RAY_BREAKPOINT_METHOD.id],
    label: 'Two-ray flat ground',
    summary:
      'Direct path plus one reflection from flat ground, for open sites (water, airfields, flat farmland). Close in, the loss swings up and down; far out it grows 40 dB per decade.',
    parameters: [
      FREQ,
      { key: 'txHeightM', label: 'Transmitter antenna height above ground', unit: 'm', required: true },
      { key: 'rxHeightM', label: 'Receiver antenna height above ground', unit: 'm', required: true },
      {
        key: 'form',
        label: 'Formula',
        required: false,
        defaultValue: 'exact',
        choices: [
          { value: 'exact', label: 'Exact two-ray (reflection coefficient −1)' },
          { value: 'asymptote', label: 'Far-distance approximation 40·log d − 20·log(h_t·h_r)' },
          { value: 'breakpoint', label: 'Free space up to the breakpoint (crossover 4π·h_t·h_r/λ), then the far-distance approximation' },
        ],
      },
    ],
    validity: [],
    validityNote:
      'Flat ground, antennas well above it. The far-distance approximation holds only beyond d_x = 4π·h_t·h_r/λ (the breakpoint form uses free space before it); the exact form swings up and down inside d_c = 4·h_t·h_r/λ.',
    source: `${TWO_RAY_EXACT_METHOD.source}; ${TWO_RAY_ASYMPTOTE_METHOD.source}; ${TWO_RAY_BREAKPOINT_METHOD.source}`,
  },
  {
    kind: 'absorbing',
    methodIds: BASE_METHOD_IDS.map((id) => absorbingMethod({ base: { id, source: '' } }).id),
    label: 'Any model plus absorption',
    summary:
      'Adds a loss proportional to distance, e.g. oxygen absorption near 60 GHz (about 15 dB/km at sea level per ITU-R P.676). Give dB/km, or a field attenuation coefficient.',
    parameters: [
      { key: 'base', label: 'Underlying model', required: true },
      { key: 'absorptionDbPerKm', label: 'Specific attenuation', unit: 'dB/km', required: false },
      { key: 'fieldAttenuationPerKm', label: 'Field attenuation coefficient α (e^(−αr))', unit: '1/km', required: false, help: 'Give this or dB/km, not both.' },
    ],
    validity: [],
    validityNote: 'Those of the underlying model.',
    source: 'Specific attenuation × distance; ITU-R P.676-13 Annex 1 for atmospheric gases',
  },
  {
    kind: 'hata',
    methodIds: [HATA_METHOD.id],
    label: 'Okumura–Hata (urban, suburban, open)',
    summary: 'Empirical median loss for a mast above rooftops to a street-level mobile, 150–1500 MHz, 1–20 km.',
    parameters: [
      FREQ,
      BASE_HEIGHT,
      MOBILE_HEIGHT,
      {
        key: 'environment',
        label: 'Area',
        required: true,
        choices: [
          { value: 'urban-small-medium', label: 'Urban, small or medium city' },
          { value: 'urban-large', label: 'Urban, large city' },
          { value: 'suburban', label: 'Suburban' },
          { value: 'open', label: 'Open (rural)' },
        ],
      },
    ],
    validity: HATA_VALIDITY,
    source: HATA_METHOD.source,
  },
  {
    kind: 'cost231-hata',
    methodIds: [COST231_HATA_METHOD.id],
    label: 'COST-231 Hata (1500–2000 MHz)',
    summary: 'Extension of Hata to 1500–2000 MHz for macrocells with the mast above rooftops, 1–20 km.',
    parameters: [
      FREQ,
      BASE_HEIGHT,
      MOBILE_HEIGHT,
      {
        key: 'environment',
        label: 'Area',
        required: false,
        choices: [
          { value: 'medium-city', label: 'Medium city or suburban (C_m = 0 dB)' },
          { value: 'metropolitan', label: 'Metropolitan centre (C_m = 3 dB)' },
        ],
        help: 'Give the area or the city correction C_m, not both.',
      },
      { key: 'cityCorrectionDb', label: 'City correction C_m', unit: 'dB', required: false, help: 'Give this or the area, not both.' },
    ],
    validity: COST231_HATA_VALIDITY,
    source: COST231_HATA_METHOD.source,
  },
  {
    kind: 'tr38901',
    methodIds: [TR38901_METHOD.id],
    label: '3GPP TR 38.901 (rural, urban, street, indoor office)',
    summary:
      'Mobile-network models from 0.5 GHz up: rural macro, urban macro, urban street canyon and indoor office, with line of sight or not. Gives the shadow-fading spread too.',
    parameters: [
      FREQ,
      {
        key: 'scenario',
        label: 'Scenario',
        required: true,
        choices: [
          { value: 'RMa', label: 'Rural macro (RMa)' },
          { value: 'UMa', label: 'Urban macro (UMa)' },
          { value: 'UMi-street-canyon', label: 'Urban micro, street canyon (UMi)' },
          { value: 'InH-office', label: 'Indoor office (InH)' },
        ],
      },
      {
        key: 'condition',
        label: 'Line of sight',
        required: true,
        choices: [
          { value: 'LOS', label: 'Line of sight' },
          { value: 'NLOS', label: 'No line of sight' },
        ],
      },
      BASE_HEIGHT,
      { ...MOBILE_HEIGHT, label: 'User terminal (receiver) antenna height' },
      { key: 'buildingHeightM', label: 'Average building height (RMa)', unit: 'm', required: false, defaultValue: 5 },
      { key: 'streetWidthM', label: 'Average street width (RMa)', unit: 'm', required: false, defaultValue: 20 },
    ],
    validity: [],
    validityByVariant: Object.fromEntries(
      Object.entries(TR38901_VALIDITY).flatMap(([scenario, byCondition]) =>
        Object.entries(byCondition).map(([condition, ranges]) => [`${scenario}/${condition}`, ranges]),
      ),
    ),
    source: TR38901_METHOD.source,
  },
]
