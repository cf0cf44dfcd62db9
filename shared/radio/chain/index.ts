/** Measurement chain: analyser reading → field strength, pfd and received power; EIRP/ERP helpers. */
export * from './antenna'
export * from './antenna-factor-table'
export * from './received-power'
export * from './far-field'
export * from './measurement-chain'
export * from './channel-power'
export * from './eirp'
