export * from './permissions'
export * from './roles'
