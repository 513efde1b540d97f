export { demoSignIns, loadDemoIfEmpty, type DemoLoaded } from './seed'
