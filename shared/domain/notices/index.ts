export * from './planned-notices'
export * from './tracking'
