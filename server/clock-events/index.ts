export { addClockEvent, clockEventsOf, type NewClockEvent } from './clock-events.queries'
export { ruleSetOf, vehicleClocks, type ClockedVehicle } from './vehicle-clocks'
