/** Coexistence and noise: kTB noise floor, interference link budget, I/N criteria, separation. */
export * from './thermal-noise'
export * from './protection-criteria'
export * from './interference'
export * from './assess-coexistence'
