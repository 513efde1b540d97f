export { addClockEvent, clockEventsOf, type NewClockEvent } from './clock-events.queries'
export { clocksOfVehicles, vehicleClocks, type ClockedVehicle, type WorkedClocks } from './vehicle-clocks'
