export * from './vin'
export * from './vin-model-year'
export * from './odometer'
export * from './stock-number'
