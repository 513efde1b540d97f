export * from './planned-notices'
