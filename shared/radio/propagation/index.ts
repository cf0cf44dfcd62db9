/** Propagation models: public API of shared/radio/propagation. */
export type {
  PathDistanceResult,
  PathDistanceValue,
  PathLossResult,
  PathLossValue,
  PropagationModel,
  PropagationModelKind,
  PropagationModelSpec,
} from './model'
export * from './free-space-p525'
export * from './log-distance'
export * from './two-ray'
export * from './absorption'
export * from './gaseous-p676'
export * from './hata'
export * from './tr38901'
export {
  createPropagationModel,
  PROPAGATION_MODEL_DESCRIPTORS,
  type ModelParameterDescriptor,
  type PropagationModelDescriptor,
} from './registry'
