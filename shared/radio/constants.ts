/** Physical constants. Exact SI values unless stated. */

/** Speed of light in vacuum [m/s], exact (SI). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458
/** Boltzmann constant [J/K], exact (SI 2019). */
export const BOLTZMANN_J_PER_K = 1.380649e-23
/** Standard noise reference temperature T0 [K] (common practice; ITU-R P.372 refers noise to kT0B). */
export const REFERENCE_TEMPERATURE_K = 290
/**
 * Impedance of free space used for field ↔ power-density conversions [Ω].
 * 120π, the approximation behind ITU-R P.525's √(30p); CODATA 376.730 Ω differs by 0.003 dB.
 */
export const FREE_SPACE_IMPEDANCE_OHM = 120 * Math.PI
/** Gain of a lossless half-wave dipole over isotropic [dB]: 10·log10(1.64) (ITU RR No. 1.162; BS.561). */
export const DIPOLE_GAIN_DBI = 2.15
/** Reference impedance of measuring receivers [Ω] (common practice, no source). */
export const RECEIVER_IMPEDANCE_OHM = 50
