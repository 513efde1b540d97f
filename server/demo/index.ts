export { loadDemoIfEmpty } from './seed'
