export * from './offices'
export * from './users'
export * from './sessions'
export * from './cases'
