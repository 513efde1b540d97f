export { summarizeVehicles, type SummarizedVehicle, type YardForCharges } from './charges.service'
export { summarizeVehicle, type SummaryInput } from './vehicle-summary'
export { ruleSetsOf } from './charges.service'
