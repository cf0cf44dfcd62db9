export * from './geodesic'
export * from './nearest-office'
export * from './local-tangent-plane'
