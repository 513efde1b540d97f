export * from './planned-notices'
export * from './tracking'
export * from './publication'
