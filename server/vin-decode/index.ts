export { vinDecodeRouter } from './vin-decode.routes'
export { decodeVin, parseGvwrClass } from './vin-decode.service'
export { vpicDatabaseFile } from './vpic-database'
