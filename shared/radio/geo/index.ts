/** Geodesy on WGS84: distance and bearing, the nearest office, and a local tangent plane for the locator. */
export * from './geodesic'
export * from './nearest-office'
export * from './local-tangent-plane'
