export { summarizeVehicles, type SummarizedVehicle, type YardForCharges } from './charges.service'
export { summarizeVehicle, type SummaryInput } from './vehicle-summary'
export { vehicleBill, type VehicleBill } from './vehicle-bill'
export { clocksOfVehicles, ruleSetsOf, type VehicleClocks } from './charges.service'
