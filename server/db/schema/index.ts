export * from './offices'
export * from './users'
export * from './sessions'
